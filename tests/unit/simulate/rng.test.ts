import { describe, expect, it } from "vitest";
import { createRng } from "@/lib/simulate/rng";

const N = 200_000;

describe("createRng", () => {
  it("repeats the same sequence for the same seed and differs for another seed", () => {
    const a = createRng(42), b = createRng(42), c = createRng(43);
    const sa = Array.from({ length: 8 }, () => a.next());
    const sb = Array.from({ length: 8 }, () => b.next());
    const sc = Array.from({ length: 8 }, () => c.next());
    expect(sa).toEqual(sb);
    expect(sa).not.toEqual(sc);
  });

  it("draws uniforms in [0, 1) with mean 1/2 and variance 1/12", () => {
    const r = createRng(7);
    let s = 0, ss = 0, lo = 1, hi = 0;
    for (let i = 0; i < N; i++) {
      const x = r.next();
      s += x; ss += x * x; lo = Math.min(lo, x); hi = Math.max(hi, x);
    }
    const mean = s / N, variance = ss / N - mean * mean;
    expect(lo).toBeGreaterThanOrEqual(0);
    expect(hi).toBeLessThan(1);
    // Standard error of the mean of U(0,1): √(1/12/N) ≈ 6.5e-4; 5σ bound.
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / N));
    // Var of x² over U(0,1) is 4/45; s.e. of the variance estimate ≈ √(1/180/N); 5σ bound.
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(5 * Math.sqrt(1 / 180 / N));
  });

  it("draws normals with mean 0, variance 1 and kurtosis 3", () => {
    const r = createRng(11);
    let s = 0, s2 = 0, s4 = 0;
    for (let i = 0; i < N; i++) {
      const x = r.normal();
      s += x; s2 += x * x; s4 += x ** 4;
    }
    // Standard errors for N(0,1): mean 1/√N, variance √(2/N), fourth moment √(96/N); 5σ bounds.
    expect(Math.abs(s / N)).toBeLessThan(5 / Math.sqrt(N));
    expect(Math.abs(s2 / N - 1)).toBeLessThan(5 * Math.sqrt(2 / N));
    expect(Math.abs(s4 / N - 3)).toBeLessThan(5 * Math.sqrt(96 / N));
  });

  it("gives distinct streams for fractional and large seeds", () => {
    expect(createRng(1.5).next()).not.toBe(createRng(1).next());
    expect(createRng(2 ** 40).next()).not.toBe(createRng(0).next());
  });

  it("refuses a non-finite seed with TypeError", () => {
    expect(() => createRng(NaN)).toThrow(TypeError);
    expect(() => createRng(Infinity)).toThrow(/seed must be a finite number \(got Infinity\)/);
  });
});
