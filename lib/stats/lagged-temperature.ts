/**
 * Lagged (trailing moving-average) temperature for the baseline models.
 *
 * A structure's stiffness follows its own temperature, which lags the measured air or
 * surface temperature by hours [1]; a trailing mean over the previous `windowHours` is the
 * simplest lag model that needs no extra parameter to fit.
 *
 * [1] Peeters & De Roeck, Earthquake Eng. Struct. Dyn. 30(2):149–171, 2001.
 */
import { assertNumberArray, assertPositive } from "@/lib/numeric/validate";

/**
 * Trailing moving average of temperature: for each i the mean of the samples j with
 * t_i − W < t_j ≤ t_i (the sample itself always counts).
 *
 * @param timesMs - sample times in ms UTC, non-decreasing, finite; not mutated.
 * @param temperatureC - temperatures in °C, same length, finite.
 * @param windowHours - window W in hours, > 0 (e.g. 6–48).
 * @returns averaged temperatures in °C, same length. Cost O(n) (two pointers).
 * @throws TypeError for non-arrays or non-finite entries; RangeError for unequal lengths,
 *   decreasing times or W ≤ 0.
 */
export function laggedTemperature(timesMs: ArrayLike<number>, temperatureC: ArrayLike<number>, windowHours: number): Float64Array {
  assertNumberArray(timesMs, "timesMs");
  assertNumberArray(temperatureC, "temperatureC");
  assertPositive(windowHours, "windowHours");
  const n = timesMs.length;
  if (temperatureC.length !== n) throw new RangeError(`temperatureC must have the length of timesMs (got ${temperatureC.length} ≠ ${n})`);
  for (let i = 1; i < n; i++) {
    if (timesMs[i] < timesMs[i - 1]) throw new RangeError(`timesMs must be non-decreasing (got ${timesMs[i]} < ${timesMs[i - 1]} at index ${i})`);
  }
  const w = windowHours * 3_600_000;
  const out = new Float64Array(n);
  let lo = 0;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    sum += temperatureC[i];
    while (timesMs[lo] <= timesMs[i] - w) sum -= temperatureC[lo++];
    out[i] = sum / (i - lo + 1);
  }
  return out;
}
