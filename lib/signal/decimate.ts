/**
 * Zero-phase anti-alias low-pass and integer decimation, the same operation as SciPy's
 * `signal.decimate(x, q, ftype='fir')` (zero_phase=True): a Hamming-windowed sinc of
 * 20q + 1 taps with cutoff at the new Nyquist (firwin(20q+1, 1/q), unit DC gain), applied
 * as a centred, symmetric kernel (so no phase shift) at every q-th sample, zero-padded at the
 * ends (resample_poly's default). Computing only the kept outputs costs (20q+1)·L/q
 * multiply-adds per channel.
 *
 * The cutoff at exactly the new Nyquist lets the top ~10 % of the new band alias slightly;
 * identify modes below ≈ 0.8 × the new Nyquist (the FDD default search range does).
 */
import { assertInteger, assertNumberArray } from "@/lib/numeric/validate";

/**
 * Windowed-sinc low-pass FIR (as scipy.signal.firwin with window='hamming', scale=True).
 * @param numtaps - odd integer ≥ 3.
 * @param cutoff - cutoff relative to Nyquist, (0, 1).
 * @returns taps, symmetric, Σ = 1.
 * @throws TypeError / RangeError for bad arguments.
 */
export function firLowpass(numtaps: number, cutoff: number): Float64Array {
  assertInteger(numtaps, "numtaps", 3);
  if (numtaps % 2 === 0) throw new RangeError(`numtaps must be odd (got ${numtaps})`);
  if (typeof cutoff !== "number" || !Number.isFinite(cutoff)) throw new TypeError(`cutoff must be a finite number (got ${cutoff})`);
  if (!(cutoff > 0 && cutoff < 1)) throw new RangeError(`cutoff must be within (0, 1) of Nyquist (got ${cutoff})`);
  const h = new Float64Array(numtaps);
  const alpha = (numtaps - 1) / 2;
  let sum = 0;
  for (let i = 0; i < numtaps; i++) {
    const m = i - alpha;
    const x = cutoff * m;
    const sinc = x === 0 ? 1 : Math.sin(Math.PI * x) / (Math.PI * x);
    const w = 0.54 - 0.46 * Math.cos((2 * Math.PI * i) / (numtaps - 1));
    h[i] = cutoff * sinc * w;
    sum += h[i];
  }
  for (let i = 0; i < numtaps; i++) h[i] /= sum;
  return h;
}

/**
 * Low-pass filters and keeps every q-th sample, with zero phase.
 * @param x - samples at rate fs, length ≥ 1, finite. Not mutated.
 * @param q - decimation factor, integer 2…64; the new rate is fs/q.
 * @returns a new Float64Array of length ⌈L/q⌉.
 * @throws TypeError / RangeError for bad arguments.
 */
export function decimate(x: ArrayLike<number>, q: number): Float64Array {
  assertNumberArray(x, "x", 1);
  assertInteger(q, "q", 2, 64);
  const halfLen = 10 * q;
  const h = firLowpass(2 * halfLen + 1, 1 / q);
  const n = x.length;
  const nOut = Math.ceil(n / q);
  const out = new Float64Array(nOut);
  const xs = x instanceof Float64Array ? x : Float64Array.from(x);
  for (let m = 0; m < nOut; m++) {
    // y[m] = Σ_j h[j]·x[mq + halfLen − j], zero outside the record
    const c = m * q + halfLen;
    const jLo = Math.max(0, c - (n - 1));
    const jHi = Math.min(2 * halfLen, c);
    let acc = 0;
    for (let j = jLo; j <= jHi; j++) acc += h[j] * xs[c - j];
    out[m] = acc;
  }
  return out;
}

/**
 * Largest integer decimation factor that keeps `maxFrequencyHz` within 0.8 of the new
 * Nyquist frequency (the FIR's cutoff region above stays clear of the band) [practice].
 * @param sampleRateHz - Hz, > 0.
 * @param maxFrequencyHz - highest frequency of interest in Hz, 0 < f < sampleRateHz/2.
 * @returns q, integer 1…64 (1: no decimation).
 * @throws TypeError / RangeError for bad arguments.
 */
export function decimationFactorForBand(sampleRateHz: number, maxFrequencyHz: number): number {
  if (typeof sampleRateHz !== "number" || !Number.isFinite(sampleRateHz)) throw new TypeError(`sampleRateHz must be a finite number (got ${sampleRateHz})`);
  if (typeof maxFrequencyHz !== "number" || !Number.isFinite(maxFrequencyHz)) throw new TypeError(`maxFrequencyHz must be a finite number (got ${maxFrequencyHz})`);
  if (!(sampleRateHz > 0)) throw new RangeError(`sampleRateHz must be > 0 (got ${sampleRateHz})`);
  if (!(maxFrequencyHz > 0 && maxFrequencyHz < sampleRateHz / 2)) throw new RangeError(`maxFrequencyHz must be within (0, ${sampleRateHz / 2}) (got ${maxFrequencyHz})`);
  // new Nyquist fs/(2q) ≥ f/0.8  ⇔  q ≤ 0.4·fs/f
  return Math.max(1, Math.min(64, Math.floor((0.4 * sampleRateHz) / maxFrequencyHz)));
}
