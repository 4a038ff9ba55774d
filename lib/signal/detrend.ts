/**
 * Trend removal (as SciPy's `signal.detrend`, type 'constant' and 'linear').
 * Offsets and slow drift of accelerometers would otherwise leak into the lowest spectral
 * lines and bias the lowest modes.
 */
import { assertNumberArray } from "@/lib/numeric/validate";

/**
 * Removes the mean.
 * @param x - samples, length ≥ 1, finite. Not mutated.
 * @returns a new Float64Array x − mean(x).
 * @throws TypeError for non-numeric or non-finite input; RangeError when empty.
 */
export function removeMean(x: ArrayLike<number>): Float64Array {
  assertNumberArray(x, "x", 1);
  let m = 0;
  for (let i = 0; i < x.length; i++) m += x[i];
  m /= x.length;
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = x[i] - m;
  return out;
}

/**
 * Removes the least-squares straight line a + b·i.
 * @param x - samples, length ≥ 2, finite. Not mutated.
 * @returns a new Float64Array of the residual.
 * @throws TypeError for non-numeric or non-finite input; RangeError when shorter than 2.
 */
export function removeLinearTrend(x: ArrayLike<number>): Float64Array {
  assertNumberArray(x, "x", 2);
  const n = x.length;
  const tm = (n - 1) / 2;
  let ym = 0;
  for (let i = 0; i < n; i++) ym += x[i];
  ym /= n;
  let sxy = 0, sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (i - tm) * (x[i] - ym);
    sxx += (i - tm) * (i - tm);
  }
  const b = sxy / sxx;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = x[i] - ym - b * (i - tm);
  return out;
}
