/**
 * Unit conversion of acceleration records to m/s² (the library's working unit).
 * Standard gravity g_n = 9.80665 m/s² exactly (ISO 80000-3; CGPM 1901).
 */
import { assertNumberArray } from "@/lib/numeric/validate";

/** Standard acceleration of gravity in m/s² (exact by definition). */
export const STANDARD_GRAVITY = 9.80665;

/** Acceleration units accepted by the upload contract. */
export type AccelerationUnit = "m/s2" | "g" | "mg";

/** Factor from `unit` to m/s². @throws RangeError for an unknown unit. */
export function accelerationFactor(unit: AccelerationUnit): number {
  switch (unit) {
    case "m/s2":
      return 1;
    case "g":
      return STANDARD_GRAVITY;
    case "mg":
      return STANDARD_GRAVITY / 1000;
    default:
      throw new RangeError(`unit must be one of m/s2, g, mg (got ${JSON.stringify(unit)})`);
  }
}

/**
 * Converts samples in `unit` to m/s².
 * @param x - samples, length ≥ 1 (non-finite values pass through unchanged for screening).
 * @param unit - 'm/s2', 'g' or 'mg'.
 * @returns a new Float64Array in m/s².
 * @throws TypeError for non-numeric input; RangeError for an unknown unit or empty input.
 */
export function toMetresPerSecondSquared(x: ArrayLike<number>, unit: AccelerationUnit): Float64Array {
  const f = accelerationFactor(unit);
  assertNumberArray(x, "x", 1, false);
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) out[i] = x[i] * f;
  return out;
}
