/**
 * Reference-based covariance-driven stochastic subspace identification (SSI-COV) with an
 * automatic reading of the stabilisation diagram [1].
 *
 * Steps: optional zero-phase decimation (lib/signal/decimate) → centre the channels → output correlations R_1…R_{2i−1} against r reference
 * channels → block Toeplitz T_{1|i} (li × ri) → SVD → for orders n = 2, 4, …, maxOrder the
 * state matrix from the shift structure of the observability matrix and C from its first
 * block row → poles λ = ln(μ)/Δt, f = |λ|/2π, ζ = −Re λ/|λ|, shapes C·ψ → stability labels
 * between consecutive orders (Δf ≤ 1 %, Δζ ≤ 5 %, MAC ≥ 0.98 [2]) → clustering of the poles
 * stable in frequency and shape by |Δf|/f + (1 − MAC) [3] → one mode per large cluster
 * (median frequency and damping; shape of the member nearest the median frequency).
 * See ssi-correlations.ts, ssi-poles.ts, stabilisation.ts, stabilisation-clusters.ts.
 *
 * [1] Peeters & De Roeck, MSSP 13(6):855–878, 1999.
 * [2] REFERENCES.md §Modal identification [practice].
 * [3] Reynders, Houbrechts & De Roeck, MSSP 29:228–250, 2012.
 */
import { decimate } from "@/lib/signal/decimate";
import { mpc } from "./mac";
import { blockToeplitz, centre, outputCorrelations } from "./ssi-correlations";
import { polesByOrder } from "./ssi-poles";
import { leadingLeftSingular } from "./ssi-svd";
import { clusterPoles, median } from "./stabilisation-clusters";
import { DEFAULT_STABILITY, labelPoles, type LabelledPole, type StabilityLabel } from "./stabilisation";
import { resolveSsiOptions, type SsiCovOptions, type SsiRecord } from "./ssi-options";

export type { SsiCovOptions, SsiRecord } from "./ssi-options";

/** A mode selected from the stabilisation diagram. */
export interface SsiMode {
  /** Natural frequency in Hz (median over the cluster). */
  frequencyHz: number;
  /** Damping ratio, fraction (median over the cluster). */
  dampingRatio: number;
  /** Complex shape over all channels (record order), largest component 1 + 0j. */
  shape: { re: Float64Array; im: Float64Array };
  /** Modal phase collinearity of `shape`, [0, 1]. */
  mpc: number;
  /** Number of stable poles in the cluster (how many orders agreed). */
  clusterSize: number;
  /** Standard deviation of the cluster's frequencies in Hz (spread over orders). */
  frequencyStdHz: number;
}

/** One pole of the stabilisation diagram. */
export interface StabilisationPoint {
  order: number;
  frequencyHz: number;
  dampingRatio: number;
  stable: StabilityLabel;
}

/** Result of {@link identifyModesSsiCov}. */
export interface SsiCovResult {
  modes: SsiMode[];
  stabilisation: StabilisationPoint[];
  /** Settings actually used (after defaults). */
  settings: { referenceChannels: number[]; maxOrder: number; blockRows: number; sampleRateHz: number; minClusterSize: number; minRelativeClusterSize: number };
  warnings: string[];
  timingsMs: { decimation: number; correlations: number; svd: number; poles: number; clustering: number; total: number };
}

/**
 * Identifies modes from an ambient record by reference-based SSI-COV (see file header).
 *
 * @param record - `sampleRateHz` (> 0), `channels` (codes, one per data channel) and `data`
 *   (one array per channel, equal lengths, finite samples in any consistent unit, e.g. m/s²);
 *   not mutated. At least 2 channels.
 * @param options - see {@link SsiCovOptions}: reference channels (default: the ≤ 4 channels
 *   of largest RMS), maxOrder (even, default 80), blockRows (default max(10, ⌈1.5·maxOrder/r⌉,
 *   ⌈maxOrder/l⌉ + 2): enough rows for a well-determined shift least squares; raise it when
 *   i/fs is much shorter than the lowest period of interest), bandsHz (keep only modes in
 *   these bands), decimateToHz (zero-phase FIR decimation by ⌊fs/target⌋ first; the
 *   settings report the rate used), minClusterSize (default
 *   max(3, ⌈0.2·number of orders⌉)), minRelativeClusterSize (default 0.4 of the largest
 *   cluster), clusterThreshold (default 0.02), maxDampingRatio (0.2).
 * @returns modes ascending in frequency, every pole of the diagram, settings, warnings and
 *   stage timings in ms.
 * @throws TypeError for a malformed record or option; RangeError for too few channels or
 *   samples (N must exceed 20·(2i − 1)), references out of range or repeated, an odd or too
 *   large maxOrder, or bands with lo ≥ hi.
 * Cost: correlations l·r·2i·N multiply-adds; SVD of li × ri; per order one n × n eigen
 * decomposition. Damping from SSI is unbiased by spectral resolution but still scatters
 * ±15–40 % between 10-minute records [2].
 */
export function identifyModesSsiCov(record: SsiRecord, options: SsiCovOptions = {}): SsiCovResult {
  const t0 = performance.now();
  const o = resolveSsiOptions(record, options);
  const warnings = [...o.warnings];
  const l = record.data.length;
  const r = o.referenceChannels.length;
  const dt = 1 / o.sampleRateHz;

  const y = centre(o.decimation > 1 ? record.data.map((x) => decimate(x, o.decimation)) : record.data);
  const td = performance.now();
  const corr = outputCorrelations(y, o.referenceChannels, 2 * o.blockRows - 1);
  const t1 = performance.now();
  const { u } = leadingLeftSingular(blockToeplitz(corr, l, r, o.blockRows), o.maxOrder);
  const t2 = performance.now();
  const orders: number[] = [];
  for (let n = 2; n <= Math.min(o.maxOrder, u.columns); n += 2) orders.push(n);
  if (u.columns < o.maxOrder) {
    warnings.push(`the correlation matrix has numerical rank ${u.columns} < maxOrder ${o.maxOrder}: orders stop at ${orders[orders.length - 1] ?? 0}`);
  }
  const labelled = orders.length > 0 ? labelPoles(polesByOrder(u, l, orders, dt), DEFAULT_STABILITY) : [];
  const t3 = performance.now();

  const nyquist = o.sampleRateHz / 2;
  const candidates: LabelledPole[] = [];
  for (const poles of labelled) {
    for (const p of poles) {
      const inBand = !o.bandsHz || o.bandsHz.some(([lo, hi]) => p.frequencyHz >= lo && p.frequencyHz <= hi);
      const physical = p.dampingRatio > 0 && p.dampingRatio <= o.maxDampingRatio && p.frequencyHz < nyquist;
      if (inBand && physical && (p.stable === "fv" || p.stable === "fdv")) candidates.push(p);
    }
  }
  const all = clusterPoles(candidates, o.clusterThreshold, o.minClusterSize);
  // A physical mode recurs over most orders once the order exceeds its minimum; a cluster
  // much smaller than the largest one is a spurious (noise or split) pole family [practice].
  const largest = all.reduce((m, c) => Math.max(m, c.length), 0);
  const clusters = all.filter((c) => c.length >= o.minRelativeClusterSize * largest);
  const modes = clusters.map(toMode);
  if (modes.length === 0) warnings.push("no cluster of stable poles reached the minimum size: no mode identified");
  const t4 = performance.now();

  const stabilisation = labelled.flat().map((p) => ({ order: p.order, frequencyHz: p.frequencyHz, dampingRatio: p.dampingRatio, stable: p.stable }));
  return {
    modes,
    stabilisation,
    settings: { referenceChannels: o.referenceChannels, maxOrder: o.maxOrder, blockRows: o.blockRows, sampleRateHz: o.sampleRateHz, minClusterSize: o.minClusterSize, minRelativeClusterSize: o.minRelativeClusterSize },
    warnings,
    timingsMs: { decimation: td - t0, correlations: t1 - td, svd: t2 - t1, poles: t3 - t2, clustering: t4 - t3, total: t4 - t0 },
  };
}

function toMode(cluster: LabelledPole[]): SsiMode {
  const f = cluster.map((p) => p.frequencyHz);
  const fMed = median(f);
  let rep = cluster[0];
  for (const p of cluster) {
    // Nearest the median frequency; ties go to the higher order (better converged).
    const dp = Math.abs(p.frequencyHz - fMed), dr = Math.abs(rep.frequencyHz - fMed);
    if (dp < dr || (dp === dr && p.order > rep.order)) rep = p;
  }
  const mean = f.reduce((s, v) => s + v, 0) / f.length;
  const sd = Math.sqrt(f.reduce((s, v) => s + (v - mean) ** 2, 0) / Math.max(1, f.length - 1));
  return {
    frequencyHz: fMed,
    dampingRatio: median(cluster.map((p) => p.dampingRatio)),
    shape: { re: Float64Array.from(rep.shape.re), im: Float64Array.from(rep.shape.im) },
    mpc: mpc(rep.shape),
    clusterSize: cluster.length,
    frequencyStdHz: sd,
  };
}
