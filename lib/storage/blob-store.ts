/**
 * Raw-record storage behind one interface (CONVENTIONS §2 `lib/storage`). Blobs are
 * immutable and content-addressed: the key is derived from the bytes' SHA-256, so the same
 * samples uploaded twice are stored once and a reprocess reads exactly what was received.
 */
import { createHash } from "node:crypto";

export interface BlobStore {
  /** Store `bytes` under `key`; storing the same key again is a no-op (content addressing). */
  put(key: string, bytes: Uint8Array): Promise<void>;
  /** The bytes under `key`, or null when absent. */
  get(key: string): Promise<Uint8Array | null>;
  has(key: string): Promise<boolean>;
  /** Remove `key`; absent keys are ignored. */
  delete(key: string): Promise<void>;
}

/** Lower-case hex SHA-256 of `bytes`. */
export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** The content-addressed key of a blob with hex SHA-256 `hash`: `sha256/<hash>`. */
export function contentKey(hash: string): string {
  if (!/^[0-9a-f]{64}$/.test(hash)) throw new RangeError(`hash must be 64 lower-case hex digits (got ${JSON.stringify(hash)})`);
  return `sha256/${hash}`;
}

/** Keys are slash-separated segments of [a-z0-9_.-]; no empty, '.' or '..' segment. */
export function assertBlobKey(key: string): void {
  const ok = typeof key === "string" && key.length > 0 && key.length <= 256
    && key.split("/").every((s) => /^[a-z0-9_.-]+$/.test(s) && s !== "." && s !== "..");
  if (!ok) throw new RangeError(`blob key must be '/'-separated segments of [a-z0-9_.-] (got ${JSON.stringify(key)})`);
}
