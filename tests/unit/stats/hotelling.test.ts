/**
 * Hotelling T² for individual observations: Phase II limits against REFERENCES.md
 * (Montgomery ch. 11; NIST/SEMATECH §6.5.4.3) and SciPy-computed fixtures.
 */
import { describe, expect, it } from "vitest";
import fx from "../../reference/fixtures/stats-distributions.json";
import { fitHotellingPhaseI, hotellingMinimalShift, hotellingT2, hotellingUcl } from "@/lib/stats/hotelling";
import { chiSquareQuantile } from "@/lib/stats/distributions";
import { createRng } from "@/lib/simulate/rng";

describe("hotellingUcl", () => {
  it("equals the REFERENCES.md examples at α = 0.0027", () => {
    // [pub] Montgomery ch. 11 / NIST §6.5.4.3 formula, values from REFERENCES.md
    expect(hotellingUcl(2, 50, 0.0027)).toBeCloseTo(13.967, 3);
    expect(hotellingUcl(4, 100, 0.0027)).toBeCloseTo(18.241, 3);
    expect(hotellingUcl(4, 500, 0.0027)).toBeCloseTo(16.62, 3);
  });
  it(`equals the same formula evaluated with scipy.stats.f.ppf (SciPy ${fx.versions.scipy})`, () => {
    for (const [p, m, a, ucl] of fx.hotellingUcl) expect(Math.abs(hotellingUcl(p, m, a) / ucl - 1), `p=${p} m=${m}`).toBeLessThan(1e-7);
  });
  it("tends to the χ² quantile for large m", () => {
    // [pub] REFERENCES.md: large m → χ²_{1−α,p}; the factor is 1 + O(p/m)
    const chi = chiSquareQuantile(1 - 0.0027, 4);
    expect(Math.abs(hotellingUcl(4, 200000, 0.0027) / chi - 1)).toBeLessThan(1e-3);
  });
  it("rejects m ≤ p and α outside (0, 1)", () => {
    expect(() => hotellingUcl(4, 4, 0.01)).toThrow(RangeError);
    expect(() => hotellingUcl(2, 50, 1)).toThrow(RangeError);
    expect(() => hotellingUcl(2.5, 50, 0.01)).toThrow(TypeError);
  });
});

describe("fitHotellingPhaseI / hotellingT2", () => {
  it("reduces to ((x − x̄)/s)² for one variable", () => {
    // [analytic] p = 1: S = s², T² = (x − x̄)²/s²
    const xs = [1, 2, 4, 7, 11];
    const model = fitHotellingPhaseI(xs.map((v) => [v]));
    const mean = 5;
    const s2 = xs.reduce((a, v) => a + (v - mean) ** 2, 0) / 4;
    expect(hotellingT2(model, [9])).toBeCloseTo((9 - mean) ** 2 / s2, 12);
  });
  it("averages p over its own training vectors (identity Σ T²_i = (m−1)p)", () => {
    // [analytic] Σ_i (x_i − x̄)ᵀ S⁻¹ (x_i − x̄) = tr(S⁻¹ (m−1) S) = (m−1)p
    const rng = createRng(11);
    const rows = Array.from({ length: 40 }, () => {
      const a = rng.normal();
      return [a, 0.6 * a + rng.normal(), rng.normal() * 2];
    });
    const model = fitHotellingPhaseI(rows);
    const sum = rows.reduce((acc, r) => acc + hotellingT2(model, r), 0);
    expect(sum).toBeCloseTo(39 * 3, 8);
  });
  it("gives the minimal shift √(UCL·s²) for one variable and does not mutate inputs", () => {
    const rows = [[1], [3], [2], [5]];
    const copy = JSON.stringify(rows);
    const model = fitHotellingPhaseI(rows);
    expect(hotellingMinimalShift(model, 9)[0]).toBeCloseTo(3 * Math.sqrt(model.covariance[0]), 12);
    expect(JSON.stringify(rows)).toBe(copy);
  });
  it("rejects collinear variables, ragged rows and too few rows", () => {
    expect(() => fitHotellingPhaseI([[1, 2], [2, 4], [3, 6], [4, 8]])).toThrow(RangeError);
    expect(() => fitHotellingPhaseI([[1, 2], [2], [3, 6]])).toThrow(RangeError);
    expect(() => fitHotellingPhaseI([[1, 2], [2, 3]])).toThrow(RangeError);
    expect(() => fitHotellingPhaseI([[1, Number.NaN], [2, 3], [3, 1]])).toThrow(TypeError);
  });
});
