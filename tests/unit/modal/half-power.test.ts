import { describe, expect, it } from "vitest";
import { halfPowerDamping } from "@/lib/modal/half-power";

/** |H(f)|² of a SDOF oscillator (acceleration per force, any scale) on a grid of spacing df. */
function sdofPower(fn: number, zeta: number, df: number, nLines: number): Float64Array {
  return Float64Array.from({ length: nLines }, (_, k) => {
    const r = (k * df) / fn;
    return 1 / ((1 - r * r) ** 2 + (2 * zeta * r) ** 2);
  });
}

describe("halfPowerDamping", () => {
  for (const zeta of [0.005, 0.01, 0.02, 0.05]) {
    it(`recovers ζ = ${zeta} from an analytic SDOF power spectrum at fine resolution`, () => {
      // [pub] Chopra ch. 3: ζ ≈ (f₂ − f₁)/(2 f_n); exact to O(ζ²) for the displacement-type FRF
      const fn = 2, df = (2 * zeta * fn) / 40; // 40 lines across the bandwidth
      const p = sdofPower(fn, zeta, df, Math.round((2 * fn) / df));
      let k = 1;
      for (let i = 1; i < p.length - 1; i++) if (p[i] > p[k]) k = i;
      const hp = halfPowerDamping(p, df, k);
      expect(hp).not.toBeNull();
      expect(Math.abs(hp!.dampingRatio / zeta - 1)).toBeLessThan(2 * zeta + 0.01);
      expect(hp!.q).toBeCloseTo(1 / (2 * hp!.dampingRatio), 12);
      expect(hp!.lossFactor).toBeCloseTo(2 * hp!.dampingRatio, 12);
      expect(hp!.bandwidthLines).toBeGreaterThan(35);
    });
  }

  it("reads high when the bandwidth spans about one line (the known bias, REFERENCES.md)", () => {
    // [practice] B_r < ~1.5 lines ⇒ damping reads high; here the true ζ is 0.5 % with B_r ≈ 1 line
    const fn = 2, zeta = 0.005, df = 2 * zeta * fn;
    const p = sdofPower(fn, zeta, df, 400);
    // smear as a window would: average over ±1 line (Hann-like 1/4, 1/2, 1/4 kernel)
    const s = Float64Array.from(p, (_, k) => (k > 0 && k < p.length - 1 ? 0.25 * p[k - 1] + 0.5 * p[k] + 0.25 * p[k + 1] : p[k]));
    let k = 1;
    for (let i = 1; i < s.length - 1; i++) if (s[i] > s[k]) k = i;
    const hp = halfPowerDamping(s, df, k);
    expect(hp).not.toBeNull();
    expect(hp!.dampingRatio).toBeGreaterThan(1.5 * zeta);
  });

  it("returns null when a higher peak comes before the half-power point", () => {
    const p = [1, 2, 5, 4, 6, 1, 0.5];
    expect(halfPowerDamping(p, 0.1, 2)).toBeNull();
  });

  it("refuses bad arguments", () => {
    expect(() => halfPowerDamping([1, 2], 0.1, 1)).toThrow(RangeError);
    expect(() => halfPowerDamping([1, 2, 1], 0, 1)).toThrow(/lineSpacingHz must be > 0/);
    expect(() => halfPowerDamping([1, 2, 1], 0.1, 0)).toThrow(/peakLine must be ≥ 1 \(got 0\)/);
    expect(() => halfPowerDamping([1, Number.NaN, 1], 0.1, 1)).toThrow(TypeError);
  });
});
