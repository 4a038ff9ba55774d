/**
 * Enhanced FDD: damping and frequency of one mode from its SDOF "bell" [1].
 *
 * Around a peak, every line whose first, second or third singular vector has MAC ≥ 0.8
 * with the peak vector [practice] contributes that singular value to the bell; the bell
 * (zero elsewhere) is taken back to the time domain by an inverse FFT, giving the mode's
 * normalised auto-correlation function. The logarithmic decrement is fitted to its extrema
 * between 0.9 and 0.3 of the first [practice], ζ = δ/√(4π² + δ²), and the damped frequency
 * from the zero crossings over the same stretch; f_n = f_d/√(1 − ζ²) (REFERENCES.md, EFDD).
 *
 * Bias: the Hann window of the Welch segments multiplies the correlation function by the
 * window's own correlation, which adds apparent decay; with the half-power bandwidth under
 * ~1.5 lines EFDD damping reads high (often +50 % to +300 %). It is reported, not corrected.
 *
 * [1] Brincker, Ventura & Andersen, Proc. IMAC XIX, 2001.
 */
import { getRealFft } from "@/lib/numeric/fft";
import { assertComplexVector, type ComplexVector } from "@/lib/numeric/complex";
import { assertInRange, assertInteger, assertNumberArray, assertPositive } from "@/lib/numeric/validate";
import { macWithVector, type FddDecomposition } from "./fdd";

export interface DecrementResult {
  frequencyHz: number;
  dampedFrequencyHz: number;
  dampingRatio: number;
  logDecrement: number;
  /** Number of extrema used in the fit. */
  extremaUsed: number;
}

export interface EfddResult extends DecrementResult {
  /** Lines in the bell. */
  bellLines: number;
  /** Lowest and highest line of the bell. */
  bellRange: [number, number];
}

/**
 * Logarithmic decrement and damped frequency of a decaying correlation function.
 *
 * @param r - correlation samples r(k·dt), r(0) > 0, length ≥ 8, finite.
 * @param dt - sample interval in s, > 0.
 * @param upper - upper bound of |extremum|/r(0) used, in (lower, 1]; default 0.9 [practice].
 * @param lower - lower bound, in (0, upper); default 0.3 [practice].
 * @returns frequency (undamped, Hz), damped frequency, ζ and δ; null when fewer than 3
 *   extrema or 2 zero crossings fall in the range.
 * @throws TypeError / RangeError for bad arguments.
 */
export function fitLogDecrement(r: ArrayLike<number>, dt: number, upper = 0.9, lower = 0.3): DecrementResult | null {
  assertNumberArray(r, "r", 8);
  assertPositive(dt, "dt");
  assertInRange(upper, "upper", 0, 1);
  assertInRange(lower, "lower", 0, 1);
  if (!(lower < upper)) throw new RangeError(`lower must be < upper (got ${lower} ≥ ${upper})`);
  if (!(r[0] > 0)) throw new RangeError(`r[0] must be > 0 (got ${r[0]})`);
  // Zero crossings (linear interpolation) delimit half-cycles; the extremum of each
  // half-cycle is refined by a parabola.
  const crossings: number[] = [];
  for (let k = 0; k < r.length - 1; k++) {
    if ((r[k] > 0 && r[k + 1] <= 0) || (r[k] < 0 && r[k + 1] >= 0)) crossings.push(k + r[k] / (r[k] - r[k + 1]));
  }
  const extrema: { t: number; a: number }[] = [{ t: 0, a: 1 }];
  for (let c = 0; c + 1 < crossings.length; c++) {
    const lo = Math.ceil(crossings[c]), hi = Math.floor(crossings[c + 1]);
    let best = lo;
    for (let k = lo; k <= hi; k++) if (Math.abs(r[k]) > Math.abs(r[best])) best = k;
    extrema.push({ t: best, a: Math.abs(refinedPeak(r, best)) / r[0] });
  }
  const used: number[] = [];
  let first = -1;
  for (let m = 0; m < extrema.length; m++) {
    const a = extrema[m].a;
    if (a > upper) continue;
    if (a < lower) break;
    if (first < 0) first = m;
    used.push(m);
  }
  if (used.length < 3) return null;
  // ln|r_m| = c − m·δ/2 (extrema every half period)
  const slope = lineFit(used, used.map((m) => Math.log(extrema[m].a)));
  const delta = -2 * slope;
  if (!(delta > 0)) return null;
  // Zero crossings between the first and last used extrema: t_c = t₀ + c·T_d/2
  const tFirst = extrema[used[0]].t, tLast = extrema[used[used.length - 1]].t;
  const cIdx: number[] = [], cT: number[] = [];
  crossings.forEach((t, c) => {
    if (t >= tFirst && t <= tLast) {
      cIdx.push(c);
      cT.push(t * dt);
    }
  });
  if (cIdx.length < 2) return null;
  const halfPeriod = lineFit(cIdx, cT);
  const fd = 1 / (2 * halfPeriod);
  const zeta = delta / Math.sqrt(4 * Math.PI * Math.PI + delta * delta);
  return { frequencyHz: fd / Math.sqrt(1 - zeta * zeta), dampedFrequencyHz: fd, dampingRatio: zeta, logDecrement: delta, extremaUsed: used.length };
}

/**
 * EFDD estimate of one mode.
 *
 * @param fdd - decomposition with ≥ 1 vector per line (3 recommended).
 * @param peakLine - line of the mode's peak, 1 … nLines−2.
 * @param shape - complex reference shape (usually the singular vector at the peak), length n.
 * @param macThreshold - MAC for a line to join the bell, (0, 1]; default 0.8 [practice].
 * @returns the estimate with the bell extent, or null when the correlation function has
 *   too few extrema in [0.3, 0.9] (bell too narrow or damping too high for the segment).
 * @throws TypeError / RangeError for bad arguments.
 */
export function estimateEfdd(fdd: FddDecomposition, peakLine: number, shape: ComplexVector, macThreshold = 0.8): EfddResult | null {
  if (typeof fdd !== "object" || fdd === null || !Array.isArray(fdd.singularValues)) throw new TypeError("fdd must be an FddDecomposition");
  assertInteger(peakLine, "peakLine", 1, fdd.nLines - 2);
  assertComplexVector(shape, "shape", fdd.nChannels);
  if (shape.re.length !== fdd.nChannels) throw new RangeError(`shape must have ${fdd.nChannels} components (got ${shape.re.length})`);
  assertInRange(macThreshold, "macThreshold", Number.MIN_VALUE, 1);
  const ranks = Math.min(fdd.nVectors, fdd.singularValues.length);
  const bell = new Float64Array(fdd.nLines);
  const take = (k: number): boolean => {
    let bestMac = 0;
    let bestR = -1;
    for (let r = 0; r < ranks; r++) {
      const m = macWithVector(fdd, k, r, shape.re, shape.im);
      if (m > bestMac) {
        bestMac = m;
        bestR = r;
      }
    }
    if (bestMac < macThreshold || bestR < 0) return false;
    bell[k] = fdd.singularValues[bestR][k];
    return true;
  };
  if (!take(peakLine)) bell[peakLine] = fdd.singularValues[0][peakLine];
  let lo = peakLine, hi = peakLine;
  while (lo > 1 && take(lo - 1)) lo--;
  while (hi < fdd.nLines - 2 && take(hi + 1)) hi++;
  const nfft = 2 * (fdd.nLines - 1);
  const corr = new Float64Array(nfft);
  getRealFft(nfft).inverseHalf(bell, new Float64Array(fdd.nLines), corr);
  const fit = fitLogDecrement(corr.subarray(0, nfft / 2), 1 / fdd.sampleRateHz);
  if (!fit) return null;
  return { ...fit, bellLines: hi - lo + 1, bellRange: [lo, hi] };
}

function refinedPeak(r: ArrayLike<number>, k: number): number {
  if (k <= 0 || k >= r.length - 1) return r[k];
  const a = r[k - 1], b = r[k], c = r[k + 1];
  const den = a - 2 * b + c;
  if (den === 0) return b;
  const p = Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / den));
  return b - 0.25 * (a - c) * p;
}

/** Least-squares slope of y on x. */
function lineFit(x: number[], y: number[]): number {
  const n = x.length;
  let mx = 0, my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxy = 0, sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
  }
  return sxy / sxx;
}
