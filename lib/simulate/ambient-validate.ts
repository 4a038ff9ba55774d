/**
 * Validation gate of simulateAmbientRecord (CONVENTIONS.md §7), kept apart so the
 * simulator file holds only the algorithm.
 */
import { assertFiniteNumber, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import type { AmbientOptions } from "./ambient";

/** Throws TypeError/RangeError naming the rule and the value for a bad option. */
export function validateAmbientOptions(opts: AmbientOptions): void {
  if (typeof opts !== "object" || opts === null) throw new TypeError(`opts must be an object (got ${describe(opts)})`);
  if (!Array.isArray(opts.modes) || opts.modes.length === 0) {
    throw new TypeError(`opts.modes must be a non-empty array (got ${describe(opts.modes)})`);
  }
  assertPositive(opts.sampleRateHz, "sampleRateHz");
  assertPositive(opts.durationS, "durationS");
  assertFiniteNumber(opts.seed, "seed");
  const n = Math.round(opts.durationS * opts.sampleRateHz);
  if (n < 16) throw new RangeError(`durationS·sampleRateHz must give ≥ 16 samples (got ${n})`);
  if (n > 5e7) throw new RangeError(`durationS·sampleRateHz must give ≤ 5e7 samples (got ${n})`);
  const nCh = opts.modes[0]?.shape?.length;
  opts.modes.forEach((m, j) => {
    if (typeof m !== "object" || m === null) throw new TypeError(`modes[${j}] must be an object (got ${describe(m)})`);
    assertPositive(m.frequencyHz, `modes[${j}].frequencyHz`);
    assertFiniteNumber(m.dampingRatio, `modes[${j}].dampingRatio`);
    if (!(m.dampingRatio > 0 && m.dampingRatio < 1)) {
      throw new RangeError(`modes[${j}].dampingRatio must be within (0, 1) (got ${m.dampingRatio})`);
    }
    assertNumberArray(m.shape, `modes[${j}].shape`);
    if (m.shape.length !== nCh) throw new RangeError(`modes[${j}].shape must have ${nCh} entries like modes[0] (got ${m.shape.length})`);
  });
  if (nCh > 1024) throw new RangeError(`mode shapes must have at most 1024 channels (got ${nCh})`);
  if (opts.snrDb !== undefined && opts.snrDb !== Infinity) assertFiniteNumber(opts.snrDb, "snrDb");
  if (opts.modalForceStd !== undefined) {
    assertNumberArray(opts.modalForceStd, "modalForceStd");
    if (opts.modalForceStd.length !== opts.modes.length) {
      throw new RangeError(`modalForceStd must have one entry per mode (got ${opts.modalForceStd.length} ≠ ${opts.modes.length})`);
    }
    opts.modalForceStd.forEach((s, j) => {
      if (s < 0) throw new RangeError(`modalForceStd[${j}] must be ≥ 0 (got ${s})`);
    });
  }
  if (opts.stiffnessFactor !== undefined) assertPositive(opts.stiffnessFactor, "stiffnessFactor");
  if (opts.quantity !== undefined && !["acceleration", "velocity", "displacement"].includes(opts.quantity)) {
    throw new TypeError(`quantity must be "acceleration", "velocity" or "displacement" (got ${describe(opts.quantity)})`);
  }
  if (opts.defects !== undefined && !Array.isArray(opts.defects)) {
    throw new TypeError(`defects must be an array (got ${describe(opts.defects)})`);
  }
}
