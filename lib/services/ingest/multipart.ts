/**
 * Streaming multipart/form-data reader of the upload route (busboy). Reads the two parts
 * of the contract, `meta` and `data`, counting bytes as they arrive: past the limit the
 * request is abandoned with 413, so nothing beyond the limit is ever buffered.
 */
import busboy from "busboy";
import { AppError } from "@/lib/http/errors";
import { PooledBytes, uploadBufferPool } from "./buffer-pool";

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
  body: ReadableStream<Uint8Array> | null, contentType: string | null, declaredLength: number | null, maxBytes: number,
): Promise<UploadParts> {
  if (!contentType || !/^multipart\/form-data\b/i.test(contentType)) {
    throw new AppError("unsupported_media_type", "Send the record as multipart/form-data with parts meta and data.", {
      details: { rule: "multipart_required", got: contentType ?? null },
    });
  }
  if (declaredLength !== null && declaredLength > maxBytes + META_MAX_BYTES) throw tooLarge(maxBytes);
  if (!body) throw bad("The request has no body.", "body_required");
  let bb: busboy.Busboy;
  try {
    bb = busboy({
      headers: { "content-type": contentType },
      // Part counts are checked by name (claim); these limits only stop a flood of parts.
      limits: { fileSize: maxBytes, fieldSize: maxBytes, files: 4, fields: 4, parts: 4 },
    });
  } catch {
    throw bad("The multipart body has no boundary.", "multipart_boundary");
  }

  return new Promise<UploadParts>((resolve, reject) => {
    let meta: string | null = null;
    let data: { bytes: PooledBytes; mimeType: string } | null = null;
    // The data part is copied as it arrives into one pooled buffer sized from Content-Length
    // (no list of chunks, no joining copy, no fresh 7 MB per upload).
    const expected = declaredLength !== null && Number.isFinite(declaredLength) && declaredLength > 0 ? declaredLength : 1024 * 1024;
    const dataBytes = new PooledBytes(uploadBufferPool(), Math.min(expected, maxBytes + META_MAX_BYTES));
    let failed = false;
    const seen = new Set<string>();
    let total = 0;
    // The body is read straight from its web stream into the parser (no Node stream adapter
    // and counting transform per chunk), with backpressure from busboy.
    const reader = body.getReader();
    const fail = (e: unknown) => {
      if (failed) return;
      failed = true;
      dataBytes.release();
      // Stop feeding the parser and drop the request; busboy itself is left to the
      // garbage collector (destroying it from inside its own callbacks corrupts its state).
      reader.cancel().catch(() => undefined);
      reject(e instanceof AppError ? e : bad("The multipart body is malformed.", "multipart_malformed"));
    };
    const pump = async () => {
      for (;;) {
        const { done, value } = await reader.read();
        if (failed) return;
        if (done) {
          bb.end();
          return;
        }
        total += value.byteLength;
        if (total > maxBytes + META_MAX_BYTES) return fail(tooLarge(maxBytes));
        if (!bb.write(value)) await new Promise((r) => bb.once("drain", r));
      }
    };
    const claim = (name: string): boolean => {
      if (name !== "meta" && name !== "data") {
        fail(bad(`Unknown part '${name}': send only meta and data.`, "unknown_part", name));
        return false;
      }
      if (seen.has(name)) {
        fail(bad(`The part '${name}' is sent twice.`, "repeated_part", name));
        return false;
      }
      seen.add(name);
      return true;
    };
    bb.on("file", (name, stream, info) => {
      if (!claim(name)) {
        stream.resume();
        return;
      }
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => (name === "data" ? dataBytes.append(c) : chunks.push(c)));
      stream.on("limit", () => fail(tooLarge(maxBytes)));
      stream.on("end", () => {
        if (failed) return;
        if (name === "meta") meta = Buffer.concat(chunks).toString("utf8");
        else data = { bytes: dataBytes, mimeType: info.mimeType };
      });
    });
    bb.on("field", (name, value, info) => {
      if (!claim(name)) return;
      if (info.valueTruncated) return fail(tooLarge(maxBytes));
      if (name === "meta") meta = value;
      else {
        dataBytes.append(Buffer.from(value, "utf8"));
        data = { bytes: dataBytes, mimeType: info.mimeType };
      }
    });
    bb.on("partsLimit", () => fail(bad("Send exactly two parts: meta and data.", "parts_limit")));
    bb.on("filesLimit", () => fail(bad("Send exactly two parts: meta and data.", "parts_limit")));
    bb.on("fieldsLimit", () => fail(bad("Send exactly two parts: meta and data.", "parts_limit")));
    bb.on("error", fail);
    bb.on("close", () => {
      if (failed) return;
      if (meta === null) return fail(bad("The part 'meta' is missing.", "part_required", "meta"));
      if (data === null) return fail(bad("The part 'data' is missing.", "part_required", "data"));
      if (Buffer.byteLength(meta, "utf8") > META_MAX_BYTES) return fail(bad(`The part 'meta' exceeds ${META_MAX_BYTES} bytes.`, "meta_size", "meta"));
      const d = data;
      resolve({ meta, data: { bytes: d.bytes.view(), mimeType: d.mimeType }, release: () => dataBytes.release() });
    });
    pump().catch(fail);
  });
}
