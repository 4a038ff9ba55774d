/**
 * Validation gate and defaults of identifyModes (CONVENTIONS.md §7).
 */
import { assertInRange, assertInteger, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import type { QualityOptions } from "@/lib/signal/quality";
import type { PeakPickingOptions } from "./peak-picking";
import type { SsiCovOptions } from "./ssi-cov";

/** An ambient record as identifyModes takes it. */
export interface ModalRecord {
  /** Sampling rate in Hz, > 0. */
  sampleRateHz: number;
  /** Channel codes, one per entry of `data`, distinct. */
  channels: string[];
  /** One array per channel, equal lengths ≥ 256, in m/s². */
  data: ArrayLike<number>[];
}

export interface IdentifyOptions {
  /** Search bands [lo, hi] in Hz (shortcut for peakPicking.bandsHz; also passed to SSI-COV). */
  bandsHz?: [number, number][];
  /** Welch segment length, power of two; default: from `lowestFrequencyHz` by the segment-length rule, else min(2048, L/8). */
  nperseg?: number;
  /** Segment overlap as a fraction, [0, 0.9]; default 0.5. */
  overlap?: number;
  /** Lowest mode of interest (Hz) for the automatic segment length. */
  lowestFrequencyHz?: number;
  /** Damping assumed by the segment-length rule, default 0.01. */
  assumedDampingRatio?: number;
  /** Estimators: ['fdd'] (default), ['ssi'] or ['fdd', 'ssi']. */
  methods?: ("fdd" | "ssi")[];
  peakPicking?: PeakPickingOptions;
  quality?: QualityOptions;
  /** Options passed to SSI-COV. */
  ssi?: SsiCovOptions;
  /** Decimate (zero-phase FIR, integer factor) to about this rate before SSI-COV, Hz > 0; default none. */
  ssiSampleRateHz?: number;
  /** Half-power bandwidth in lines below which damping is flagged unreliable, > 0; default 3 [practice]. */
  minBandwidthLines?: number;
  /** Periods of a mode in the record below which its damping is flagged unreliable; default 1000 [Cantieni 2005]. */
  minCycles?: number;
}

export interface ResolvedIdentifyOptions {
  nperseg?: number;
  overlap: number;
  lowestFrequencyHz?: number;
  assumedDampingRatio?: number;
  methods: ("fdd" | "ssi")[];
  peakPicking: PeakPickingOptions;
  quality: QualityOptions;
  ssi: SsiCovOptions;
  ssiSampleRateHz?: number;
  minBandwidthLines: number;
  minCycles: number;
}

/** Checks record and options, fills in defaults. @throws TypeError / RangeError. */
export function validateIdentifyInput(record: ModalRecord, options: IdentifyOptions): ResolvedIdentifyOptions {
  if (typeof record !== "object" || record === null) throw new TypeError(`record must be an object (got ${describe(record)})`);
  assertPositive(record.sampleRateHz, "record.sampleRateHz");
  if (!Array.isArray(record.data) || record.data.length === 0) throw new TypeError(`record.data must be a non-empty array of channels (got ${describe(record.data)})`);
  if (!Array.isArray(record.channels) || record.channels.length !== record.data.length) {
    throw new RangeError(`record.channels must name every data channel (got ${describe(record.channels)} for ${record.data.length} channels)`);
  }
  record.channels.forEach((c, i) => {
    if (typeof c !== "string" || c.length === 0) throw new TypeError(`record.channels[${i}] must be a non-empty string (got ${describe(c)})`);
  });
  if (new Set(record.channels).size !== record.channels.length) throw new RangeError(`record.channels must be distinct (got ${record.channels.join(", ")})`);
  const n = record.data[0]?.length ?? 0;
  record.data.forEach((x, c) => {
    assertNumberArray(x, `record.data[${c}]`, 256, false);
    if (x.length !== n) throw new RangeError(`record.data[${c}] must have the length of record.data[0] (got ${x.length} ≠ ${n})`);
  });
  if (typeof options !== "object" || options === null) throw new TypeError(`options must be an object (got ${describe(options)})`);
  if (options.nperseg !== undefined) {
    assertInteger(options.nperseg, "nperseg", 8, n);
    if ((options.nperseg & (options.nperseg - 1)) !== 0) throw new RangeError(`nperseg must be a power of two (got ${options.nperseg})`);
  }
  const overlap = options.overlap ?? 0.5;
  assertInRange(overlap, "overlap", 0, 0.9);
  if (options.lowestFrequencyHz !== undefined) assertPositive(options.lowestFrequencyHz, "lowestFrequencyHz");
  if (options.assumedDampingRatio !== undefined) assertInRange(options.assumedDampingRatio, "assumedDampingRatio", 1e-6, 0.5);
  const methods = options.methods ?? ["fdd"];
  if (!Array.isArray(methods) || methods.length === 0 || methods.some((m) => m !== "fdd" && m !== "ssi")) {
    throw new RangeError(`methods must be a non-empty list of 'fdd' and 'ssi' (got ${describe(methods)})`);
  }
  if (options.ssiSampleRateHz !== undefined) assertPositive(options.ssiSampleRateHz, "ssiSampleRateHz");
  const minBandwidthLines = options.minBandwidthLines ?? 3;
  assertPositive(minBandwidthLines, "minBandwidthLines");
  const minCycles = options.minCycles ?? 1000;
  assertInRange(minCycles, "minCycles", 0, 1e9);
  const peakPicking: PeakPickingOptions = { ...(options.peakPicking ?? {}) };
  if (options.bandsHz !== undefined) peakPicking.bandsHz = options.bandsHz;
  return {
    nperseg: options.nperseg,
    overlap,
    lowestFrequencyHz: options.lowestFrequencyHz,
    assumedDampingRatio: options.assumedDampingRatio,
    methods,
    peakPicking,
    quality: options.quality ?? {},
    ssi: options.ssi ?? {},
    ssiSampleRateHz: options.ssiSampleRateHz,
    minBandwidthLines,
    minCycles,
  };
}
