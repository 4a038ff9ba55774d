import { describe, expect, it } from "vitest";
import { estimateCsdMatrix } from "@/lib/signal/welch-csd";
import { hannPeriodic } from "@/lib/signal/windows";
import { createRng } from "@/lib/simulate";

function gaussian(n: number, seed: number): Float64Array {
  const rng = createRng(seed);
  return Float64Array.from({ length: n }, () => rng.normal());
}

describe("estimateCsdMatrix", () => {
  const n = 3;
  const len = 65536;
  const a = gaussian(len, 1), b = gaussian(len, 2), c = gaussian(len, 3);
  // Correlated channels: y1 = a, y2 = a delayed by 2 samples + b, y3 = 0.5·c + 0.3·a
  const y2 = Float64Array.from(a, (_, i) => (i >= 2 ? a[i - 2] : 0) + b[i]);
  const y3 = Float64Array.from(c, (v, i) => 0.5 * v + 0.3 * a[i]);
  const data = [a, y2, y3];
  const csd = estimateCsdMatrix(data, 100, { nperseg: 1024 });

  it("satisfies Parseval: Σ G_ii Δf ≈ var(y_i) within 3 %", () => {
    // [pub] Bendat & Piersol, Random Data, 4th ed., ch. 8; a few % for a long Gaussian record
    for (let i = 0; i < n; i++) {
      let p = 0;
      for (let k = 0; k < csd.nLines; k++) p += csd.re[k * n * n + i * n + i] * csd.lineSpacingHz;
      const x = data[i];
      let m = 0;
      for (const v of x) m += v;
      m /= x.length;
      let v2 = 0;
      for (const v of x) v2 += (v - m) ** 2;
      v2 /= x.length;
      expect(Math.abs(p / v2 - 1)).toBeLessThan(0.03);
    }
  });

  it("is Hermitian at every line (G_ji = conj G_ij, real diagonal ≥ 0)", () => {
    // [pub] G(f) = E[Y Yᴴ] is Hermitian positive semi-definite (Brincker et al. 2001)
    for (let k = 0; k < csd.nLines; k++) {
      const o = k * n * n;
      for (let i = 0; i < n; i++) {
        expect(csd.im[o + i * n + i]).toBe(0);
        expect(csd.re[o + i * n + i]).toBeGreaterThanOrEqual(0);
        for (let j = 0; j < n; j++) {
          expect(csd.re[o + i * n + j]).toBe(csd.re[o + j * n + i]);
          expect(csd.im[o + i * n + j] + csd.im[o + j * n + i]).toBe(0);
        }
      }
    }
  });

  it("puts the phase of a 2-sample delay on G_12 (sign convention G = E[Y Yᴴ])", () => {
    // y2 = a(t − 2Δt) + noise ⇒ Y2 = A e^{−jω2Δt}, G_12 = E[Y1 Y2*] ∝ e^{+jω·2Δt} [pub: Bendat & Piersol §5.2]
    const k = 100; // 9.77 Hz
    const o = k * n * n;
    const phase = Math.atan2(csd.im[o + 1], csd.re[o + 1]);
    expect(phase).toBeCloseTo((2 * Math.PI * csd.frequencyHz[k] * 2) / 100, 1);
  });

  it("counts SciPy's segments: floor((L − noverlap)/step)", () => {
    expect(csd.averages).toBe(Math.floor((len - 512) / 512));
    const c2 = estimateCsdMatrix([a.subarray(0, 5000)], 100, { nperseg: 1024, noverlap: 256 });
    expect(c2.averages).toBe(Math.floor((5000 - 256) / 768));
  });

  it("refuses bad arguments with the rule and the value", () => {
    expect(() => estimateCsdMatrix([a], 100, { nperseg: 1000 })).toThrow(/power of two \(got 1000\)/);
    expect(() => estimateCsdMatrix([a], 100, { nperseg: 1024, noverlap: 1024 })).toThrow(RangeError);
    expect(() => estimateCsdMatrix([a, a.subarray(1)], 100)).toThrow(/equal length/);
    expect(() => estimateCsdMatrix([a], 0)).toThrow(/sampleRateHz must be > 0 \(got 0\)/);
    expect(() => estimateCsdMatrix([a], Number.NaN)).toThrow(TypeError);
    expect(() => estimateCsdMatrix([[1, Number.NaN, 3, 4, 5, 6, 7, 8]], 1, { nperseg: 8 })).toThrow(TypeError);
    expect(() => estimateCsdMatrix([], 100)).toThrow(RangeError);
    expect(() => estimateCsdMatrix([a.subarray(0, 16)], 100, { nperseg: 32 })).toThrow(/≤ record length/);
  });
});

describe("hannPeriodic", () => {
  it("is the DFT-even Hann window of scipy.signal.get_window('hann', N)", () => {
    // [lib] periodic Hann: w[n] = 0.5 − 0.5 cos(2πn/N); w[0] = 0, w[N/2] = 1
    const w = hannPeriodic(8);
    expect(w[0]).toBe(0);
    expect(w[4]).toBeCloseTo(1, 15);
    expect(w[2]).toBeCloseTo(0.5, 15);
    expect(() => hannPeriodic(1)).toThrow(RangeError);
  });
});
