/**
 * Pure parsers of a record as the upload contract carries it (PRODUCT.md, Upload contract):
 * the `meta` JSON, and the `data` part as CSV (a header row of channel codes, one row per
 * sample) or float32 little-endian interleaved sample by sample. Decompression (gzip) is the
 * caller's job — this module has no I/O and runs in a browser, a worker or a test.
 * Values are returned in the record's unit; convert with units.ts.
 */
import { assertFiniteNumber, describe } from "@/lib/numeric/validate";
import type { AccelerationUnit } from "./units";

export interface RecordMeta {
  recordId: string;
  /** ISO 8601 UTC instant of the first sample. */
  startedAt: string;
  sampleRateHz: number;
  channels: string[];
  units: AccelerationUnit;
  temperatureC: number;
  environment?: { windSpeedMps?: number; humidityPct?: number };
}

const UNITS: readonly AccelerationUnit[] = ["m/s2", "g", "mg"];

/**
 * Checks and types the `meta` object of an upload.
 * @param meta - parsed JSON.
 * @returns the typed meta.
 * @throws TypeError for a missing or wrong-typed field; RangeError for a value out of range
 *   (sample rate outside (0, 100 000] Hz, no channels, repeated channels, an unknown unit, a
 *   startedAt that is not an ISO 8601 UTC instant, a temperature outside [−80, 80] °C).
 */
export function parseRecordMeta(meta: unknown): RecordMeta {
  if (typeof meta !== "object" || meta === null || Array.isArray(meta)) throw new TypeError(`meta must be a JSON object (got ${describe(meta)})`);
  const m = meta as Record<string, unknown>;
  if (typeof m.recordId !== "string" || m.recordId.trim() === "") throw new TypeError(`meta.recordId must be a non-empty string (got ${describe(m.recordId)})`);
  if (typeof m.startedAt !== "string") throw new TypeError(`meta.startedAt must be an ISO 8601 string (got ${describe(m.startedAt)})`);
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]00:00)$/.test(m.startedAt) || Number.isNaN(Date.parse(m.startedAt))) {
    throw new RangeError(`meta.startedAt must be an ISO 8601 UTC instant like 2025-03-01T12:00:00Z (got ${describe(m.startedAt)})`);
  }
  assertFiniteNumber(m.sampleRateHz, "meta.sampleRateHz");
  if (!(m.sampleRateHz > 0 && m.sampleRateHz <= 100_000)) throw new RangeError(`meta.sampleRateHz must be within (0, 100000] (got ${m.sampleRateHz})`);
  if (!Array.isArray(m.channels)) throw new TypeError(`meta.channels must be an array of channel codes (got ${describe(m.channels)})`);
  if (m.channels.length === 0) throw new RangeError("meta.channels must list at least 1 channel (got 0)");
  m.channels.forEach((c, i) => {
    if (typeof c !== "string" || c.trim() === "") throw new TypeError(`meta.channels[${i}] must be a non-empty string (got ${describe(c)})`);
  });
  const channels = m.channels as string[];
  if (new Set(channels).size !== channels.length) throw new RangeError(`meta.channels must be distinct (got ${channels.join(", ")})`);
  if (!UNITS.includes(m.units as AccelerationUnit)) throw new RangeError(`meta.units must be one of ${UNITS.join(", ")} (got ${describe(m.units)})`);
  assertFiniteNumber(m.temperatureC, "meta.temperatureC");
  if (m.temperatureC < -80 || m.temperatureC > 80) throw new RangeError(`meta.temperatureC must be within [-80, 80] (got ${m.temperatureC})`);
  const out: RecordMeta = { recordId: m.recordId, startedAt: m.startedAt, sampleRateHz: m.sampleRateHz, channels: [...channels], units: m.units as AccelerationUnit, temperatureC: m.temperatureC };
  if (m.environment !== undefined) {
    if (typeof m.environment !== "object" || m.environment === null) throw new TypeError(`meta.environment must be an object (got ${describe(m.environment)})`);
    const e = m.environment as Record<string, unknown>;
    const env: RecordMeta["environment"] = {};
    if (e.windSpeedMps !== undefined) {
      assertFiniteNumber(e.windSpeedMps, "meta.environment.windSpeedMps");
      if (e.windSpeedMps < 0) throw new RangeError(`meta.environment.windSpeedMps must be ≥ 0 (got ${e.windSpeedMps})`);
      env.windSpeedMps = e.windSpeedMps;
    }
    if (e.humidityPct !== undefined) {
      assertFiniteNumber(e.humidityPct, "meta.environment.humidityPct");
      if (e.humidityPct < 0 || e.humidityPct > 100) throw new RangeError(`meta.environment.humidityPct must be within [0, 100] (got ${e.humidityPct})`);
      env.humidityPct = e.humidityPct;
    }
    out.environment = env;
  }
  return out;
}

/**
 * Parses CSV data: a header row equal to `channels` (same codes, same order), then one row
 * of numbers per sample. Comma separated; blank trailing lines ignored; CRLF accepted.
 * @param text - the CSV text.
 * @param channels - expected channel codes in column order.
 * @returns one Float64Array per channel.
 * @throws TypeError for a cell that is not a finite number (row and column named);
 *   RangeError for a header mismatch, a ragged row or no data rows.
 */
export function parseCsvRecord(text: string, channels: readonly string[]): Float64Array[] {
  if (typeof text !== "string") throw new TypeError(`text must be a string (got ${describe(text)})`);
  if (!Array.isArray(channels) || channels.length === 0) throw new TypeError("channels must be a non-empty array of codes");
  const lines = text.split(/\r?\n/);
  while (lines.length > 0 && lines[lines.length - 1].trim() === "") lines.pop();
  if (lines.length === 0) throw new RangeError("CSV must have a header row (got an empty text)");
  const header = lines[0].split(",").map((h) => h.trim().replace(/^"(.*)"$/, "$1"));
  if (header.length !== channels.length || header.some((h, i) => h !== channels[i])) {
    throw new RangeError(`CSV header must equal meta.channels in order (got ${header.join(",")}; expected ${channels.join(",")})`);
  }
  const rows = lines.length - 1;
  if (rows < 1) throw new RangeError("CSV must have at least 1 data row (got 0)");
  const n = channels.length;
  const out = channels.map(() => new Float64Array(rows));
  for (let r = 0; r < rows; r++) {
    const cells = lines[r + 1].split(",");
    if (cells.length !== n) throw new RangeError(`CSV row ${r + 2} must have ${n} values (got ${cells.length})`);
    for (let c = 0; c < n; c++) {
      const s = cells[c].trim();
      const v = s === "" ? NaN : Number(s);
      if (!Number.isFinite(v)) throw new TypeError(`CSV row ${r + 2}, column ${channels[c]} must be a finite number (got ${JSON.stringify(cells[c])})`);
      out[c][r] = v;
    }
  }
  return out;
}

/**
 * Parses float32 little-endian samples interleaved sample by sample (s0c0, s0c1, …).
 * @param bytes - the raw bytes (not gzip-compressed).
 * @param channelCount - number of channels, integer ≥ 1.
 * @returns one Float64Array per channel.
 * @throws TypeError for a non-byte input or a non-finite sample (index named); RangeError for
 *   a byte count that is not a multiple of 4·channels, or no samples.
 */
export function parseFloat32Record(bytes: Uint8Array, channelCount: number): Float64Array[] {
  if (!(bytes instanceof Uint8Array)) throw new TypeError(`bytes must be a Uint8Array (got ${describe(bytes)})`);
  if (!Number.isInteger(channelCount) || channelCount < 1) throw new RangeError(`channelCount must be an integer ≥ 1 (got ${channelCount})`);
  const frame = 4 * channelCount;
  if (bytes.byteLength === 0 || bytes.byteLength % frame !== 0) {
    throw new RangeError(`float32 data must be a non-empty multiple of 4·channels = ${frame} bytes (got ${bytes.byteLength})`);
  }
  const samples = bytes.byteLength / frame;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = Array.from({ length: channelCount }, () => new Float64Array(samples));
  for (let s = 0; s < samples; s++) {
    for (let c = 0; c < channelCount; c++) {
      const v = view.getFloat32((s * channelCount + c) * 4, true);
      if (!Number.isFinite(v)) throw new TypeError(`float32 sample ${s} of channel ${c} must be finite (got ${v})`);
      out[c][s] = v;
    }
  }
  return out;
}

/** True when `bytes` starts with the gzip magic number 1f 8b (RFC 1952). */
export function isGzip(bytes: Uint8Array): boolean {
  return bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
}
