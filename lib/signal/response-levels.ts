/**
 * Response levels of one record for serviceability: per channel, then per channel axis (x, y,
 * z; the sign of a channel's direction is ignored), the largest peak |a|, the largest 1-second
 * RMS and the whole-record RMS, in m/s².
 *
 * Each channel's mean is removed first (an accelerometer offset is not a vibration). The
 * 1-second RMS is a running RMS over windows of round(fs) samples sliding by one sample,
 * as in the running-RMS method of ISO 2631-1 §6.3.2 with a rectangular window [pub]; it is
 * computed from a cumulative sum of squares (O(n) per channel). Non-finite samples are
 * skipped (taken as the mean) so that one bad value does not void the record.
 */
import { accelerationFactor, type AccelerationUnit } from "./units";
import { assertPositive } from "@/lib/numeric/validate";

export type ResponseAxis = "x" | "y" | "z";

export interface AxisResponseLevel {
  axis: ResponseAxis;
  /** Largest |a| after removing the mean, m/s². */
  peakMps2: number;
  /** Largest running 1-s RMS, m/s² (the whole-record RMS when the record is shorter than 1 s). */
  maxRms1sMps2: number;
  /** Whole-record RMS (largest over the axis' channels), m/s². */
  rmsMps2: number;
  /** Channel code where the peak occurred. */
  peakChannel: string;
}

export interface ResponseLevelInput {
  sampleRateHz: number;
  units: AccelerationUnit;
  /** One per column of `data`: its code and its direction ("x", "-z", …). */
  channels: { code: string; direction: string }[];
  /** One array per channel, equal lengths ≥ 1. */
  data: ArrayLike<number>[];
}

interface ChannelLevel { peak: number; maxRms1s: number; rms: number }

function channelLevel(x: ArrayLike<number>, factor: number, window: number): ChannelLevel {
  const n = x.length;
  let sum = 0;
  let count = 0;
  for (let i = 0; i < n; i++) if (Number.isFinite(x[i])) { sum += x[i]; count++; }
  const mean = count ? sum / count : 0;
  // The cumulative sum of squares S_i = Σ_{k<i} (x_k − mean)²·factor², with the last
  // window + 1 values kept in a ring (S_{i−window} is all a window needs): the same sums and
  // differences as a full prefix array, without a record-length allocation per channel.
  const ring = new Float64Array(window + 1);
  let acc = 0;
  let peak = 0;
  let maxMs = 0;
  // S_j sits in slot j mod (window + 1); S_{j−window} is then in the slot after S_j's.
  for (let i = 0, slot = 1; i < n; i++) {
    const xi = x[i];
    const v = Number.isFinite(xi) ? (xi - mean) * factor : 0;
    const a = Math.abs(v);
    if (a > peak) peak = a;
    acc += v * v;
    ring[slot] = acc; // S_{i+1}
    slot = slot === window ? 0 : slot + 1;
    if (i + 1 >= window) {
      const ms = acc - ring[slot]; // S_{i+1} − S_{i+1−window}
      if (ms > maxMs) maxMs = ms;
    }
  }
  const rms = Math.sqrt(acc / n);
  if (n <= window) return { peak, maxRms1s: rms, rms };
  return { peak, maxRms1s: Math.sqrt(Math.max(0, maxMs) / window), rms };
}

export interface ChannelResponseLevel {
  code: string;
  axis: ResponseAxis;
  peakMps2: number;
  maxRms1sMps2: number;
  rmsMps2: number;
}

/**
 * Peak, largest running 1-s RMS and whole-record RMS of every channel whose direction is an
 * axis (x, y, z with an optional sign); other channels are skipped.
 *
 * @param input - see {@link ResponseLevelInput}; samples in `units` ('m/s2', 'g', 'mg').
 * @returns one entry per such channel, in input order, values in m/s².
 * @throws TypeError for a non-finite sample rate; RangeError for a rate ≤ 0, a channel/data
 *   count mismatch or unequal lengths.
 */
export function computeChannelResponseLevels(input: ResponseLevelInput): ChannelResponseLevel[] {
  assertPositive(input.sampleRateHz, "sampleRateHz");
  if (input.channels.length !== input.data.length) {
    throw new RangeError(`channels and data must have equal counts (got ${input.channels.length} ≠ ${input.data.length})`);
  }
  const n = input.data[0]?.length ?? 0;
  if (input.data.some((d) => d.length !== n || d.length < 1)) throw new RangeError("every channel must have the same length ≥ 1");
  const factor = accelerationFactor(input.units);
  const window = Math.max(1, Math.round(input.sampleRateHz));
  const out: ChannelResponseLevel[] = [];
  input.channels.forEach((c, i) => {
    const axis = c.direction.replace("-", "");
    if (axis !== "x" && axis !== "y" && axis !== "z") return;
    const l = channelLevel(input.data[i], factor, window);
    out.push({ code: c.code, axis, peakMps2: l.peak, maxRms1sMps2: l.maxRms1s, rmsMps2: l.rms });
  });
  return out;
}

/**
 * Per axis: the largest peak (and its channel), 1-s RMS and RMS over the channels, optionally
 * only those in `include` (e.g. the channels an analysis kept after quality screening).
 * @returns one entry per axis present, ordered x, y, z.
 */
export function aggregateResponseLevels(levels: readonly ChannelResponseLevel[], include?: ReadonlySet<string>): AxisResponseLevel[] {
  const out: AxisResponseLevel[] = [];
  for (const axis of ["x", "y", "z"] as const) {
    let best: AxisResponseLevel | null = null;
    for (const l of levels) {
      if (l.axis !== axis || (include && !include.has(l.code))) continue;
      if (!best) best = { axis, peakMps2: l.peakMps2, maxRms1sMps2: l.maxRms1sMps2, rmsMps2: l.rmsMps2, peakChannel: l.code };
      else {
        if (l.peakMps2 > best.peakMps2) { best.peakMps2 = l.peakMps2; best.peakChannel = l.code; }
        best.maxRms1sMps2 = Math.max(best.maxRms1sMps2, l.maxRms1sMps2);
        best.rmsMps2 = Math.max(best.rmsMps2, l.rmsMps2);
      }
    }
    if (best) out.push(best);
  }
  return out;
}

/** Per-axis levels of a record: {@link aggregateResponseLevels} of {@link computeChannelResponseLevels}. */
export function computeResponseLevels(input: ResponseLevelInput): AxisResponseLevel[] {
  return aggregateResponseLevels(computeChannelResponseLevels(input));
}
