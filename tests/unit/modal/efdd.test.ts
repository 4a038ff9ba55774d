import { describe, expect, it } from "vitest";
import { fitLogDecrement } from "@/lib/modal/efdd";

describe("fitLogDecrement", () => {
  for (const [zeta, fn] of [[0.005, 1.3], [0.01, 2.0], [0.02, 4.7], [0.05, 0.8]]) {
    it(`recovers ζ = ${zeta} and f_n = ${fn} Hz from r(t) = e^{−ζωt}cos(ω_d t) (round trip)`, () => {
      // [pub] REFERENCES.md EFDD: ζ = δ/√(4π²+δ²), f_n = f_d/√(1−ζ²); extrema 0.9…0.3 [practice]
      const fs = 100, w = 2 * Math.PI * fn, wd = w * Math.sqrt(1 - zeta * zeta);
      const r = Float64Array.from({ length: 20000 }, (_, k) => Math.exp(-zeta * w * (k / fs)) * Math.cos(wd * (k / fs)));
      const fit = fitLogDecrement(r, 1 / fs);
      expect(fit).not.toBeNull();
      expect(Math.abs(fit!.dampingRatio / zeta - 1)).toBeLessThan(0.01);
      expect(Math.abs(fit!.frequencyHz / fn - 1)).toBeLessThan(1e-3);
      expect(fit!.extremaUsed).toBeGreaterThanOrEqual(3);
    });
  }

  it("returns null when the decay is too fast for three extrema in [0.3, 0.9]", () => {
    const fs = 100, w = 2 * Math.PI * 2, zeta = 0.3;
    const r = Float64Array.from({ length: 2000 }, (_, k) => Math.exp(-zeta * w * (k / fs)) * Math.cos(w * Math.sqrt(1 - zeta * zeta) * (k / fs)));
    expect(fitLogDecrement(r, 1 / fs)).toBeNull();
  });

  it("refuses bad arguments", () => {
    const r = new Float64Array(16).fill(1);
    expect(() => fitLogDecrement(r, 0)).toThrow(/dt must be > 0/);
    expect(() => fitLogDecrement(r, 0.01, 0.3, 0.9)).toThrow(/lower must be < upper/);
    expect(() => fitLogDecrement(new Float64Array(16), 0.01)).toThrow(/r\[0\] must be > 0/);
    expect(() => fitLogDecrement([1, 2], 0.01)).toThrow(RangeError);
  });
});
