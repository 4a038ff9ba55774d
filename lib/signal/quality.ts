/**
 * Data-quality screening of a record before identification (REFERENCES.md §Data quality,
 * [practice]): completeness (non-finite samples, gaps), clipping near full scale, flat-lined
 * channels, spikes by the MAD rule, mains hum at 50/60 Hz and their aliases, and channel RMS
 * far from its history. Each channel gets flags; the record a verdict.
 *
 * Severity: non-finite samples, gaps, clipping and flat lines make a channel unusable
 * (it is excluded); spikes, hum and an unusual RMS are reported but the channel is kept,
 * because FDD averages over segments and these rarely move a mode [practice].
 */
import { median, selectInPlace } from "@/lib/numeric/select";
import { assertInteger, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import { estimateCsdMatrix } from "./welch-csd";

export type QualityFlag = "non_finite" | "gap" | "clipping" | "flat_line" | "spikes" | "mains_hum" | "rms_out_of_history";

const EXCLUDING: ReadonlySet<QualityFlag> = new Set(["non_finite", "gap", "clipping", "flat_line"]);

export interface ChannelQuality {
  channel: string;
  flags: QualityFlag[];
  /** RMS about the mean of the finite samples, in the record's unit. */
  rms: number;
  nonFiniteCount: number;
  longestGapSamples: number;
  clippedSamples: number;
  longestFlatRunSamples: number;
  spikeCount: number;
  /** Mains-hum lines found (Hz, after aliasing). */
  humHz: number[];
  /** Human-readable reasons, one per flag. */
  notes: string[];
}

export type QualityVerdict = { kind: "accept" } | { kind: "accept_without"; channels: string[] } | { kind: "reject"; reason: string };

export interface QualityReport {
  channels: ChannelQuality[];
  verdict: QualityVerdict;
}

export interface QualityOptions {
  /** Sensor full scale (|a| limit) in the record's unit, > 0; scalar or one per channel. Without it clipping is judged from flat tops at the extremes. */
  fullScale?: number | number[];
  /** Run of non-finite samples that counts as a gap, integer ≥ 2; default 2. A run of exact zeros of ≥ max(this, 0.1 s) is a zero-filled gap. */
  gapMinSamples?: number;
  /** Longest run of identical values accepted, seconds > 0; default 1 s [practice]. */
  flatRunS?: number;
  /** RMS below which a channel is dead (sensor self-noise), ≥ 0; default 1e-7 (unit of the record). */
  minRms?: number;
  /** Spike threshold in robust standard deviations (1.4826·MAD), > 0; default 10 [practice]. */
  spikeSigma?: number;
  /** Typical RMS of each channel from its history (null: unknown), same unit. */
  historyRms?: (number | null)[];
  /** Factor beyond which RMS is far from history (either way), > 1; default 3 [practice]. */
  historyFactor?: number;
  /** Mains hum: line height above the local median in dB, > 0; default 10 [practice]. */
  humDb?: number;
}

/**
 * Screens a record.
 *
 * @param data - channels, equal lengths ≥ 64 samples; non-finite values allowed (reported).
 * @param channels - channel codes, one per data channel.
 * @param sampleRateHz - Hz, > 0.
 * @param options - see {@link QualityOptions}.
 * @returns per-channel flags and the verdict: accept, accept without some channels (at
 *   least 2 usable remain, or the only one of a single-channel record), or reject with reason.
 * @throws TypeError / RangeError for bad arguments (rule and value in the message).
 */
export function screenRecord(data: ReadonlyArray<ArrayLike<number>>, channels: string[], sampleRateHz: number, options: QualityOptions = {}): QualityReport {
  if (!Array.isArray(data) || data.length === 0) throw new TypeError(`data must be a non-empty array of channels (got ${describe(data)})`);
  if (!Array.isArray(channels) || channels.length !== data.length) throw new RangeError(`channels must name every data channel (got ${describe(channels)} for ${data.length})`);
  assertPositive(sampleRateHz, "sampleRateHz");
  const len = data[0].length;
  data.forEach((x, c) => {
    assertNumberArray(x, `data[${c}]`, 64, false);
    if (x.length !== len) throw new RangeError(`data[${c}] must have the length of data[0] (got ${x.length} ≠ ${len})`);
  });
  const fullScale = options.fullScale;
  if (fullScale !== undefined) {
    const arr = typeof fullScale === "number" ? [fullScale] : fullScale;
    if (!Array.isArray(arr)) throw new TypeError(`fullScale must be a number or an array (got ${describe(fullScale)})`);
    if (Array.isArray(fullScale) && fullScale.length !== data.length) throw new RangeError(`fullScale must have one value per channel (got ${fullScale.length} ≠ ${data.length})`);
    arr.forEach((v, i) => assertPositive(v, `fullScale[${i}]`));
  }
  const gapMin = options.gapMinSamples ?? 2;
  assertInteger(gapMin, "gapMinSamples", 2);
  const flatRunS = options.flatRunS ?? 1;
  assertPositive(flatRunS, "flatRunS");
  const minRms = options.minRms ?? 1e-7;
  if (typeof minRms !== "number" || !(minRms >= 0)) throw new RangeError(`minRms must be ≥ 0 (got ${describe(minRms)})`);
  const spikeSigma = options.spikeSigma ?? 10;
  assertPositive(spikeSigma, "spikeSigma");
  const historyFactor = options.historyFactor ?? 3;
  assertPositive(historyFactor, "historyFactor", 1);
  const humDb = options.humDb ?? 10;
  assertPositive(humDb, "humDb");
  if (options.historyRms !== undefined && (!Array.isArray(options.historyRms) || options.historyRms.length !== data.length)) {
    throw new RangeError(`historyRms must have one value per channel (got ${describe(options.historyRms)})`);
  }

  const flatRun = Math.max(2, Math.round(flatRunS * sampleRateHz));
  const report = data.map((x, c) => {
    const fs = fullScale === undefined ? undefined : typeof fullScale === "number" ? fullScale : fullScale[c];
    const zeroGap = Math.max(gapMin, Math.round(0.1 * sampleRateHz));
    const q = screenChannel(x, channels[c], { fullScale: fs, gapMin, zeroGap, flatRun, minRms, spikeSigma });
    const hist = options.historyRms?.[c];
    if (hist != null && hist > 0 && q.rms > 0 && (q.rms > hist * historyFactor || q.rms < hist / historyFactor)) {
      q.flags.push("rms_out_of_history");
      q.notes.push(`RMS ${q.rms.toPrecision(3)} is beyond ×${historyFactor} of its history ${hist.toPrecision(3)}`);
    }
    if (!q.flags.some((f) => EXCLUDING.has(f))) {
      q.humHz = findHum(x, sampleRateHz, humDb);
      if (q.humHz.length) {
        q.flags.push("mains_hum");
        q.notes.push(`narrow lines at ${q.humHz.map((f) => f.toFixed(2)).join(", ")} Hz (50/60 Hz hum or aliases)`);
      }
    }
    return q;
  });
  return { channels: report, verdict: verdictOf(report) };
}

function verdictOf(report: ChannelQuality[]): QualityVerdict {
  const bad = report.filter((q) => q.flags.some((f) => EXCLUDING.has(f)));
  if (bad.length === 0) return { kind: "accept" };
  const good = report.length - bad.length;
  if (good === 0) return { kind: "reject", reason: `no usable channel (${bad.map((q) => `${q.channel}: ${q.flags.join("+")}`).join("; ")})` };
  if (good < 2 && report.length > 1) return { kind: "reject", reason: `only ${good} usable channel of ${report.length}: mode shapes need at least 2` };
  return { kind: "accept_without", channels: bad.map((q) => q.channel) };
}

interface ChannelRules {
  fullScale?: number;
  gapMin: number;
  zeroGap: number;
  flatRun: number;
  minRms: number;
  spikeSigma: number;
}

function screenChannel(x: ArrayLike<number>, channel: string, r: ChannelRules): ChannelQuality {
  const n = x.length;
  const flags: QualityFlag[] = [];
  const notes: string[] = [];
  let nonFinite = 0, gapRun = 0, longestGap = 0;
  let flatLen = 1, longestFlat = 1;
  let zeroRun = 0, longestZeroRun = 0;
  let sum = 0, sum2 = 0, count = 0, max = -Infinity, min = Infinity;
  for (let i = 0; i < n; i++) {
    const v = x[i];
    if (!Number.isFinite(v)) {
      nonFinite++;
      gapRun++;
      if (gapRun > longestGap) longestGap = gapRun;
      flatLen = 1;
      continue;
    }
    gapRun = 0;
    if (v === 0) {
      zeroRun++;
      if (zeroRun > longestZeroRun) longestZeroRun = zeroRun;
    } else zeroRun = 0;
    if (i > 0 && v === x[i - 1]) {
      flatLen++;
      if (flatLen > longestFlat) longestFlat = flatLen;
    } else flatLen = 1;
    sum += v;
    sum2 += v * v;
    count++;
    if (v > max) max = v;
    if (v < min) min = v;
  }
  const mean = count ? sum / count : 0;
  const rms = count ? Math.sqrt(Math.max(0, sum2 / count - mean * mean)) : 0;
  if (nonFinite > 0) {
    flags.push("non_finite");
    notes.push(`${nonFinite} non-finite sample(s)`);
  }
  if (longestGap >= r.gapMin) {
    flags.push("gap");
    notes.push(`gap of ${longestGap} non-finite samples`);
  } else if (longestZeroRun >= r.zeroGap && rms > r.minRms) {
    // A live accelerometer never reads exactly 0 for 0.1 s: a zero-filled transmission gap.
    flags.push("gap");
    notes.push(`gap of ${longestZeroRun} zero-filled samples`);
  }
  const zeroFilled = flags.includes("gap") && longestGap < r.gapMin;
  if (count > 0 && !zeroFilled && (longestFlat >= r.flatRun || rms <= r.minRms)) {
    flags.push("flat_line");
    notes.push(rms <= r.minRms ? `RMS ${rms.toPrecision(3)} ≤ ${r.minRms} (dead channel)` : `${longestFlat} identical consecutive samples`);
  }
  const clipped = count > 0 ? countClipped(x, r.fullScale, max, min) : 0;
  if (clipped > 0) {
    flags.push("clipping");
    notes.push(r.fullScale !== undefined ? `${clipped} sample(s) at ≥ 99 % of full scale ${r.fullScale}` : `${clipped} sample(s) in flat tops at the extremes`);
  }
  let spikes = 0;
  if (count >= 16 && !flags.includes("flat_line")) {
    spikes = countSpikes(x, r.spikeSigma);
    if (spikes > 0) {
      flags.push("spikes");
      notes.push(`${spikes} sample(s) beyond ${r.spikeSigma} robust σ (MAD rule)`);
    }
  }
  return { channel, flags, rms, nonFiniteCount: nonFinite, longestGapSamples: Math.max(longestGap, zeroFilled ? longestZeroRun : 0), clippedSamples: clipped, longestFlatRunSamples: longestFlat, spikeCount: spikes, humHz: [], notes };
}

/** With a full scale: samples at ≥ 99 % of it. Without: samples in runs of ≥ 3 equal values at the max or min. */
function countClipped(x: ArrayLike<number>, fullScale: number | undefined, max: number, min: number): number {
  let c = 0;
  if (fullScale !== undefined) {
    for (let i = 0; i < x.length; i++) if (Math.abs(x[i]) >= 0.99 * fullScale) c++;
    return c;
  }
  if (max === min) return 0; // a constant channel is a flat line, not clipping
  for (const level of [max, min]) {
    let run = 0;
    for (let i = 0; i <= x.length; i++) {
      if (i < x.length && x[i] === level) run++;
      else {
        if (run >= 3) c += run;
        run = 0;
      }
    }
  }
  return c;
}

/**
 * Records at least this long (samples) estimate the median and the MAD from a subsample of
 * one sample in every {@link SPIKE_STRIDE} (see {@link countSpikes}); shorter ones use all.
 */
const SPIKE_SUBSAMPLE_FROM = 16384;
/** Block length of the spike rule's subsample: one sample per block of this many. */
const SPIKE_STRIDE = 4;

/**
 * |x − median| > k · 1.4826 · MAD (1.4826 makes MAD a consistent σ for Gaussian data); the
 * upper median is used for even counts. Every finite sample is tested, but on long records the
 * median and the MAD are estimated from a deterministic subsample [practice]: one sample from
 * each block of {@link SPIKE_STRIDE}, its position in the block drawn by a fixed LCG (so a tone
 * at fs/4 cannot alias into a constant subsample). A subsample quantile is unchanged in
 * expectation; the median's standard error is ≈ 1.25σ/√n' for n' independent values (n' ≥ 4096
 * here: ≤ 2 % of σ), far inside a 10σ threshold. The two O(n) selections over every sample
 * were most of the screen's cost on a 120 000-sample channel.
 */
function countSpikes(x: ArrayLike<number>, k: number): number {
  const n = x.length;
  let est = spikeSample(x, n >= SPIKE_SUBSAMPLE_FROM ? SPIKE_STRIDE : 1);
  if (est.length < 16) est = spikeSample(x, 1); // a mostly non-finite record: use every finite sample
  const m = est.length;
  const med = selectInPlace(est, m >> 1);
  for (let i = 0; i < m; i++) est[i] = Math.abs(est[i] - med);
  const mad = selectInPlace(est, m >> 1);
  if (mad === 0) return 0;
  const lim = k * 1.4826 * mad;
  let c = 0;
  for (let i = 0; i < n; i++) {
    const v = x[i];
    if (Math.abs(v - med) > lim && Number.isFinite(v)) c++;
  }
  return c;
}

/** The finite samples the spike rule estimates from: all (stride 1) or one per block of `stride`. */
function spikeSample(x: ArrayLike<number>, stride: number): Float64Array {
  const n = x.length;
  const out = new Float64Array(Math.ceil(n / stride));
  let m = 0;
  if (stride === 1) {
    for (let i = 0; i < n; i++) if (Number.isFinite(x[i])) out[m++] = x[i];
    return out.subarray(0, m);
  }
  // Numerical Recipes' LCG (1664525, 1013904223) mod 2^32; its top bits pick the offset.
  let state = 12345;
  for (let b = 0; b < n; b += stride) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    const i = b + Math.floor((state / 4294967296) * stride);
    if (i < n && Number.isFinite(x[i])) out[m++] = x[i];
  }
  return out.subarray(0, m);
}

/** Aliased frequency of f at sampling rate fs, in [0, fs/2]. */
export function aliasFrequency(f: number, fs: number): number {
  const r = f - fs * Math.round(f / fs);
  return Math.abs(r);
}

/** Narrow lines at 50/60 Hz and harmonics (to the 3rd), aliased into [0, fs/2]. */
function findHum(x: ArrayLike<number>, fs: number, humDb: number): number[] {
  const n = x.length;
  let nper = 1024;
  while (nper > 64 && nper * 4 > n) nper /= 2;
  // Hum is stationary: ~64 averages are plenty, so long records are not read to the end.
  const used = Math.min(n, 65 * (nper / 2));
  const xs = ArrayBuffer.isView(x) ? (x as Float64Array).subarray(0, used) : Float64Array.from({ length: used }, (_, i) => x[i]);
  const psd = estimateCsdMatrix([xs], fs, { nperseg: nper });
  const p = psd.re; // 1×1 per line: the PSD
  const df = psd.lineSpacingHz;
  const found: number[] = [];
  for (const base of [50, 60]) {
    for (let h = 1; h <= 3; h++) {
      const f = aliasFrequency(base * h, fs);
      const k = Math.round(f / df);
      if (k < 3 || k > psd.nLines - 4) continue;
      // the line or its neighbour (hum between two lines)
      const kp = p[k - 1] > p[k] && p[k - 1] > p[k + 1] ? k - 1 : p[k + 1] > p[k] ? k + 1 : k;
      const neigh: number[] = [];
      for (let j = Math.max(1, kp - 20); j <= Math.min(psd.nLines - 2, kp + 20); j++) if (Math.abs(j - kp) > 3) neigh.push(p[j]);
      const bg = median(neigh);
      // narrow: a Hann-windowed sinusoid is ≤ 3 lines wide at half power; a mode is wider [practice]
      const narrow = p[kp - 2] < p[kp] / 4 && p[kp + 2] < p[kp] / 4;
      if (bg > 0 && 10 * Math.log10(p[kp] / bg) >= humDb && narrow && !found.some((g) => Math.abs(g - kp * df) < 2 * df)) found.push(kp * df);
    }
  }
  return found.sort((a, b) => a - b);
}
