/**
 * Pairs the modes of a forced test with the ambient (output-only) modes of the same
 * structure and reports their agreement: MAC [1] and frequency difference.
 *
 * Each forced-test mode is paired with the ambient mode of highest MAC among those within
 * the frequency window; the window guards against pairing by shape alone when a sensor
 * layout is too sparse to tell modes apart. Internal conventions: shapes over the same
 * channels in the same order (the caller aligns channel codes).
 *
 * [1] Allemang & Brown, Proc. IMAC I, 1982 (MAC).
 */
import { assertComplexVector, type ComplexVector } from "@/lib/numeric/complex";
import { assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import { mac } from "./mac";

/** One pairing of a forced-test mode with an ambient mode. */
export interface ModePairing {
  /** Index into the forced-test modes. */
  forcedIndex: number;
  /** Index into the ambient modes, or null when none lies within the window. */
  ambientIndex: number | null;
  /** MAC between the shapes, [0, 1]; null without a partner. */
  mac: number | null;
  /** 100·(f_ambient − f_forced)/f_forced in %; null without a partner. */
  frequencyDifferencePct: number | null;
}

/**
 * Pairs forced-test modes with ambient modes by MAC within a relative frequency window.
 *
 * @param forced - modes with `frequencyHz` (> 0) and a real `shape` (length n ≥ 1).
 * @param ambient - modes with `frequencyHz` (> 0) and a complex `shape` of length n.
 * @param windowPct - largest |frequency difference| in % to consider, > 0, default 10.
 * @returns one pairing per forced-test mode, in its order.
 * @throws TypeError for malformed modes; RangeError for shapes of another length than the
 *   first forced shape or a non-positive window.
 */
export function compareFrfWithAmbient(
  forced: readonly { frequencyHz: number; shape: ArrayLike<number> }[],
  ambient: readonly { frequencyHz: number; shape: ComplexVector }[],
  windowPct = 10,
): ModePairing[] {
  if (!Array.isArray(forced)) throw new TypeError(`forced must be an array of modes (got ${describe(forced)})`);
  if (!Array.isArray(ambient)) throw new TypeError(`ambient must be an array of modes (got ${describe(ambient)})`);
  assertPositive(windowPct, "windowPct");
  const n = forced[0]?.shape?.length ?? ambient[0]?.shape?.re?.length ?? 0;
  forced.forEach((m, i) => {
    assertPositive(m?.frequencyHz, `forced[${i}].frequencyHz`);
    assertNumberArray(m.shape, `forced[${i}].shape`);
    if (m.shape.length !== n) throw new RangeError(`forced[${i}].shape must have ${n} entries (got ${m.shape.length})`);
  });
  ambient.forEach((m, i) => {
    assertPositive(m?.frequencyHz, `ambient[${i}].frequencyHz`);
    assertComplexVector(m.shape, `ambient[${i}].shape`);
    if (m.shape.re.length !== n) throw new RangeError(`ambient[${i}].shape must have ${n} entries (got ${m.shape.re.length})`);
  });
  return forced.map((fm, forcedIndex) => {
    const real = { re: fm.shape, im: new Float64Array(n) };
    let bestIdx: number | null = null;
    let bestMac = -1;
    ambient.forEach((am, j) => {
      if (Math.abs(am.frequencyHz / fm.frequencyHz - 1) * 100 > windowPct) return;
      const m = mac(real, am.shape);
      if (m > bestMac) {
        bestMac = m;
        bestIdx = j;
      }
    });
    if (bestIdx === null) return { forcedIndex, ambientIndex: null, mac: null, frequencyDifferencePct: null };
    const fa = ambient[bestIdx as number].frequencyHz;
    return { forcedIndex, ambientIndex: bestIdx, mac: bestMac, frequencyDifferencePct: (100 * (fa - fm.frequencyHz)) / fm.frequencyHz };
  });
}
