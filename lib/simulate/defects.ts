/**
 * Data defects injected into simulated records, so that quality screening can be tested
 * on records that have each fault and on clean ones (REFERENCES.md §Data quality [1]).
 *
 * Each defect acts on the channels it names (all channels when `channels` is omitted) and
 * the defects are applied in list order, so a `clip` placed last clips everything before
 * it. Times are in seconds from the first sample; a window running past the end is cut.
 *
 * [1] REFERENCES.md, Data quality before trusting a record [practice]: gaps, non-finite
 *     samples, clipping, flat lines, spikes, offsets and drift, mains hum and its aliases.
 */
import { assertFiniteNumber, assertInteger, assertNumberArray, assertPositive, describe } from "@/lib/numeric/validate";
import type { Rng } from "./rng";

/** One injected fault. Amplitudes are in the record's unit (m/s² for simulated records). */
export type RecordDefect =
  /** A run of NaN (or ±Infinity) samples. */
  | { kind: "nonFinite"; channels?: number[]; startS: number; durationS: number; value?: "nan" | "inf" }
  /** A transmission gap: samples lost and replaced by NaN, zeros or the last good value. */
  | { kind: "gap"; channels?: number[]; startS: number; durationS: number; fill: "nan" | "zero" | "hold" }
  /** Saturation of the sensor or digitiser at ±fullScale. */
  | { kind: "clip"; channels?: number[]; fullScale: number }
  /** A stuck channel: constant value (default the first sample of the window). */
  | { kind: "flatLine"; channels?: number[]; startS?: number; durationS?: number; value?: number }
  /** `count` isolated one-sample spikes of ±amplitude at random instants. */
  | { kind: "spikes"; channels?: number[]; count: number; amplitude: number }
  /** Mains hum amplitude·sin(2πft + phase), sampled as is (so it aliases above Nyquist). */
  | { kind: "hum"; channels?: number[]; frequencyHz: number; amplitude: number; phaseRad?: number }
  /** A constant offset. */
  | { kind: "offset"; channels?: number[]; value: number }
  /** A linear drift of ratePerS per second, zero at the first sample. */
  | { kind: "drift"; channels?: number[]; ratePerS: number };

/** The record after the defects, and notes about windows that had to be cut. */
export interface DefectResult {
  data: Float64Array[];
  warnings: string[];
}

const KINDS = new Set(["nonFinite", "gap", "clip", "flatLine", "spikes", "hum", "offset", "drift"]);

/**
 * Returns a copy of `data` with the listed defects applied (inputs are not mutated).
 *
 * @param data - one Float64Array per channel, all of equal length ≥ 1 (non-finite samples
 *   already present are kept).
 * @param sampleRateHz - sampling rate in Hz, > 0.
 * @param defects - the faults to inject, in order; see {@link RecordDefect}.
 * @param rng - seeded generator used for spike instants and signs.
 * @returns the new channels and warnings (e.g. a window cut at the end of the record).
 * @throws TypeError for a wrong kind of argument or an unknown defect kind; RangeError for
 *   unequal channel lengths, a channel index out of range, or a negative duration, count,
 *   full scale or amplitude.
 */
export function applyDefects(
  data: readonly Float64Array[],
  sampleRateHz: number,
  defects: readonly RecordDefect[],
  rng: Rng,
): DefectResult {
  if (!Array.isArray(data) || data.length === 0) throw new TypeError(`data must be a non-empty array of channels (got ${describe(data)})`);
  const n = data[0]?.length;
  data.forEach((ch, i) => {
    if (!(ch instanceof Float64Array)) throw new TypeError(`data[${i}] must be a Float64Array (got ${describe(ch)})`);
    if (ch.length !== n) throw new RangeError(`data[${i}] must have the length of data[0] (got ${ch.length} ≠ ${n})`);
  });
  if (n < 1) throw new RangeError(`data channels must hold at least 1 sample (got ${n})`);
  assertPositive(sampleRateHz, "sampleRateHz");
  if (!Array.isArray(defects)) throw new TypeError(`defects must be an array (got ${describe(defects)})`);
  if (typeof rng !== "object" || rng === null || typeof rng.next !== "function") {
    throw new TypeError(`rng must be a generator from createRng (got ${describe(rng)})`);
  }
  defects.forEach((d, i) => validateDefect(d, i, data.length));

  const out = data.map((ch) => Float64Array.from(ch));
  const warnings: string[] = [];
  const window = (startS = 0, durationS = n / sampleRateHz, label: string): [number, number] => {
    const i0 = Math.min(n, Math.round(startS * sampleRateHz));
    const want = Math.round(startS * sampleRateHz + durationS * sampleRateHz);
    if (want > n) warnings.push(`${label}: window cut at the end of the record (${(want - n)} sample(s) beyond)`);
    return [i0, Math.min(n, want)];
  };
  defects.forEach((d, di) => {
    const chans = d.channels ?? out.map((_, c) => c);
    const label = `defects[${di}] (${d.kind})`;
    for (const c of chans) {
      const x = out[c];
      switch (d.kind) {
        case "nonFinite": {
          const [a, b] = window(d.startS, d.durationS, label);
          x.fill(d.value === "inf" ? Infinity : NaN, a, b);
          break;
        }
        case "gap": {
          const [a, b] = window(d.startS, d.durationS, label);
          const held = a > 0 ? x[a - 1] : 0;
          x.fill(d.fill === "nan" ? NaN : d.fill === "zero" ? 0 : held, a, b);
          break;
        }
        case "clip":
          for (let k = 0; k < n; k++) x[k] = Math.max(-d.fullScale, Math.min(d.fullScale, x[k]));
          break;
        case "flatLine": {
          const [a, b] = window(d.startS, d.durationS, label);
          x.fill(d.value ?? x[a] ?? 0, a, b);
          break;
        }
        case "spikes":
          for (let s = 0; s < d.count; s++) {
            const k = Math.min(n - 1, Math.floor(rng.next() * n));
            x[k] += (rng.next() < 0.5 ? -1 : 1) * d.amplitude;
          }
          break;
        case "hum": {
          const w = (2 * Math.PI * d.frequencyHz) / sampleRateHz;
          const ph = d.phaseRad ?? 0;
          for (let k = 0; k < n; k++) x[k] += d.amplitude * Math.sin(w * k + ph);
          break;
        }
        case "offset":
          for (let k = 0; k < n; k++) x[k] += d.value;
          break;
        case "drift":
          for (let k = 0; k < n; k++) x[k] += (d.ratePerS * k) / sampleRateHz;
          break;
      }
    }
  });
  return { data: out, warnings };
}

function validateDefect(d: RecordDefect, i: number, nChannels: number): void {
  const at = `defects[${i}]`;
  if (typeof d !== "object" || d === null || !KINDS.has((d as { kind?: string }).kind ?? "")) {
    throw new TypeError(`${at}.kind must be one of ${[...KINDS].join(", ")} (got ${describe((d as { kind?: unknown })?.kind)})`);
  }
  if (d.channels !== undefined) {
    assertNumberArray(d.channels, `${at}.channels`);
    d.channels.forEach((c, j) => assertInteger(c, `${at}.channels[${j}]`, 0, nChannels - 1));
  }
  const nonNegative = (x: unknown, name: string): void => {
    assertFiniteNumber(x, `${at}.${name}`);
    if (x < 0) throw new RangeError(`${at}.${name} must be ≥ 0 (got ${x})`);
  };
  switch (d.kind) {
    case "nonFinite":
    case "gap":
      nonNegative(d.startS, "startS");
      nonNegative(d.durationS, "durationS");
      if (d.kind === "gap" && !["nan", "zero", "hold"].includes(d.fill)) {
        throw new TypeError(`${at}.fill must be "nan", "zero" or "hold" (got ${describe(d.fill)})`);
      }
      break;
    case "clip":
      assertPositive(d.fullScale, `${at}.fullScale`);
      break;
    case "flatLine":
      if (d.startS !== undefined) nonNegative(d.startS, "startS");
      if (d.durationS !== undefined) nonNegative(d.durationS, "durationS");
      if (d.value !== undefined) assertFiniteNumber(d.value, `${at}.value`);
      break;
    case "spikes":
      assertInteger(d.count, `${at}.count`, 0, 1e9);
      nonNegative(d.amplitude, "amplitude");
      break;
    case "hum":
      assertPositive(d.frequencyHz, `${at}.frequencyHz`);
      nonNegative(d.amplitude, "amplitude");
      if (d.phaseRad !== undefined) assertFiniteNumber(d.phaseRad, `${at}.phaseRad`);
      break;
    case "offset":
      assertFiniteNumber(d.value, `${at}.value`);
      break;
    case "drift":
      assertFiniteNumber(d.ratePerS, `${at}.ratePerS`);
      break;
  }
}
