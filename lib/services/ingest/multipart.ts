/**
 * Streaming multipart/form-data reader of the upload route (./multipart-parser). Reads the two parts
 * of the contract, `meta` and `data`, counting bytes as they arrive: past the limit the
 * request is abandoned with 413, so nothing beyond the limit is ever buffered.
 */
import { AppError } from "@/lib/http/errors";
import { PooledBytes, uploadBufferPool } from "./buffer-pool";
import { boundaryOf, MultipartParser } from "./multipart-parser";

export interface UploadParts {
  /** The `meta` part as UTF-8 text. */
  meta: string;
  /** The `data` part as received: a view of a pooled buffer, valid until {@link UploadParts.release}. */
  data: { bytes: Buffer; mimeType: string };
  /** Hand the data part's buffer back to the pool once nothing reads `data.bytes` any more. */
  release(): void;
}

/** Largest `meta` part, bytes. */
export const META_MAX_BYTES = 64 * 1024;

const bad = (message: string, rule: string, field?: string) =>
  new AppError("bad_request", message, { details: { rule, ...(field ? { field } : {}) }, ...(field ? { fieldErrors: { [field]: [message] } } : {}) });
const tooLarge = (limit: number) =>
  new AppError("payload_too_large", `The upload exceeds ${limit} bytes.`, { details: { rule: "max_bytes", limitBytes: limit } });

/**
 * Read `meta` and `data` from a multipart body.
 * @throws AppError 415 (not multipart), 413 (over `maxBytes`), 400 (broken body, missing,
 *   repeated or unknown part).
 */
export async function readUploadParts(
  body: AsyncIterable<Uint8Array> | null, contentType: string | null, declaredLength: number | null, maxBytes: number,
): Promise<UploadParts> {
  if (!contentType || !/^multipart\/form-data\b/i.test(contentType)) {
    throw new AppError("unsupported_media_type", "Send the record as multipart/form-data with parts meta and data.", {
      details: { rule: "multipart_required", got: contentType ?? null },
    });
  }
  if (declaredLength !== null && declaredLength > maxBytes + META_MAX_BYTES) throw tooLarge(maxBytes);
  if (!body) throw bad("The request has no body.", "body_required");
  const boundary = boundaryOf(contentType);
  if (!boundary) throw bad("The multipart body has no boundary.", "multipart_boundary");

  // The data part is copied as it arrives into one pooled buffer sized from Content-Length
  // (no list of chunks, no joining copy, no fresh 7 MB per upload).
  const expected = declaredLength !== null && Number.isFinite(declaredLength) && declaredLength > 0 ? declaredLength : 1024 * 1024;
  const dataBytes = new PooledBytes(uploadBufferPool(), Math.min(expected, maxBytes + META_MAX_BYTES));
  const metaChunks: Buffer[] = [];
  let metaBytes = 0;
  let dataType = "text/plain";
  const seen = new Set<string>();
  const parser = new MultipartParser(boundary, {
    onPart: (h) => {
      const name = h.name ?? "";
      if (name !== "meta" && name !== "data") throw bad(`Unknown part '${name}': send only meta and data.`, "unknown_part", name);
      if (seen.has(name)) throw bad(`The part '${name}' is sent twice.`, "repeated_part", name);
      seen.add(name);
      if (name === "data") {
        // A part without Content-Type is text/plain (RFC 7578 §4.4), which the data check refuses with 415.
        dataType = h.contentType ?? "text/plain";
        return (b) => {
          if (dataBytes.byteLength + b.length > maxBytes) throw tooLarge(maxBytes);
          dataBytes.append(b);
        };
      }
      return (b) => {
        metaBytes += b.length;
        if (metaBytes > META_MAX_BYTES) throw bad(`The part 'meta' exceeds ${META_MAX_BYTES} bytes.`, "meta_size", "meta");
        metaChunks.push(Buffer.from(b));
      };
    },
  });

  // The body (the route's web ReadableStream, or a Node request stream) is read chunk by chunk
  // into the parser; leaving the loop on an error cancels the stream.
  let total = 0;
  try {
    for await (const value of body) {
      total += value.byteLength;
      if (total > maxBytes + META_MAX_BYTES) throw tooLarge(maxBytes);
      // After the close delimiter the rest (the epilogue) is only counted.
      if (!parser.finished) parser.write(Buffer.from(value.buffer, value.byteOffset, value.byteLength));
    }
    parser.end();
    if (!seen.has("meta")) throw bad("The part 'meta' is missing.", "part_required", "meta");
    if (!seen.has("data")) throw bad("The part 'data' is missing.", "part_required", "data");
  } catch (e) {
    dataBytes.release();
    throw e instanceof AppError ? e : bad("The multipart body is malformed.", "multipart_malformed");
  }
  return { meta: Buffer.concat(metaChunks).toString("utf8"), data: { bytes: dataBytes.view(), mimeType: dataType }, release: () => dataBytes.release() };
}
