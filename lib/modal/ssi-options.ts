/**
 * Validation gate and defaults of identifyModesSsiCov (CONVENTIONS.md §7).
 */
import { assertInRange, assertInteger, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";

/** An ambient record as the identification functions take it. */
export interface SsiRecord {
  /** Sampling rate in Hz, > 0. */
  sampleRateHz: number;
  /** Channel codes, one per entry of `data`. */
  channels: string[];
  /** One array per channel, equal lengths, finite samples. */
  data: ArrayLike<number>[];
}

/** Options of identifyModesSsiCov; every field optional. */
export interface SsiCovOptions {
  /** Indices of the reference channels, distinct, within [0, channels − 1]; default ≤ 4 of largest RMS. */
  referenceChannels?: number[];
  /** Largest model order, even integer in [2, 400]; default 80. */
  maxOrder?: number;
  /** Block rows i, integer ≥ 2 with i·r ≥ maxOrder and (i − 1)·l ≥ maxOrder; default max(10, ⌈1.5·maxOrder/r⌉, ⌈maxOrder/l⌉ + 2). */
  blockRows?: number;
  /** Frequency bands [lo, hi] in Hz (0 ≤ lo < hi) to keep modes in; default all. */
  bandsHz?: [number, number][];
  /**
   * Target rate in Hz (> 0): the record is low-passed and decimated by the integer
   * q = ⌊fs/target⌋ (zero-phase FIR, lib/signal/decimate) when q ≥ 2; identify modes below
   * ≈ 0.8 × the new Nyquist. Default: no decimation.
   */
  decimateToHz?: number;
  /** Minimum poles per cluster, integer ≥ 2; default max(3, ⌈0.2·number of orders⌉). */
  minClusterSize?: number;
  /** Keep only clusters with at least this fraction of the largest cluster's poles, [0, 1]; default 0.4 [practice]. */
  minRelativeClusterSize?: number;
  /** Average-linkage distance threshold, (0, 1]; default 0.02 [practice]. */
  clusterThreshold?: number;
  /** Largest damping ratio of a physical pole, (0, 1); default 0.2 [practice]. */
  maxDampingRatio?: number;
}

export interface ResolvedSsiOptions {
  referenceChannels: number[];
  maxOrder: number;
  blockRows: number;
  bandsHz: [number, number][] | null;
  sampleRateHz: number;
  minClusterSize: number;
  minRelativeClusterSize: number;
  clusterThreshold: number;
  maxDampingRatio: number;
  /** Integer decimation factor (1 = none). */
  decimation: number;
  warnings: string[];
}

/** Checks the record and options and fills in defaults. */
export function resolveSsiOptions(record: SsiRecord, options: SsiCovOptions): ResolvedSsiOptions {
  if (typeof record !== "object" || record === null) throw new TypeError(`record must be an object (got ${describe(record)})`);
  assertPositive(record.sampleRateHz, "record.sampleRateHz");
  if (!Array.isArray(record.data)) throw new TypeError(`record.data must be an array of channels (got ${describe(record.data)})`);
  if (!Array.isArray(record.channels) || record.channels.length !== record.data.length) {
    throw new RangeError(`record.channels must name every data channel (got ${describe(record.channels)} for ${record.data.length} channels)`);
  }
  const l = record.data.length;
  if (l < 2) throw new RangeError(`record.data must have at least 2 channels (got ${l})`);
  const n = record.data[0]?.length ?? 0;
  record.data.forEach((x, c) => {
    assertNumberArray(x, `record.data[${c}]`);
    if (x.length !== n) throw new RangeError(`record.data[${c}] must have the length of record.data[0] (got ${x.length} ≠ ${n})`);
  });
  if (typeof options !== "object" || options === null) throw new TypeError(`options must be an object (got ${describe(options)})`);
  const warnings: string[] = [];

  let refs: number[];
  if (options.referenceChannels !== undefined) {
    assertNumberArray(options.referenceChannels, "referenceChannels");
    options.referenceChannels.forEach((c, j) => assertInteger(c, `referenceChannels[${j}]`, 0, l - 1));
    if (new Set(options.referenceChannels).size !== options.referenceChannels.length) {
      throw new RangeError(`referenceChannels must be distinct (got [${options.referenceChannels.join(", ")}])`);
    }
    refs = [...options.referenceChannels];
  } else {
    refs = largestRms(record.data, Math.min(4, l));
  }
  const r = refs.length;
  const maxOrder = options.maxOrder ?? 80;
  assertInteger(maxOrder, "maxOrder", 2, 400);
  if (maxOrder % 2 !== 0) throw new RangeError(`maxOrder must be even (got ${maxOrder})`);
  const defaultRows = Math.max(10, Math.ceil((1.5 * maxOrder) / r), Math.ceil(maxOrder / l) + 2);
  const blockRows = options.blockRows ?? defaultRows;
  assertInteger(blockRows, "blockRows", 2, 1000);
  if (blockRows * r < maxOrder) throw new RangeError(`blockRows·references must be ≥ maxOrder (got ${blockRows}·${r} < ${maxOrder})`);
  if ((blockRows - 1) * l < maxOrder) throw new RangeError(`(blockRows − 1)·channels must be ≥ maxOrder (got ${blockRows - 1}·${l} < ${maxOrder})`);
  let decimation = 1;
  if (options.decimateToHz !== undefined) {
    assertPositive(options.decimateToHz, "decimateToHz");
    decimation = Math.min(64, Math.floor(record.sampleRateHz / options.decimateToHz + 1e-9));
    if (decimation < 2) {
      decimation = 1;
      warnings.push(`decimateToHz = ${options.decimateToHz} needs no integer decimation of ${record.sampleRateHz} Hz: none applied`);
    } else if (Math.abs((record.sampleRateHz / decimation) / options.decimateToHz - 1) > 1e-9) {
      warnings.push(`decimated by ${decimation} to ${record.sampleRateHz / decimation} Hz (the nearest integer factor not below decimateToHz = ${options.decimateToHz})`);
    }
  }
  const nUsed = Math.ceil(n / decimation);
  if (nUsed <= 20 * (2 * blockRows - 1)) {
    throw new RangeError(`record must have more than 20·(2·blockRows − 1) = ${20 * (2 * blockRows - 1)} samples after decimation (got ${nUsed})`);
  }

  let bands: [number, number][] | null = null;
  if (options.bandsHz !== undefined) {
    if (!Array.isArray(options.bandsHz)) throw new TypeError(`bandsHz must be an array of [lo, hi] (got ${describe(options.bandsHz)})`);
    options.bandsHz.forEach((b, j) => {
      assertNumberArray(b, `bandsHz[${j}]`, 2);
      if (!(b[0] >= 0 && b[0] < b[1])) throw new RangeError(`bandsHz[${j}] must satisfy 0 ≤ lo < hi (got [${b[0]}, ${b[1]}])`);
    });
    bands = options.bandsHz.map((b) => [b[0], b[1]]);
  }
  const nOrders = maxOrder / 2;
  const minClusterSize = options.minClusterSize ?? Math.max(3, Math.ceil(0.2 * nOrders));
  assertInteger(minClusterSize, "minClusterSize", 2, 10000);
  const minRelativeClusterSize = options.minRelativeClusterSize ?? 0.4;
  assertInRange(minRelativeClusterSize, "minRelativeClusterSize", 0, 1);
  const clusterThreshold = options.clusterThreshold ?? 0.02;
  assertPositive(clusterThreshold, "clusterThreshold");
  if (clusterThreshold > 1) throw new RangeError(`clusterThreshold must be ≤ 1 (got ${clusterThreshold})`);
  const maxDampingRatio = options.maxDampingRatio ?? 0.2;
  assertPositive(maxDampingRatio, "maxDampingRatio");
  if (maxDampingRatio >= 1) throw new RangeError(`maxDampingRatio must be < 1 (got ${maxDampingRatio})`);
  return { referenceChannels: refs, maxOrder, blockRows, bandsHz: bands, sampleRateHz: record.sampleRateHz / decimation, decimation, minClusterSize, minRelativeClusterSize, clusterThreshold, maxDampingRatio, warnings };
}

/** Indices of the `k` channels of largest RMS, in channel order. */
function largestRms(data: ArrayLike<number>[], k: number): number[] {
  const rms = data.map((x) => {
    let s = 0, ss = 0;
    for (let i = 0; i < x.length; i++) {
      s += x[i];
      ss += x[i] * x[i];
    }
    return ss / x.length - (s / x.length) ** 2;
  });
  return rms
    .map((v, i) => [v, i] as const)
    .sort((a, b) => b[0] - a[0])
    .slice(0, k)
    .map(([, i]) => i)
    .sort((a, b) => a - b);
}
