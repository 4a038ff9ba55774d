/**
 * Automatic selection of physical modes from the stabilisation diagram by clustering the
 * stable poles [1, 2].
 *
 * Distance between two poles: d = |f_a − f_b| / max(f_a, f_b) + (1 − MAC(φ_a, φ_b)), so two
 * modes 1 % apart with different shapes stay apart (their 1 − MAC is large) while the
 * repeated estimates of one mode over the orders, which agree to a fraction of a percent
 * in frequency and MAC ≈ 1, merge. Average-linkage (UPGMA) agglomeration stops at a
 * distance threshold; a cluster counts as a mode when it holds at least `minClusterSize`
 * poles (physical modes recur over many orders, spurious ones do not). Since d ≥ |Δf|/f,
 * poles separated in frequency by more than the threshold can only join through averaging
 * with intermediate poles; the sorted frequency axis is therefore cut at gaps larger than
 * the threshold and each segment is clustered on its own, which keeps the O(m³)
 * agglomeration on small groups. Internal helper of ssi-cov.ts.
 *
 * [1] Peeters & De Roeck, MSSP 13(6):855–878, 1999 (stabilisation diagram).
 * [2] Reynders, Houbrechts & De Roeck, "Fully automated (operational) modal analysis",
 *     MSSP 29:228–250, 2012 (hierarchical clustering of stable poles).
 */
import { mac } from "./mac";
import type { LabelledPole } from "./stabilisation";

/** Clusters (arrays of poles) that reached the minimum size, ascending in frequency. */
export function clusterPoles(poles: readonly LabelledPole[], threshold: number, minClusterSize: number): LabelledPole[][] {
  const sorted = [...poles].sort((a, b) => a.frequencyHz - b.frequencyHz);
  const out: LabelledPole[][] = [];
  let start = 0;
  for (let k = 1; k <= sorted.length; k++) {
    const gap = k === sorted.length || (sorted[k].frequencyHz - sorted[k - 1].frequencyHz) / sorted[k].frequencyHz > threshold;
    if (gap) {
      for (const c of averageLinkage(sorted.slice(start, k), threshold)) if (c.length >= minClusterSize) out.push(c);
      start = k;
    }
  }
  return out.sort((a, b) => median(a.map((p) => p.frequencyHz)) - median(b.map((p) => p.frequencyHz)));
}

function distance(a: LabelledPole, b: LabelledPole): number {
  return Math.abs(a.frequencyHz - b.frequencyHz) / Math.max(a.frequencyHz, b.frequencyHz) + (1 - mac(a.shape, b.shape));
}

/** UPGMA with the Lance–Williams update, merging while the closest pair is ≤ threshold. */
function averageLinkage(group: readonly LabelledPole[], threshold: number): LabelledPole[][] {
  const m = group.length;
  if (m <= 1) return m === 1 ? [[group[0]]] : [];
  const d = new Float64Array(m * m);
  for (let a = 0; a < m; a++) for (let b = a + 1; b < m; b++) d[a * m + b] = d[b * m + a] = distance(group[a], group[b]);
  const members: (number[] | null)[] = group.map((_, a) => [a]);
  for (;;) {
    let best = Infinity, ba = -1, bb = -1;
    for (let a = 0; a < m; a++) {
      if (!members[a]) continue;
      for (let b = a + 1; b < m; b++) {
        if (members[b] && d[a * m + b] < best) {
          best = d[a * m + b];
          ba = a;
          bb = b;
        }
      }
    }
    if (ba < 0 || best > threshold) break;
    const ma = members[ba] ?? [], mb = members[bb] ?? [];
    const na = ma.length, nb = mb.length;
    for (let k = 0; k < m; k++) {
      if (!members[k] || k === ba || k === bb) continue;
      const v = (na * d[k * m + ba] + nb * d[k * m + bb]) / (na + nb);
      d[k * m + ba] = d[ba * m + k] = v;
    }
    members[ba] = [...ma, ...mb];
    members[bb] = null;
  }
  return members.filter((x): x is number[] => x !== null).map((idx) => idx.map((i) => group[i]));
}

/** Median of a non-empty list. */
export function median(x: readonly number[]): number {
  const s = [...x].sort((a, b) => a - b);
  const h = s.length >> 1;
  return s.length % 2 ? s[h] : 0.5 * (s[h - 1] + s[h]);
}
