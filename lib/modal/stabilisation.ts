/**
 * Stability classification of poles across model orders (the stabilisation diagram) [1].
 *
 * Each pole of order n is compared with the pole of the previous order (n − step) nearest
 * in frequency. It is stable in frequency when |Δf|/f ≤ 1 %, in damping when |Δζ|/ζ ≤ 5 %,
 * and in shape when MAC ≥ 0.98 [2, practice]. The labels follow the usual diagram legend:
 * 'new' (no frequency match), 'f', 'fd' (frequency and damping), 'fv' (frequency and
 * vector), 'fdv' (all three). Internal helper of ssi-cov.ts.
 *
 * [1] Peeters & De Roeck, MSSP 13(6):855–878, 1999.
 * [2] REFERENCES.md §Modal identification: Δf ≤ 1 %, Δζ ≤ 5 %, MAC ≥ 0.98 [practice].
 */
import { mac } from "./mac";
import type { SsiPole } from "./ssi-poles";

/** Stability label of a pole relative to the previous order. */
export type StabilityLabel = "new" | "f" | "fd" | "fv" | "fdv";

/** Tolerances between consecutive orders. */
export interface StabilityTolerances {
  /** Relative frequency change, default 0.01. */
  frequency: number;
  /** Relative damping change, default 0.05. */
  damping: number;
  /** Minimum MAC, default 0.98. */
  mac: number;
}

export const DEFAULT_STABILITY: StabilityTolerances = { frequency: 0.01, damping: 0.05, mac: 0.98 };

/** A pole with its stability label. */
export interface LabelledPole extends SsiPole {
  stable: StabilityLabel;
}

/** Labels every pole against the previous order's poles (the first order is all 'new'). */
export function labelPoles(byOrder: readonly SsiPole[][], tol: StabilityTolerances): LabelledPole[][] {
  return byOrder.map((poles, oi) => {
    const prev = oi > 0 ? byOrder[oi - 1] : [];
    return poles.map((p) => ({ ...p, stable: labelOne(p, prev, tol) }));
  });
}

function labelOne(p: SsiPole, prev: readonly SsiPole[], tol: StabilityTolerances): StabilityLabel {
  let best: SsiPole | null = null;
  let bestDf = Infinity;
  for (const q of prev) {
    const df = Math.abs(q.frequencyHz - p.frequencyHz) / p.frequencyHz;
    if (df < bestDf) {
      bestDf = df;
      best = q;
    }
  }
  if (best === null || bestDf > tol.frequency) return "new";
  const dOk = Math.abs(best.dampingRatio - p.dampingRatio) <= tol.damping * Math.abs(p.dampingRatio);
  const vOk = mac(best.shape, p.shape) >= tol.mac;
  return dOk ? (vOk ? "fdv" : "fd") : vOk ? "fv" : "f";
}
