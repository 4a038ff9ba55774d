import FFT from "fft.js";
import { describe, expect, it } from "vitest";
import { simulateAmbientRecord, type AmbientOptions } from "@/lib/simulate/ambient";

const sdof = (f: number, zeta: number): AmbientOptions["modes"] => [{ frequencyHz: f, dampingRatio: zeta, shape: [1] }];

/** Averaged Hann periodogram, one-sided density (test-local reference estimator). */
function welchPsd(x: Float64Array, fs: number, nseg: number): Float64Array {
  const fft = new FFT(nseg);
  const w = Float64Array.from({ length: nseg }, (_, i) => 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / nseg));
  const u = w.reduce((s, v) => s + v * v, 0);
  const psd = new Float64Array(nseg / 2 + 1);
  const inp = new Array<number>(nseg), out = fft.createComplexArray() as number[];
  let count = 0;
  for (let start = 0; start + nseg <= x.length; start += nseg / 2) {
    for (let i = 0; i < nseg; i++) inp[i] = x[start + i] * w[i];
    fft.realTransform(out, inp);
    for (let k = 0; k <= nseg / 2; k++) psd[k] += out[2 * k] ** 2 + out[2 * k + 1] ** 2;
    count++;
  }
  for (let k = 0; k <= nseg / 2; k++) psd[k] *= (k === 0 || k === nseg / 2 ? 1 : 2) / (count * fs * u);
  return psd;
}

describe("simulateAmbientRecord", () => {
  it("gives an SDOF displacement variance of S₀/(4ζω³) (Crandall & Mark)", () => {
    // Crandall & Mark [pub]: σ² = S₀/(4ζω³) for two-sided force PSD S₀ per unit mass;
    // here S₀ = σ_u²/fs. Normalised random error of a mean-square estimate ≈ 1/√(B_e T) with
    // B_e = πζf_n the noise bandwidth [pub: Bendat & Piersol ch. 8]; T = 4000 s → ≈ 1.8 %.
    // The force hold lowers S₀ by ≤ 0.1 % at f/fs = 1/20 (negligible). Bound: 4 errors.
    const f = 5, zeta = 0.05, fs = 100, T = 4000, sigma = 0.3;
    const rec = simulateAmbientRecord({ modes: sdof(f, zeta), sampleRateHz: fs, durationS: T, seed: 3, snrDb: Infinity, modalForceStd: [sigma], quantity: "displacement" });
    const x = rec.data[0];
    const variance = x.reduce((s, v) => s + v * v, 0) / x.length;
    const omega = 2 * Math.PI * f;
    const expected = (sigma ** 2 / fs) / (4 * zeta * omega ** 3);
    const eps = 1 / Math.sqrt(Math.PI * zeta * f * T);
    expect(Math.abs(variance / expected - 1)).toBeLessThan(4 * eps);
  });

  it("gives an SDOF acceleration PSD of 2S₀|H_a(f)|² below fs/20, resonance included", () => {
    // H_a = −ω²/(ω_n² − ω² + 2jζω_nω) [pub: Chopra ch. 3]; one-sided G = 2S₀|H_a|² with
    // S₀ = σ²/fs. The first-order-hold recursion follows the continuous system within
    // ≈ (2πf/fs)²/12 ≤ 0.9 % below fs/20 (Franklin, Powell & Workman ch. 6 [pub]), so the
    // check stays in that band. Welch: n_d ≈ 195 Hann segments, 9 lines averaged → random
    // error ≈ 1/√(195·9/2) ≈ 3.4 % (overlapping neighbours count about half); peak bias
    // −(1/3)(B_e/B_r)² ≈ −1.1 % with B_e = 1.5Δf, B_r = 2ζf_n [pub: Bendat & Piersol §8.5].
    // Bound 12 % ≈ 3.5 random errors.
    const fn = 2, zeta = 0.05, fs = 100, T = 4000, sigma = 0.3, nseg = 4096;
    const rec = simulateAmbientRecord({ modes: sdof(fn, zeta), sampleRateHz: fs, durationS: T, seed: 8, snrDb: Infinity, modalForceStd: [sigma] });
    const g = welchPsd(rec.data[0], fs, nseg);
    const df = fs / nseg, s0 = sigma ** 2 / fs;
    for (const fc of [0.8, 1.5, 1.9, 2, 2.1, 2.5, 3.5, 5]) {
      const k0 = Math.round(fc / df);
      let est = 0, ref = 0;
      for (let k = k0 - 4; k <= k0 + 4; k++) {
        const f = k * df;
        est += g[k];
        ref += (2 * s0 * f ** 4) / ((fn ** 2 - f ** 2) ** 2 + (2 * zeta * fn * f) ** 2);
      }
      expect(Math.abs(est / ref - 1)).toBeLessThan(0.12);
    }
  });

  it("repeats a record exactly for the same seed and changes it for another", () => {
    const opts: AmbientOptions = { modes: [{ frequencyHz: 2, dampingRatio: 0.01, shape: [1, -0.5] }], sampleRateHz: 50, durationS: 20, seed: 5 };
    const a = simulateAmbientRecord(opts), b = simulateAmbientRecord(opts), c = simulateAmbientRecord({ ...opts, seed: 6 });
    expect(Array.from(a.data[1])).toEqual(Array.from(b.data[1]));
    expect(Array.from(a.data[1])).not.toEqual(Array.from(c.data[1]));
  });

  it("adds sensor noise at the requested SNR relative to each channel's RMS", () => {
    // The noise is drawn after the modal response, so the same seed with and without noise
    // differs by the noise alone. RMS of 60 000 normals: relative s.e. 1/√(2n) ≈ 0.3 %; bound 2 %.
    const opts: AmbientOptions = { modes: [{ frequencyHz: 3, dampingRatio: 0.02, shape: [1, 0.25] }], sampleRateHz: 100, durationS: 600, seed: 9 };
    const clean = simulateAmbientRecord({ ...opts, snrDb: Infinity });
    const noisy = simulateAmbientRecord({ ...opts, snrDb: 10 });
    for (let c = 0; c < 2; c++) {
      let s = 0, e = 0;
      for (let k = 0; k < clean.data[c].length; k++) {
        s += clean.data[c][k] ** 2;
        e += (noisy.data[c][k] - clean.data[c][k]) ** 2;
      }
      expect(Math.abs(Math.sqrt(e / s) / 10 ** (-10 / 20) - 1)).toBeLessThan(0.02);
    }
  });

  it("scales frequencies by √stiffnessFactor and keeps shapes", () => {
    const modes = [{ frequencyHz: 2, dampingRatio: 0.01, shape: [0.5, 1] }];
    const rec = simulateAmbientRecord({ modes, sampleRateHz: 50, durationS: 10, seed: 1, stiffnessFactor: 0.81 });
    expect(rec.modes[0].frequencyHz).toBeCloseTo(1.8, 12);
    expect(rec.modes[0].shape).toEqual([0.5, 1]);
    expect(modes[0].frequencyHz).toBe(2); // input not mutated
  });

  it("scales the channels by the mode shape (one mode, no noise)", () => {
    const rec = simulateAmbientRecord({ modes: [{ frequencyHz: 2, dampingRatio: 0.01, shape: [1, -0.4] }], sampleRateHz: 50, durationS: 10, seed: 2, snrDb: Infinity });
    for (let k = 0; k < rec.data[0].length; k += 37) expect(rec.data[1][k]).toBeCloseTo(-0.4 * rec.data[0][k], 14);
  });

  it("warns about a channel on a node and a mode close to Nyquist", () => {
    const rec = simulateAmbientRecord({ modes: [{ frequencyHz: 22, dampingRatio: 0.01, shape: [1, 0] }], sampleRateHz: 50, durationS: 10, seed: 2 });
    expect(rec.warnings.some((w) => w.includes("channel 1"))).toBe(true);
    expect(rec.warnings.some((w) => w.includes("0.4·fs"))).toBe(true);
  });

  it("refuses bad options with the rule and the value", () => {
    const ok: AmbientOptions = { modes: sdof(2, 0.01), sampleRateHz: 50, durationS: 10, seed: 1 };
    expect(() => simulateAmbientRecord({ ...ok, modes: sdof(25, 0.01) })).toThrow(/< sampleRateHz\/2 = 25 \(got 25\)/);
    expect(() => simulateAmbientRecord({ ...ok, modes: sdof(2, 1.2) })).toThrow(/dampingRatio must be within \(0, 1\) \(got 1.2\)/);
    expect(() => simulateAmbientRecord({ ...ok, durationS: 0.1 })).toThrow(RangeError);
    expect(() => simulateAmbientRecord({ ...ok, seed: NaN })).toThrow(TypeError);
    expect(() => simulateAmbientRecord({ ...ok, modes: [] })).toThrow(TypeError);
    expect(() => simulateAmbientRecord({ ...ok, modes: [...sdof(2, 0.01), { frequencyHz: 3, dampingRatio: 0.01, shape: [1, 2] }] })).toThrow(RangeError);
    expect(() => simulateAmbientRecord({ ...ok, modalForceStd: [1, 2] })).toThrow(/one entry per mode/);
    expect(() => simulateAmbientRecord({ ...ok, stiffnessFactor: -1 })).toThrow(RangeError);
    expect(() => simulateAmbientRecord(null as unknown as AmbientOptions)).toThrow(TypeError);
  });
});
