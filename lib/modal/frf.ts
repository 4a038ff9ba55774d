/**
 * Frequency response functions of a forced test by the H1 estimator, with coherence.
 *
 * H1(f) = G_fx(f) / G_ff(f) and γ²(f) = |G_fx|² / (G_ff·G_xx) per response channel x, from
 * Welch cross-spectra [1, ch. 6 & 9] (estimateCsdMatrix of lib/signal, Hann window). In the
 * CSD matrix G = E[Y Yᴴ] of the channels [force, x₁, x₂, …], G_fx of Bendat & Piersol
 * (E[F* X]) is element (x, f). H1 is unbiased by noise on the response and biased low by
 * noise on the force; γ² < 1 flags noise, leakage or nonlinearity. At a sharp resonance the
 * window smooths H1 (a leakage bias that lowers the peak and widens the half-power band)
 * unless the half-power bandwidth spans several lines.
 * Units: response unit per force unit, e.g. (m/s²)/N (accelerance).
 *
 * [1] Bendat & Piersol, Random Data, 4th ed. (H1 estimator, ordinary coherence).
 */
import { assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import { estimateCsdMatrix, type CsdOptions } from "@/lib/signal/welch-csd";

/** A forced-test record: the measured force and the responses, at one rate. */
export interface ForcedRecord {
  /** Sampling rate in Hz, > 0. */
  sampleRateHz: number;
  /** Measured force (N), finite samples. */
  force: ArrayLike<number>;
  /** Response channels (e.g. m/s²), each as long as `force`, finite, at least one. */
  responses: ArrayLike<number>[];
}

/** H1 estimates and coherence of every response channel. */
export interface FrfEstimate {
  /** Line frequencies in Hz (DC … Nyquist). */
  frequencyHz: Float64Array;
  lineSpacingHz: number;
  averages: number;
  /** H1 per response channel, complex, response unit per force unit. */
  h: { re: Float64Array; im: Float64Array }[];
  /** Ordinary coherence γ² per response channel, [0, 1]. */
  coherence: Float64Array[];
  warnings: string[];
}

/**
 * Estimates H1 and coherence of every response channel against the force.
 *
 * @param record - see {@link ForcedRecord}; not mutated.
 * @param options - Welch settings passed to estimateCsdMatrix: `nperseg` (power of two,
 *   default min(2048, record length)), `noverlap` (default nperseg/2), `detrend`.
 * @returns line frequencies, H1 (complex) and γ² per response channel, the number of
 *   averages and warnings (few averages; lines where the force has no power are NaN).
 * @throws TypeError for a malformed record or non-finite samples; RangeError for no
 *   response channel, unequal lengths, or Welch settings that do not fit the record.
 */
export function estimateFrfH1(record: ForcedRecord, options: CsdOptions = {}): FrfEstimate {
  if (typeof record !== "object" || record === null) throw new TypeError(`record must be an object (got ${describe(record)})`);
  assertPositive(record.sampleRateHz, "record.sampleRateHz");
  assertNumberArray(record.force, "record.force", 16);
  if (!Array.isArray(record.responses)) throw new TypeError(`record.responses must be an array (got ${describe(record.responses)})`);
  if (record.responses.length < 1) throw new RangeError("record.responses must hold at least 1 channel (got 0)");
  record.responses.forEach((x, c) => {
    assertNumberArray(x, `record.responses[${c}]`);
    if (x.length !== record.force.length) {
      throw new RangeError(`record.responses[${c}] must have the length of record.force (got ${x.length} ≠ ${record.force.length})`);
    }
  });
  const g = estimateCsdMatrix([record.force, ...record.responses], record.sampleRateHz, options);
  const n = g.nChannels;
  const warnings: string[] = [];
  // Random error of |H1| ≈ √(1 − γ²)/(|γ|√(2n_d)) [1]; below ~10 averages it is not trustworthy.
  if (g.averages < 10) warnings.push(`only ${g.averages} averages: H1 and coherence are unreliable (≥ 10 advised)`);
  let silent = 0;
  const h = record.responses.map(() => ({ re: new Float64Array(g.nLines), im: new Float64Array(g.nLines) }));
  const coherence = record.responses.map(() => new Float64Array(g.nLines));
  for (let k = 0; k < g.nLines; k++) {
    const base = k * n * n;
    const gff = g.re[base];
    if (!(gff > 0)) silent++;
    for (let c = 0; c < record.responses.length; c++) {
      const i = (c + 1) * n; // row of response c, column 0 (the force)
      const re = g.re[base + i], im = g.im[base + i];
      const gxx = g.re[base + (c + 1) * n + c + 1];
      h[c].re[k] = gff > 0 ? re / gff : NaN;
      h[c].im[k] = gff > 0 ? im / gff : NaN;
      coherence[c][k] = gff > 0 && gxx > 0 ? Math.min(1, (re * re + im * im) / (gff * gxx)) : NaN;
    }
  }
  if (silent > 0) warnings.push(`${silent} line(s) carry no force power: H1 is NaN there`);
  return { frequencyHz: g.frequencyHz, lineSpacingHz: g.lineSpacingHz, averages: g.averages, h, coherence, warnings };
}
