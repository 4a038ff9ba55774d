/**
 * EWMA chart: limits (Montgomery ch. 9) and the in-control ARL ≈ 500 of the (λ, L) table
 * (Lucas & Saccucci 1990, REFERENCES.md) reproduced by a seeded simulation.
 */
import { describe, expect, it } from "vitest";
import { EWMA_ARL500_DESIGNS, ewmaLimitWidthForArl500, ewmaMinimalShift, runEwmaChart } from "@/lib/stats/ewma";
import { createRng, type Rng } from "@/lib/simulate/rng";

function runLength(rng: Rng, lambda: number, L: number): number {
  // Chunked so a long in-control run is followed to its end, never censored.
  for (let len = 4000; ; len *= 10) {
    const x = Float64Array.from({ length: len }, () => rng.normal());
    const c = runEwmaChart(x, { lambda, L, mu0: 0, sigma: 1 });
    if (c.firstSignal >= 0) return c.firstSignal + 1;
  }
}

describe("runEwmaChart", () => {
  it("computes z_i and the time-varying limits of Montgomery ch. 9", () => {
    // [pub] z_1 = λx_1 + (1−λ)μ₀; half-width at i: Lσ√(λ/(2−λ)(1−(1−λ)^{2i}))
    const lambda = 0.2, L = 3, sigma = 2, mu0 = 10;
    const c = runEwmaChart([12, 8, 11], { lambda, L, mu0, sigma });
    expect(c.z[0]).toBeCloseTo(0.2 * 12 + 0.8 * 10, 12);
    expect(c.z[1]).toBeCloseTo(0.2 * 8 + 0.8 * c.z[0], 12);
    for (let i = 1; i <= 3; i++) {
      const hw = L * sigma * Math.sqrt((lambda / (2 - lambda)) * (1 - (1 - lambda) ** (2 * i)));
      expect(c.ucl[i - 1] - mu0).toBeCloseTo(hw, 12);
      expect(mu0 - c.lcl[i - 1]).toBeCloseTo(hw, 12);
    }
  });
  it("skips a missing point without advancing the limits", () => {
    const a = runEwmaChart([1, Number.NaN, 2], { lambda: 0.1, L: 2.814, mu0: 0, sigma: 1 });
    const b = runEwmaChart([1, 2], { lambda: 0.1, L: 2.814, mu0: 0, sigma: 1 });
    expect(a.z[2]).toBe(b.z[1]);
    expect(a.ucl[2]).toBe(b.ucl[1]);
    expect(a.z[1]).toBe(a.z[0]);
  });
  it("signals a 3σ step quickly and not before it", () => {
    const x = Array.from({ length: 60 }, (_, i) => (i < 30 ? 0 : 3));
    const c = runEwmaChart(x, { lambda: 0.1, L: 2.814, mu0: 0, sigma: 1 });
    expect(c.firstSignal).toBeGreaterThanOrEqual(30);
    expect(c.firstSignal).toBeLessThan(36);
  });
  it("rejects λ outside (0, 1], σ ≤ 0 and infinite points", () => {
    expect(() => runEwmaChart([1], { lambda: 0, L: 3, mu0: 0, sigma: 1 })).toThrow(RangeError);
    expect(() => runEwmaChart([1], { lambda: 0.1, L: 3, mu0: 0, sigma: 0 })).toThrow(RangeError);
    expect(() => runEwmaChart([Infinity], { lambda: 0.1, L: 3, mu0: 0, sigma: 1 })).toThrow(TypeError);
    expect(() => ewmaLimitWidthForArl500(0.3)).toThrow(RangeError);
  });
  it("states the minimal detectable shift as Lσ√(λ/(2−λ)) in Hz and % of nominal", () => {
    // [pub] asymptotic EWMA standard deviation, Montgomery ch. 9
    const s = ewmaMinimalShift({ lambda: 0.1, L: 2.814, sigma: 0.01 }, 2);
    expect(s.shiftHz).toBeCloseTo(2.814 * 0.01 * Math.sqrt(0.1 / 1.9), 12);
    expect(s.shiftPct).toBeCloseTo((100 * s.shiftHz) / 2, 12);
  });
});

describe("EWMA in-control ARL (seeded simulation)", () => {
  // [pub] Lucas & Saccucci 1990 via REFERENCES.md: ARL₀ ≈ 500 for each (λ, L) pair.
  // Run lengths are roughly geometric (sd ≈ mean), so 1500 runs give a standard error of
  // ≈ 500/√1500 ≈ 13 (2.6 %), well under the 10 % tolerance. The time-varying limits are
  // slightly narrower at start-up than the asymptotic ones of the table, which shortens
  // the ARL by a few %: the tolerance covers it.
  for (const { lambda, L } of EWMA_ARL500_DESIGNS) {
    it(`reproduces ARL ≈ 500 within 10 % for λ = ${lambda}, L = ${L}`, () => {
      const rng = createRng(500 + lambda * 1000);
      const runs = 1500;
      let total = 0;
      for (let r = 0; r < runs; r++) total += runLength(rng, lambda, L);
      const arl = total / runs;
      expect(Math.abs(arl / 500 - 1)).toBeLessThan(0.1);
    });
  }
});
