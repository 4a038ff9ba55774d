/**
 * Spectral windows.
 *
 * The periodic Hann window w[n] = 0.5 − 0.5·cos(2πn/N) is the DFT-even form SciPy's
 * `get_window('hann', N)` returns (fftbins=True), the default of `scipy.signal.welch/csd`.
 * Using the same form keeps our estimates comparable with SciPy to rounding error.
 */
import { assertInteger } from "@/lib/numeric/validate";

/**
 * Periodic (DFT-even) Hann window.
 *
 * @param length - number of samples N, integer ≥ 2.
 * @returns Float64Array of length N, values in [0, 1], w[0] = 0.
 * @throws TypeError / RangeError for a non-integer or N < 2.
 */
export function hannPeriodic(length: number): Float64Array {
  assertInteger(length, "length", 2);
  const w = new Float64Array(length);
  for (let i = 0; i < length; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / length);
  return w;
}
