/**
 * Modes from H1 frequency response functions: peak picking, half-power damping with Q and
 * loss factor, phase at resonance and operating shapes [1, 2].
 *
 * Peaks are picked on the mode indicator Σ_c |H1_c|² (every response channel, so a mode with
 * a node at one sensor is still seen) by prominence in dB (SciPy's definition, via
 * peak-picking.ts), optionally inside bands. At each peak the half-power bandwidth is read
 * on |H1_c|² of the channel with the largest response (halfPowerDamping of half-power.ts):
 * ζ ≈ (f₂ − f₁)/(2f_n), Q = 1/(2ζ), η = 2ζ [2]. On an accelerance the ω⁴ numerator shifts
 * the half-power points by O(ζ²) relative to the receptance, negligible for ζ ≤ 5 %.
 * Phase convention (H1 of acceleration over force, G = E[Y Yᴴ]): a point moving with the
 * drive point has accelerance phase +90° at resonance, i.e. receptance phase −90°
 * (REFERENCES.md: 90° out of phase at resonance [practice]); a point in anti-phase shows
 * −90°. The shape is Im H1_c at the resonance line (for accelerance H_cd ∝ jφ_cφ_d/(2ζM)),
 * normalised to max |φ| = 1 with the largest component positive.
 *
 * [1] Bendat & Piersol, Random Data, 4th ed. (H1, coherence).
 * [2] Chopra, Dynamics of Structures, ch. 3 (half-power bandwidth, Q, loss factor).
 */
import { assertInRange, assertNumberArray, describe } from "@/lib/numeric/validate";
import { halfPowerDamping } from "./half-power";
import { prominences } from "./peak-picking";
import type { FrfEstimate } from "./frf";

/** A mode read from the FRFs. */
export interface FrfMode {
  /** Resonance frequency in Hz (parabolic refinement of the half-power peak). */
  frequencyHz: number;
  /** Half-power damping ratio (fraction) and the derived Q and loss factor; null if not isolated. */
  halfPower: { dampingRatio: number; q: number; lossFactor: number; bandwidthLines: number; reliable: boolean } | null;
  /** H1 phase at the resonance line per response channel, degrees in (−180, 180]. */
  phaseDeg: number[];
  /** Coherence γ² at the resonance line per response channel. */
  coherence: number[];
  /** Operating shape Im H1 per response channel, max |φ| = 1, largest component positive. */
  shape: number[];
  /** Prominence of the peak on the mode indicator, dB. */
  prominenceDb: number;
}

/** Options of {@link identifyFrfModes}. */
export interface FrfModeOptions {
  /** Bands [lo, hi] in Hz to search (0 ≤ lo < hi); default (0, Nyquist). */
  bandsHz?: [number, number][];
  /** Minimum prominence in dB on the mode indicator, [0, 100]; default 10. */
  minProminenceDb?: number;
}

/**
 * Picks modes on H1 FRFs and reads damping, phase and shape at each (see file header).
 *
 * @param frf - output of estimateFrfH1 (not mutated).
 * @param options - see {@link FrfModeOptions}.
 * @returns modes ascending in frequency and warnings (half-power band under 3 lines, which
 *   reads high [REFERENCES.md, known biases], or a peak not isolated enough for half-power).
 * @throws TypeError for a malformed estimate; RangeError for bad bands or prominence.
 */
export function identifyFrfModes(frf: FrfEstimate, options: FrfModeOptions = {}): { modes: FrfMode[]; warnings: string[] } {
  if (typeof frf !== "object" || frf === null || !Array.isArray(frf.h) || frf.h.length === 0) {
    throw new TypeError(`frf must be an estimate from estimateFrfH1 (got ${describe(frf)})`);
  }
  assertNumberArray(frf.frequencyHz, "frf.frequencyHz", 3);
  const minDb = options.minProminenceDb ?? 10;
  assertInRange(minDb, "minProminenceDb", 0, 100);
  const nyq = frf.frequencyHz[frf.frequencyHz.length - 1];
  const bands = options.bandsHz ?? [[0, nyq]];
  if (!Array.isArray(bands)) throw new TypeError(`bandsHz must be an array of [lo, hi] (got ${describe(bands)})`);
  bands.forEach((b, j) => {
    assertNumberArray(b, `bandsHz[${j}]`, 2);
    if (!(b[0] >= 0 && b[0] < b[1])) throw new RangeError(`bandsHz[${j}] must satisfy 0 ≤ lo < hi (got [${b[0]}, ${b[1]}])`);
  });

  const nLines = frf.frequencyHz.length;
  const df = frf.lineSpacingHz;
  const indicatorDb = new Float64Array(nLines);
  for (let k = 0; k < nLines; k++) {
    let s = 0;
    for (const h of frf.h) s += Number.isFinite(h.re[k]) ? h.re[k] ** 2 + h.im[k] ** 2 : 0;
    indicatorDb[k] = 10 * Math.log10(s + 1e-300);
  }
  const warnings: string[] = [];
  const modes: FrfMode[] = [];
  for (const [lo, hi] of bands) {
    const kLo = Math.max(1, Math.ceil(lo / df)), kHi = Math.min(nLines - 2, Math.floor(hi / df));
    for (const [k, prom] of prominences(indicatorDb, kLo, kHi)) {
      if (prom < minDb) continue;
      modes.push(readMode(frf, k, prom, warnings));
    }
  }
  modes.sort((a, b) => a.frequencyHz - b.frequencyHz);
  return { modes, warnings };
}

function readMode(frf: FrfEstimate, k: number, prom: number, warnings: string[]): FrfMode {
  const mag2 = frf.h.map((h) => h.re[k] ** 2 + h.im[k] ** 2);
  const best = mag2.indexOf(Math.max(...mag2));
  const h = frf.h[best];
  const power = Float64Array.from(h.re, (re, i) => re * re + h.im[i] * h.im[i]);
  const hp = halfPowerDamping(power, frf.lineSpacingHz, k);
  const f0 = hp?.peakHz ?? frf.frequencyHz[k];
  let halfPower: FrfMode["halfPower"] = null;
  if (hp) {
    // Below ~3 lines across the half-power band the window widens the peak [practice].
    const reliable = hp.bandwidthLines >= 3;
    if (!reliable) warnings.push(`mode at ${f0.toFixed(3)} Hz: half-power band spans ${hp.bandwidthLines.toFixed(1)} lines (< 3), damping reads high`);
    halfPower = { dampingRatio: hp.dampingRatio, q: hp.q, lossFactor: hp.lossFactor, bandwidthLines: hp.bandwidthLines, reliable };
  } else {
    warnings.push(`mode at ${f0.toFixed(3)} Hz: the peak is not isolated, no half-power damping`);
  }
  const im = frf.h.map((c) => c.im[k]);
  let big = 0;
  for (const v of im) if (Math.abs(v) > Math.abs(big)) big = v;
  return {
    frequencyHz: f0,
    halfPower,
    phaseDeg: frf.h.map((c) => (Math.atan2(c.im[k], c.re[k]) * 180) / Math.PI),
    coherence: frf.coherence.map((g) => g[k]),
    shape: im.map((v) => (big === 0 ? 0 : v / big)),
    prominenceDb: prom,
  };
}
