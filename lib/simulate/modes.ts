/**
 * Shared types and small helpers of the simulators: a real normal mode and the
 * normalisation every closed-form model applies to its shapes.
 */

/** A real (classical) normal mode of a structure, sampled at the sensor positions. */
export interface StructuralMode {
  /** Undamped natural frequency in Hz. */
  frequencyHz: number;
  /** Mode shape at the sensors (dimensionless), max |φᵢ| = 1, last (top/tip) entry ≥ 0. */
  shape: number[];
}

/**
 * Normalises a real shape so that max |φᵢ| = 1 and the sign makes the last entry positive
 * (the top storey or the free tip); when that entry is (numerically) zero, the largest
 * entry is made positive instead. Internal helper: trusts its caller (non-zero vector).
 */
export function normaliseShape(v: ArrayLike<number>): number[] {
  let maxAbs = 0;
  let argMax = 0;
  for (let i = 0; i < v.length; i++) {
    if (Math.abs(v[i]) > maxAbs) {
      maxAbs = Math.abs(v[i]);
      argMax = i;
    }
  }
  const last = v[v.length - 1];
  // "Zero" relative to the largest entry: a node of the mode at the last sensor.
  const ref = Math.abs(last) > 1e-9 * maxAbs ? last : v[argMax];
  const scale = (ref < 0 ? -1 : 1) / maxAbs;
  return Array.from(v, (x) => x * scale);
}
