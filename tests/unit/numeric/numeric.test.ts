import { describe, expect, it } from "vitest";
import { getRealFft, isPowerOfTwo } from "@/lib/numeric/fft";
import { median } from "@/lib/numeric/select";
import { assertComplexVector } from "@/lib/numeric/complex";

describe("getRealFft", () => {
  it("equals the DFT definition X_k = Σ x_n e^{−2πjkn/N} and inverts it", () => {
    // [pub] DFT definition (NumPy/SciPy convention); identity: inverse(forward(x)) = x
    const n = 64;
    const x = Float64Array.from({ length: n }, (_, i) => Math.sin(0.37 * i * i) + 0.1 * i);
    const f = getRealFft(n);
    const re = new Float64Array(n / 2 + 1), im = new Float64Array(n / 2 + 1);
    f.forwardHalf(x, re, im);
    for (let k = 0; k <= n / 2; k++) {
      let r = 0, m = 0;
      for (let t = 0; t < n; t++) {
        r += x[t] * Math.cos((2 * Math.PI * k * t) / n);
        m -= x[t] * Math.sin((2 * Math.PI * k * t) / n);
      }
      expect(Math.abs(re[k] - r)).toBeLessThan(1e-12);
      expect(Math.abs(im[k] - m)).toBeLessThan(1e-12);
    }
    const back = new Float64Array(n);
    f.inverseHalf(re, im, back);
    x.forEach((v, i) => expect(back[i]).toBeCloseTo(v, 13));
  });
  it("transforms two real frames with one complex FFT exactly as two real FFTs", () => {
    const n = 32;
    const a = Float64Array.from({ length: n }, (_, i) => Math.cos(0.2 * i) + i / n);
    const b = Float64Array.from({ length: n }, (_, i) => Math.sin(0.9 * i * i));
    const f = getRealFft(n);
    const re = new Float64Array(2 * (n / 2 + 1)), im = new Float64Array(2 * (n / 2 + 1));
    f.forwardPairStrided(a, b, re, im, 0, 1, 2);
    const ra = new Float64Array(n / 2 + 1), ia = new Float64Array(n / 2 + 1), rb = new Float64Array(n / 2 + 1), ib = new Float64Array(n / 2 + 1);
    f.forwardHalf(a, ra, ia);
    f.forwardHalf(b, rb, ib);
    for (let k = 0; k <= n / 2; k++) {
      expect(re[2 * k]).toBeCloseTo(ra[k], 12);
      expect(im[2 * k]).toBeCloseTo(ia[k], 12);
      expect(re[2 * k + 1]).toBeCloseTo(rb[k], 12);
      expect(im[2 * k + 1]).toBeCloseTo(ib[k], 12);
    }
  });
  it("refuses sizes that are not powers of two ≥ 4", () => {
    expect(() => getRealFft(48)).toThrow(/power of two \(got 48\)/);
    expect(() => getRealFft(2)).toThrow(RangeError);
    expect(isPowerOfTwo(1024)).toBe(true);
  });
});

describe("median", () => {
  it("is the middle value (odd) or the mean of the two middle values (even)", () => {
    expect(median([5, 1, 4, 2, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([7, 7, 7, 1])).toBe(7);
    expect(median(Float64Array.from({ length: 1001 }, (_, i) => (i * 7919) % 1001))).toBe(500);
  });
  it("refuses empty and non-finite input", () => {
    expect(() => median([])).toThrow(RangeError);
    expect(() => median([1, Number.NaN])).toThrow(TypeError);
  });
});

describe("assertComplexVector", () => {
  it("names the rule and the value", () => {
    expect(() => assertComplexVector({ re: [1, 2], im: [1] }, "v")).toThrow(/equal length \(got 2 ≠ 1\)/);
    expect(() => assertComplexVector({ re: [1], im: [Infinity] }, "v")).toThrow(TypeError);
    expect(() => assertComplexVector(3, "v")).toThrow(/must be an object/);
  });
});
