/**
 * One-to-one assignment of a record's identified modes to an asset's tracked modes.
 *
 * Method: a linear assignment problem [1] on the cost
 *   c_ij = w_f·|f_i − f⁰_j| / (f_hi,j − f_lo,j) + w_s·(1 − MAC(φ_i, φ⁰_j)),
 * with gates: f_i inside the band [f_lo,j, f_hi,j] of tracked mode j and MAC ≥ minMac
 * (0.8 [practice], the usual consistency threshold of MAC [2]). The frequency term is the
 * distance in band widths, so both terms lie in [0, 1] for a pair that passes the gates.
 * A gated-out pair costs B = (n+1)(w_f+w_s) + 1, more than any n feasible pairs together,
 * so the optimum first maximises the number of assigned tracked modes and then minimises the
 * total cost; pairs left at B are "not identified". Solved exactly by the Hungarian method
 * with potentials (Kuhn–Munkres; O(n²m) for n ≤ m) [1][3].
 *
 * Reference shapes may be partial: NaN entries (channels the reference does not cover) are
 * left out of the MAC; with fewer than 2 shared finite entries the MAC gate is skipped and
 * the pair is judged on frequency alone (mac: null).
 *
 * [1] Kuhn, The Hungarian method for the assignment problem, Naval Res. Logist. Q. 2, 1955;
 *     Munkres, J. SIAM 5(1), 1957.
 * [2] Allemang & Brown, Proc. IMAC I, 1982 (MAC).
 * [3] Burkard, Dell'Amico & Martello, Assignment Problems, SIAM 2009, §4.
 */
import { assertComplexVector, type ComplexVector } from "@/lib/numeric/complex";
import { assertInRange, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";

/** A tracked mode as the assignment sees it. */
export interface AssignTarget {
  /** Nominal frequency, Hz > 0, inside [bandLowHz, bandHighHz]. */
  nominalFrequencyHz: number;
  /** Search band, Hz, 0 < bandLowHz < bandHighHz. */
  bandLowHz: number;
  bandHighHz: number;
  /** Reference shape over the candidates' channels (same length), NaN where unknown; null = none. */
  referenceShape: ArrayLike<number> | null;
}

/** An identified mode. */
export interface AssignCandidate {
  /** Natural frequency, Hz > 0. */
  frequencyHz: number;
  /** Complex (or real, im = 0) shape over the channels, length = channel count. */
  shape: ComplexVector;
}

export interface AssignOptions {
  /** MAC gate, [0, 1]; default 0.8 [practice]. */
  minMac?: number;
  /** Weight of the frequency term, > 0; default 1. */
  frequencyWeight?: number;
  /** Weight of the 1 − MAC term, ≥ 0; default 1. */
  shapeWeight?: number;
}

/** The outcome for one tracked mode (same order as the targets). */
export interface AssignOutcome {
  /** Index of the assigned candidate, or null (not identified). */
  mode: number | null;
  /** MAC against the reference shape (null: not assigned, or no reference to compare). */
  mac: number | null;
  /** (f − f⁰)/f⁰ of the assigned candidate, or null. */
  frequencyDeviation: number | null;
  /** c_ij of the assigned pair, or null. */
  cost: number | null;
}

export interface AssignResult {
  /** One entry per target, in target order. */
  assignments: AssignOutcome[];
  /** Candidate indices not assigned to any target, ascending. */
  unassigned: number[];
}

/**
 * Assigns identified modes to tracked modes, one to one, with band and MAC gates.
 *
 * @param targets - tracked modes (0…n); each reference shape has the candidates' length.
 * @param candidates - identified modes (0…m), all shapes of one length ≥ 1.
 * @param options - gate and weights, see {@link AssignOptions}.
 * @returns per target the assigned candidate (or null) with MAC, deviation and cost, and
 *   the candidates left unassigned.
 * @throws TypeError for non-numeric input; RangeError for a bad band, a shape length that
 *   differs, or an option out of range.
 */
export function assignModes(targets: AssignTarget[], candidates: AssignCandidate[], options: AssignOptions = {}): AssignResult {
  const { minMac, wf, ws } = validate(targets, candidates, options);
  const n = targets.length;
  const m = candidates.length;
  const big = (n + 1) * (wf + ws) + 1;
  const cost: number[][] = [];
  const macs: (number | null)[][] = [];
  for (let j = 0; j < n; j++) {
    const t = targets[j];
    cost.push([]);
    macs.push([]);
    for (let i = 0; i < m; i++) {
      const c = candidates[i];
      const mc = t.referenceShape ? partialMac(t.referenceShape, c.shape) : null;
      macs[j].push(mc);
      const inBand = c.frequencyHz >= t.bandLowHz && c.frequencyHz <= t.bandHighHz;
      const shapeOk = mc === null || mc >= minMac;
      const df = Math.abs(c.frequencyHz - t.nominalFrequencyHz) / (t.bandHighHz - t.bandLowHz);
      cost[j].push(inBand && shapeOk ? wf * df + ws * (1 - (mc ?? 1)) : big);
    }
  }
  const match = solveAssignment(cost, n, m);
  const used = new Set<number>();
  const assignments = targets.map((t, j): AssignOutcome => {
    const i = match[j];
    if (i < 0 || cost[j][i] >= big) return { mode: null, mac: null, frequencyDeviation: null, cost: null };
    used.add(i);
    const f = candidates[i].frequencyHz;
    return { mode: i, mac: macs[j][i], frequencyDeviation: (f - t.nominalFrequencyHz) / t.nominalFrequencyHz, cost: cost[j][i] };
  });
  const unassigned: number[] = [];
  for (let i = 0; i < m; i++) if (!used.has(i)) unassigned.push(i);
  return { assignments, unassigned };
}

/** MAC over the entries where the reference is finite; null with fewer than 2 such entries or a zero part. */
function partialMac(ref: ArrayLike<number>, shape: ComplexVector): number | null {
  let cr = 0, ci = 0, aa = 0, bb = 0, k = 0;
  for (let c = 0; c < ref.length; c++) {
    const r = ref[c];
    if (!Number.isFinite(r)) continue;
    const br = shape.re[c], bi = shape.im[c];
    cr += r * br;
    ci += r * bi;
    aa += r * r;
    bb += br * br + bi * bi;
    k++;
  }
  if (k < 2 || aa === 0 || bb === 0) return null;
  return Math.min(1, (cr * cr + ci * ci) / (aa * bb));
}

/**
 * Minimum-cost assignment of n rows to distinct columns of an n×m cost matrix (Hungarian
 * method with row/column potentials, shortest augmenting paths). Pads with zero-cost dummy
 * columns when m < n. Returns, per row, its column or −1 (a dummy column).
 */
export function solveAssignment(cost: number[][], n: number, m: number): number[] {
  if (n === 0) return [];
  const cols = Math.max(n, m);
  const a = (r: number, c: number) => (c < m ? cost[r][c] : 0);
  // 1-based potentials u (rows), v (columns); p[c] = row matched to column c (0 = none).
  const u = new Float64Array(n + 1);
  const v = new Float64Array(cols + 1);
  const p = new Int32Array(cols + 1);
  const way = new Int32Array(cols + 1);
  for (let r = 1; r <= n; r++) {
    p[0] = r;
    let c0 = 0;
    const minv = new Float64Array(cols + 1).fill(Infinity);
    const usedCol = new Uint8Array(cols + 1);
    do {
      usedCol[c0] = 1;
      const r0 = p[c0];
      let delta = Infinity;
      let c1 = 0;
      for (let c = 1; c <= cols; c++) {
        if (usedCol[c]) continue;
        const cur = a(r0 - 1, c - 1) - u[r0] - v[c];
        if (cur < minv[c]) {
          minv[c] = cur;
          way[c] = c0;
        }
        if (minv[c] < delta) {
          delta = minv[c];
          c1 = c;
        }
      }
      for (let c = 0; c <= cols; c++) {
        if (usedCol[c]) {
          u[p[c]] += delta;
          v[c] -= delta;
        } else minv[c] -= delta;
      }
      c0 = c1;
    } while (p[c0] !== 0);
    do {
      const c1 = way[c0];
      p[c0] = p[c1];
      c0 = c1;
    } while (c0 !== 0);
  }
  const rowToCol = new Array<number>(n).fill(-1);
  for (let c = 1; c <= cols; c++) if (p[c] > 0 && c <= m) rowToCol[p[c] - 1] = c - 1;
  return rowToCol;
}

function validate(targets: AssignTarget[], candidates: AssignCandidate[], o: AssignOptions): { minMac: number; wf: number; ws: number } {
  if (!Array.isArray(targets)) throw new TypeError(`targets must be an array (got ${describe(targets)})`);
  if (!Array.isArray(candidates)) throw new TypeError(`candidates must be an array (got ${describe(candidates)})`);
  const minMac = o.minMac ?? 0.8;
  assertInRange(minMac, "minMac", 0, 1);
  const wf = o.frequencyWeight ?? 1;
  assertPositive(wf, "frequencyWeight");
  const ws = o.shapeWeight ?? 1;
  assertInRange(ws, "shapeWeight", 0, Number.MAX_VALUE);
  let len = -1;
  candidates.forEach((c, i) => {
    assertPositive(c?.frequencyHz, `candidates[${i}].frequencyHz`);
    assertComplexVector(c.shape, `candidates[${i}].shape`);
    if (len >= 0 && c.shape.re.length !== len) {
      throw new RangeError(`candidates[${i}].shape must have the length of candidates[0].shape (got ${c.shape.re.length} ≠ ${len})`);
    }
    len = c.shape.re.length;
  });
  targets.forEach((t, j) => {
    assertPositive(t?.bandLowHz, `targets[${j}].bandLowHz`);
    assertPositive(t.bandHighHz, `targets[${j}].bandHighHz`);
    if (!(t.bandLowHz < t.bandHighHz)) throw new RangeError(`targets[${j}] band must have bandLowHz < bandHighHz (got ${t.bandLowHz} ≥ ${t.bandHighHz})`);
    assertInRange(t.nominalFrequencyHz, `targets[${j}].nominalFrequencyHz`, t.bandLowHz, t.bandHighHz);
    if (t.referenceShape !== null) {
      assertNumberArray(t.referenceShape, `targets[${j}].referenceShape`, 1, false);
      if (len >= 0 && t.referenceShape.length !== len) {
        throw new RangeError(`targets[${j}].referenceShape must have the candidates' shape length (got ${t.referenceShape.length} ≠ ${len})`);
      }
    }
  });
  return { minMac, wf, ws };
}
