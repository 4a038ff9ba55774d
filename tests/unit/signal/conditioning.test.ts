import { describe, expect, it } from "vitest";
import { decimate, decimationFactorForBand, firLowpass } from "@/lib/signal/decimate";
import { removeLinearTrend, removeMean } from "@/lib/signal/detrend";
import { accelerationFactor, STANDARD_GRAVITY, toMetresPerSecondSquared, type AccelerationUnit } from "@/lib/signal/units";
import { chooseSegmentLength } from "@/lib/signal/segment-length";

describe("unit conversion", () => {
  it("uses standard gravity 9.80665 m/s² (ISO 80000-3)", () => {
    // [pub] g_n = 9.80665 m/s² exactly (3rd CGPM 1901; ISO 80000-3)
    expect(STANDARD_GRAVITY).toBe(9.80665);
    expect(Array.from(toMetresPerSecondSquared([1, -0.5], "g"))).toEqual([9.80665, -4.903325]);
    expect(toMetresPerSecondSquared([1000], "mg")[0]).toBeCloseTo(9.80665, 12);
    expect(accelerationFactor("m/s2")).toBe(1);
  });
  it("refuses an unknown unit", () => {
    expect(() => toMetresPerSecondSquared([1], "ft/s2" as AccelerationUnit)).toThrow(/unit must be one of/);
  });
});

describe("detrending", () => {
  it("removes an exact line a + b·i to rounding", () => {
    const x = Array.from({ length: 101 }, (_, i) => 3 - 0.25 * i);
    for (const v of removeLinearTrend(x)) expect(Math.abs(v)).toBeLessThan(1e-12);
    const m = removeMean([1, 2, 3, 6]);
    expect(Array.from(m)).toEqual([-2, -1, 0, 3]);
  });
  it("refuses too-short and non-finite input", () => {
    expect(() => removeLinearTrend([1])).toThrow(RangeError);
    expect(() => removeMean([Number.NaN])).toThrow(TypeError);
  });
});

describe("decimate", () => {
  it("passes an in-band sinusoid with zero phase and unit gain, and suppresses one above the new Nyquist", () => {
    // Identity: a symmetric (linear-phase) kernel centred on the output sample has zero phase
    const fs = 200, q = 4, n = 8000;
    const x = Float64Array.from({ length: n }, (_, i) => Math.sin(2 * Math.PI * 3 * (i / fs) + 0.3));
    const y = decimate(x, q);
    expect(y.length).toBe(n / q);
    // Hamming-window FIR pass-band ripple δ ≈ 0.0022 (−53 dB) [pub: Harris, Proc. IEEE 66(1), 1978]
    for (let m = 200; m < y.length - 200; m++) expect(Math.abs(y[m] - Math.sin(2 * Math.PI * 3 * ((m * q) / fs) + 0.3))).toBeLessThan(0.003);
    const hi = Float64Array.from({ length: n }, (_, i) => Math.sin(2 * Math.PI * 40 * (i / fs)));
    const yh = decimate(hi, q);
    let peak = 0;
    for (let m = 200; m < yh.length - 200; m++) peak = Math.max(peak, Math.abs(yh[m]));
    expect(peak).toBeLessThan(0.01); // Hamming-window sinc stop band: ≈ −53 dB [pub: Harris, Proc. IEEE 66(1), 1978]
  });
  it("designs a low-pass with unit DC gain and symmetric taps", () => {
    const h = firLowpass(41, 0.25);
    let s = 0;
    for (const v of h) s += v;
    expect(s).toBeCloseTo(1, 14);
    for (let i = 0; i < 20; i++) expect(h[i]).toBeCloseTo(h[40 - i], 15);
  });
  it("refuses bad factors and taps", () => {
    expect(() => decimate([1, 2, 3], 1)).toThrow(/q must be ≥ 2 \(got 1\)/);
    expect(() => decimate([1, 2, 3], 2.5)).toThrow(TypeError);
    expect(() => firLowpass(40, 0.25)).toThrow(/odd/);
    expect(() => firLowpass(41, 1)).toThrow(RangeError);
  });
});

describe("chooseSegmentLength", () => {
  it("puts ≥ 3 lines across the half-power bandwidth when the record allows ≥ 20 averages", () => {
    // [practice] B_r = 2ζf ≥ 3Δf; averages ≥ 20 [Bendat & Piersol §8.5: error ≈ 1/√n_d]
    const c = chooseSegmentLength(50, 50 * 7200, { lowestFrequencyHz: 2, assumedDampingRatio: 0.02 });
    expect(c.bandwidthLines).toBeGreaterThanOrEqual(3);
    expect(c.averages).toBeGreaterThanOrEqual(20);
    expect(c.dampingTrustworthy).toBe(true);
    expect(c.warnings).toEqual([]);
    expect(c.nperseg & (c.nperseg - 1)).toBe(0);
  });
  it("keeps 20 averages and warns when the standard 10-minute record is too short", () => {
    // 16 ch, 200 Hz, 600 s; lowest mode 1 Hz at ζ = 1 %: 3 lines need nperseg ≥ 30 000
    const c = chooseSegmentLength(200, 120_000, { lowestFrequencyHz: 1 });
    expect(c.averages).toBeGreaterThanOrEqual(20);
    expect(c.dampingTrustworthy).toBe(false);
    expect(c.warnings.join(" ")).toMatch(/too short for trustworthy damping/);
    expect(c.warnings.join(" ")).toMatch(/1000/); // [pub] Cantieni 2005: 1000–2000 periods
  });
  it("refuses bad arguments", () => {
    expect(() => chooseSegmentLength(200, 1000, { lowestFrequencyHz: 150 })).toThrow(/Nyquist/);
    expect(() => chooseSegmentLength(200, 10, { lowestFrequencyHz: 1 })).toThrow(RangeError);
    expect(() => chooseSegmentLength(200, 1000, { lowestFrequencyHz: 1, assumedDampingRatio: 0.9 })).toThrow(RangeError);
  });
});

describe("decimationFactorForBand", () => {
  it("keeps the band below 0.8 of the new Nyquist [practice]", () => {
    expect(decimationFactorForBand(200, 10)).toBe(8); // 25 Hz rate, Nyquist 12.5 Hz, 10 ≤ 0.8·12.5
    expect(decimationFactorForBand(200, 15)).toBe(5);
    expect(decimationFactorForBand(50, 19)).toBe(1);
    expect(() => decimationFactorForBand(200, 120)).toThrow(RangeError);
  });
});
