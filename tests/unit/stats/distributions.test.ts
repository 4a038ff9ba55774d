/**
 * Distribution functions against REFERENCES.md values and scipy.stats fixtures made by
 * tests/reference/generate_stats_fixtures.py [lib] (SciPy version recorded in the fixture).
 */
import { describe, expect, it } from "vitest";
import fx from "../../reference/fixtures/stats-distributions.json";
import { chiSquareCdf, chiSquareQuantile, fCdf, fQuantile, normalCdf, normalQuantile } from "@/lib/stats/distributions";

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

describe("distribution quantiles: REFERENCES.md check values", () => {
  it("χ² quantiles equal scipy.stats.chi2.ppf to the 4 decimals quoted", () => {
    // [lib] REFERENCES.md: chi2.ppf(0.9973, 4) = 16.2512; chi2.ppf(0.99, 2) = 9.2103
    expect(chiSquareQuantile(0.9973, 4)).toBeCloseTo(16.2512, 4);
    expect(chiSquareQuantile(0.99, 2)).toBeCloseTo(9.2103, 4);
  });
  it("F quantiles equal scipy.stats.f.ppf to the 4 decimals quoted", () => {
    // [lib] REFERENCES.md: f.ppf(0.95, 2, 10) = 4.1028; f.ppf(0.99, 4, 30) = 4.0179
    expect(fQuantile(0.95, 2, 10)).toBeCloseTo(4.1028, 4);
    expect(fQuantile(0.99, 4, 30)).toBeCloseTo(4.0179, 4);
  });
});

describe(`distribution functions vs scipy.stats (SciPy ${fx.versions.scipy})`, () => {
  // Tolerances: jStat's incomplete beta/gamma converge to ~1e-9 relative (continued
  // fractions stopped at 3e-7 on the last correction), so quantiles are held to 1e-7.
  it("chiSquareQuantile matches chi2.ppf to 1e-7 relative", () => {
    for (const [p, k, q] of fx.chi2Ppf) expect(rel(chiSquareQuantile(p, k), q), `p=${p} df=${k}`).toBeLessThan(1e-7);
  });
  it("chiSquareCdf matches chi2.cdf to 1e-8 absolute", () => {
    for (const [x, k, c] of fx.chi2Cdf) expect(Math.abs(chiSquareCdf(x, k) - c), `x=${x} df=${k}`).toBeLessThan(1e-8);
  });
  it("fQuantile matches f.ppf to 1e-7 relative", () => {
    for (const [p, a, b, q] of fx.fPpf) expect(rel(fQuantile(p, a, b), q), `p=${p} d=(${a},${b})`).toBeLessThan(1e-7);
  });
  it("fCdf matches f.cdf to 1e-8 absolute", () => {
    for (const [x, a, b, c] of fx.fCdf) expect(Math.abs(fCdf(x, a, b) - c), `x=${x} d=(${a},${b})`).toBeLessThan(1e-8);
  });
  it("normalQuantile matches norm.ppf to 1e-8 relative and inverts normalCdf", () => {
    for (const [p, z] of fx.normPpf) {
      expect(Math.abs(normalQuantile(p) - z), `p=${p}`).toBeLessThan(1e-8 * Math.max(1, Math.abs(z)));
      if (p > 1e-6 && p < 1 - 1e-6) expect(Math.abs(normalCdf(normalQuantile(p)) - p)).toBeLessThan(1e-14);
    }
  });
});

describe("distribution functions: validation gate", () => {
  it("rejects probabilities outside (0, 1) and non-positive degrees of freedom", () => {
    expect(() => chiSquareQuantile(1, 3)).toThrow(RangeError);
    expect(() => fQuantile(0.5, 0, 3)).toThrow(RangeError);
    expect(() => normalQuantile(Number.NaN)).toThrow(TypeError);
    expect(() => fCdf(1, 2, -1)).toThrow(RangeError);
  });
});
