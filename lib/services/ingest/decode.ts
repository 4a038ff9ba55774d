/**
 * The data part of an upload → one Float64Array per channel, in the record's units.
 * Shared by the upload (validation before anything is kept) and the analysis worker
 * (decoding the stored blob). Format rules are those of the upload contract:
 *  - text/csv: a header row of channel codes (the meta's order), then one row per sample;
 *  - application/octet-stream: float32 little-endian, interleaved sample by sample;
 *  - either gzip-compressed, recognised by the gzip header (1f 8b 08).
 */
import { createGunzip } from "node:zlib";
import { AppError } from "@/lib/http/errors";
import type { DataFormat } from "@/lib/domain/records";
import { type BufferPool, PooledBytes, uploadBufferPool } from "./buffer-pool";
import { digestUpload } from "./digest-thread";

/** Fewest samples per channel an upload may carry (the identification engine's minimum). */
export const MIN_SAMPLES = 256;

export interface DecodedSamples {
  /** One array per channel, in the meta's channel order. */
  data: Float64Array[];
  sampleCount: number;
}

const invalid = (message: string, rule: string, details: Record<string, unknown> = {}) =>
  new AppError("unprocessable", message, { details: { field: "data", rule, ...details }, fieldErrors: { data: [message] } });

/** The data format a part's Content-Type names, or 415. */
export function dataFormatOf(mimeType: string): DataFormat {
  const t = mimeType.split(";")[0].trim().toLowerCase();
  if (t === "text/csv") return "csv";
  if (t === "application/octet-stream") return "f32le";
  throw new AppError("unsupported_media_type", `The data part must be text/csv or application/octet-stream (got ${t || "none"}).`, {
    details: { field: "data", rule: "data_type", got: t },
  });
}

const tooLargeDecoded = (maxDecodedBytes: number) => new AppError("payload_too_large", `The data exceeds ${maxDecodedBytes} bytes once decompressed.`, {
  details: { field: "data", rule: "max_decoded_bytes", limitBytes: maxDecodedBytes },
});

/** zlib's output piece: 1 MiB, so a standard record is 8 thread-pool round trips and its pieces die young. */
const INFLATE_PIECE_BYTES = 1024 * 1024;

/**
 * Gunzip (every member, RFC 1952 §2.2) on zlib's thread pool straight into pooled memory, piece
 * by piece, refusing output past the limit as soon as it is passed. The pieces are garbage at
 * once; an ~8 MB output buffer per upload kept alive across the checks would be old-generation
 * external memory, which is what schedules V8's full collections.
 */
function gunzipInto(input: Buffer, out: PooledBytes, maxDecodedBytes: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const z = createGunzip({ chunkSize: INFLATE_PIECE_BYTES });
    z.on("data", (piece: Buffer) => {
      if (out.byteLength + piece.length > maxDecodedBytes) {
        z.destroy();
        reject(tooLargeDecoded(maxDecodedBytes));
        return;
      }
      out.append(piece);
    });
    z.on("end", () => resolve());
    z.on("error", reject);
    z.end(input);
  });
}

/** Bytes ready to check and store, and how to hand their memory back. */
export interface InflatedBytes {
  bytes: Buffer;
  /** Return pooled memory (a no-op when `bytes` is the input itself). */
  release(): void;
}

/**
 * Undo gzip when the data starts with a gzip header (1f 8b 08), into a buffer of `pool` (sized
 * from the gzip trailer's ISIZE, RFC 1952 §2.3.1, a hint only: it grows as needed). Without gzip
 * the bytes are returned as they are (the same view).
 * For float32 data a failed inflate means the bytes were raw samples after all (a valid gzip
 * stream with matching CRC cannot arise from sample values by chance); for CSV it is a broken
 * upload (400).
 * @throws AppError 413 when the inflated data exceeds `maxDecodedBytes`, 400 for broken gzip.
 */
export async function inflateIfGzip(bytes: Buffer, format: DataFormat, maxDecodedBytes: number, pool: BufferPool = uploadBufferPool()): Promise<InflatedBytes> {
  if (!(bytes.length >= 3 && bytes[0] === 0x1f && bytes[1] === 0x8b && bytes[2] === 0x08)) return { bytes, release: () => undefined };
  // ISIZE is the last member's size: + 64 KiB of room for earlier small members. The hint is
  // clamped to the limit and to 1032 × the input (deflate's largest ratio, zlib technical
  // details), so a forged trailer cannot make it reserve much.
  const isize = bytes.length >= 4 ? bytes.readUInt32LE(bytes.length - 4) : 0;
  const out = new PooledBytes(pool, Math.max(INFLATE_PIECE_BYTES, Math.min(isize + 64 * 1024, maxDecodedBytes, 1032 * bytes.length)));
  try {
    await gunzipInto(bytes, out, maxDecodedBytes);
    return { bytes: out.view(), release: () => out.release() };
  } catch (e) {
    out.release();
    if (e instanceof AppError) throw e;
    if (format === "f32le") return { bytes, release: () => undefined };
    throw new AppError("bad_request", "The data part starts like gzip but does not decompress.", {
      details: { field: "data", rule: "gzip" }, fieldErrors: { data: ["The data part starts like gzip but does not decompress."] },
    });
  }
}

/** Decode stored or uploaded (already inflated) bytes. @throws AppError 422 naming the rule. */
export function decodeSamples(bytes: Uint8Array, format: DataFormat, channels: string[]): DecodedSamples {
  const out = format === "csv" ? decodeCsv(bytes, channels) : decodeFloat32(bytes, channels.length);
  if (out.sampleCount < MIN_SAMPLES) {
    throw invalid(`The record has ${out.sampleCount} samples per channel; at least ${MIN_SAMPLES} are needed.`, "too_short", {
      samples: out.sampleCount, minSamples: MIN_SAMPLES,
    });
  }
  return out;
}

/**
 * Check uploaded (already inflated) bytes as {@link decodeSamples} would, with the same errors,
 * and hash them (SHA-256, hex). For float32 data this reads the bit patterns in place (an
 * exponent of all ones is ±Infinity or NaN, IEEE 754 §3.4) instead of decoding millions of
 * values the upload does not need; CSV has to be parsed to be checked. The hashing and the
 * float32 scan run off the request thread when the bytes are in shared memory (./digest-thread).
 * @throws AppError 422 naming the rule.
 */
export async function checkAndHashSamples(bytes: Uint8Array, format: DataFormat, channels: string[]): Promise<{ sampleCount: number; sha256: string }> {
  let n: number;
  let sha256: string;
  if (format === "csv") {
    n = decodeCsv(bytes, channels).sampleCount;
    sha256 = (await digestUpload(bytes, 0)).sha256;
  } else {
    const nch = channels.length;
    n = float32Frames(bytes, nch);
    const digest = await digestUpload(bytes, n * nch);
    if (digest.firstNonFinite >= 0) throw nonFinite(Math.floor(digest.firstNonFinite / nch), digest.firstNonFinite % nch);
    sha256 = digest.sha256;
  }
  if (n < MIN_SAMPLES) {
    throw invalid(`The record has ${n} samples per channel; at least ${MIN_SAMPLES} are needed.`, "too_short", { samples: n, minSamples: MIN_SAMPLES });
  }
  return { sampleCount: n, sha256 };
}

const nonFinite = (k: number, c: number) =>
  invalid(`Sample ${k + 1} of channel ${c + 1} is not a finite number.`, "non_finite", { sample: k + 1, channelIndex: c });

/** Whole samples (frames of `nch` float32 values) in `bytes`, or 422 ragged_rows. */
function float32Frames(bytes: Uint8Array, nch: number): number {
  const frame = 4 * nch;
  if (bytes.length === 0 || bytes.length % frame !== 0) {
    throw invalid(`The float32 data has ${bytes.length} bytes, not a whole number of ${nch}-channel samples (${frame} bytes each).`, "ragged_rows", {
      bytes: bytes.length, bytesPerSample: frame,
    });
  }
  return bytes.length / frame;
}

function decodeFloat32(bytes: Uint8Array, nch: number): DecodedSamples {
  const n = float32Frames(bytes, nch);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const data = Array.from({ length: nch }, () => new Float64Array(n));
  for (let k = 0, o = 0; k < n; k++) {
    for (let c = 0; c < nch; c++, o += 4) {
      const v = view.getFloat32(o, true);
      if (!Number.isFinite(v)) throw nonFinite(k, c);
      data[c][k] = v;
    }
  }
  return { data, sampleCount: n };
}

function decodeCsv(bytes: Uint8Array, channels: string[]): DecodedSamples {
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("utf8");
  const nch = channels.length;
  let pos = 0;
  const nextLine = (): string | null => {
    if (pos >= text.length) return null;
    let end = text.indexOf("\n", pos);
    if (end < 0) end = text.length;
    let line = text.slice(pos, end);
    if (line.endsWith("\r")) line = line.slice(0, -1);
    pos = end + 1;
    return line;
  };
  const header = (nextLine() ?? "").replace(/^\uFEFF/, "").split(",").map((s) => s.trim());
  if (header.length !== nch || header.some((h, i) => h !== channels[i])) {
    throw invalid(`The CSV header (${header.join(", ")}) must list the meta's channels in order (${channels.join(", ")}).`, "channel_mismatch", {
      expected: channels, got: header,
    });
  }
  // Rows are counted first so each channel is one allocation (records run to millions of values).
  const bodyStart = pos;
  let rows = 0;
  for (let i = bodyStart; i < text.length; i++) if (text.charCodeAt(i) === 10) rows++;
  if (text.length > bodyStart && text.charCodeAt(text.length - 1) !== 10) rows++;
  const data = Array.from({ length: nch }, () => new Float64Array(rows));
  let k = 0;
  let lineNo = 1;
  for (let line = nextLine(); line !== null; line = nextLine()) {
    lineNo++;
    if (line.trim() === "" && pos >= text.length) break; // one trailing blank line
    const cells = line.split(",");
    if (cells.length !== nch) {
      throw invalid(`CSV line ${lineNo} has ${cells.length} values; the header has ${nch}.`, "ragged_rows", { line: lineNo, values: cells.length, expected: nch });
    }
    for (let c = 0; c < nch; c++) {
      const s = cells[c];
      const v = s.trim() === "" ? Number.NaN : Number(s);
      if (!Number.isFinite(v)) {
        throw invalid(`CSV line ${lineNo}, column ${channels[c]}: '${s.slice(0, 20)}' is not a finite number.`, "non_finite", { line: lineNo, channel: channels[c] });
      }
      data[c][k] = v;
    }
    k++;
  }
  return { data: k === rows ? data : data.map((x) => x.slice(0, k)), sampleCount: k };
}
