/**
 * SHA-256 and the float32 finiteness scan of an upload, off the request thread. A standard
 * record is ~7.7 MB: hashing and scanning it take ~7 ms of one core, which on the request
 * thread is 7 ms during which no other gateway's upload moves. Here they run on one helper
 * thread reading the pooled buffer in place (a SharedArrayBuffer, no copy), so with several
 * gateways uploading at once the request thread and the helper share the machine's cores
 * (measured in `npm run bench:ingest`).
 *
 * Only bytes in shared memory can go to the helper; anything else, or a helper that failed,
 * is digested on the calling thread with the same functions, so the answer never depends on
 * where it was computed.
 */
import { Worker } from "node:worker_threads";
import { sha256Hex } from "@/lib/storage/blob-store";

/** Outcome of {@link digestUpload}: the hex SHA-256 and, for float32, the first non-finite value's index (-1: none). */
export interface UploadDigest {
  sha256: string;
  firstNonFinite: number;
  /** Where it was computed: the helper thread, or the calling thread (ordinary memory, or a failed helper). */
  thread: "helper" | "caller";
}

const EXPONENT_MASK = 0x7f800000;

/**
 * Index of the first float32 (little-endian) whose exponent bits are all ones — ±Infinity or
 * NaN (IEEE 754 §3.4) — among the first `count` values, or -1.
 */
export function firstNonFiniteF32(bytes: Uint8Array, count: number): number {
  if (bytes.byteOffset % 4 === 0 && isLittleEndianHost) {
    const words = new Uint32Array(bytes.buffer, bytes.byteOffset, count);
    for (let i = 0; i < count; i++) if ((words[i] & EXPONENT_MASK) === EXPONENT_MASK) return i;
    return -1;
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let i = 0; i < count; i++) if ((view.getUint32(4 * i, true) & EXPONENT_MASK) === EXPONENT_MASK) return i;
  return -1;
}

const isLittleEndianHost = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

function digestHere(bytes: Uint8Array, floatCount: number): UploadDigest {
  return { sha256: sha256Hex(bytes), firstNonFinite: floatCount > 0 ? firstNonFiniteF32(bytes, floatCount) : -1, thread: "caller" };
}

// The helper's program: the same scan and hash as above, written out because a worker started
// from a file would have to survive the app's bundler. It is checked against digestHere in
// tests/unit/services/digest-thread.test.ts.
const HELPER_SOURCE = `
const { parentPort } = require("node:worker_threads");
const { createHash } = require("node:crypto");
const MASK = ${EXPONENT_MASK};
parentPort.on("message", (m) => {
  try {
    const bytes = new Uint8Array(m.buffer, m.offset, m.length);
    let bad = -1;
    if (m.floatCount > 0) {
      const words = new Uint32Array(m.buffer, m.offset, m.floatCount);
      for (let i = 0; i < m.floatCount; i++) if ((words[i] & MASK) === MASK) { bad = i; break; }
    }
    parentPort.postMessage({ id: m.id, sha256: createHash("sha256").update(bytes).digest("hex"), firstNonFinite: bad });
  } catch (e) {
    parentPort.postMessage({ id: m.id, error: String(e && e.message || e) });
  }
});
`;

interface Pending { resolve: (d: UploadDigest) => void; reject: (e: Error) => void }

class DigestHelper {
  private worker: Worker | null = null;
  private readonly pending = new Map<number, Pending>();
  private nextId = 1;

  run(bytes: Uint8Array, floatCount: number): Promise<UploadDigest> {
    const worker = this.ensure();
    const id = this.nextId++;
    return new Promise<UploadDigest>((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      // Referenced while it has work, so a process awaiting a digest does not exit under it.
      if (this.pending.size === 1) worker.ref();
      worker.postMessage({ id, buffer: bytes.buffer, offset: bytes.byteOffset, length: bytes.byteLength, floatCount });
    });
  }

  private ensure(): Worker {
    if (this.worker) return this.worker;
    const w = new Worker(HELPER_SOURCE, { eval: true });
    // Idle, it must not keep a process (a CLI, a test run) alive.
    w.unref();
    w.on("message", (m: { id: number; sha256?: string; firstNonFinite?: number; error?: string }) => {
      const p = this.pending.get(m.id);
      if (!p) return;
      this.pending.delete(m.id);
      if (this.pending.size === 0) w.unref();
      if (m.error !== undefined) p.reject(new Error(m.error));
      else p.resolve({ sha256: m.sha256!, firstNonFinite: m.firstNonFinite!, thread: "helper" });
    });
    const fail = (err: Error) => {
      if (this.worker !== w) return;
      this.worker = null;
      for (const p of this.pending.values()) p.reject(err);
      this.pending.clear();
    };
    w.on("error", fail);
    w.on("exit", (code) => fail(new Error(`the digest helper thread exited (${code})`)));
    this.worker = w;
    return w;
  }

  async close(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    if (w) await w.terminate();
  }
}

const globalForDigest = globalThis as unknown as { __modewardenDigestHelper?: DigestHelper };

/**
 * SHA-256 of `bytes` and, when `floatCount` > 0, the index of the first non-finite float32 among
 * its first `floatCount` values. Bytes in a SharedArrayBuffer are digested on the helper thread;
 * others (and everything, should the helper fail) on this one.
 */
export async function digestUpload(bytes: Uint8Array, floatCount: number): Promise<UploadDigest> {
  if (!(bytes.buffer instanceof SharedArrayBuffer) || bytes.byteOffset % 4 !== 0 || !isLittleEndianHost) return digestHere(bytes, floatCount);
  globalForDigest.__modewardenDigestHelper ??= new DigestHelper();
  try {
    return await globalForDigest.__modewardenDigestHelper.run(bytes, floatCount);
  } catch {
    return digestHere(bytes, floatCount);
  }
}

/** Stop the helper thread (tests; processes that exit need not call it, the thread is unref'd). */
export async function closeDigestHelper(): Promise<void> {
  await globalForDigest.__modewardenDigestHelper?.close();
  globalForDigest.__modewardenDigestHelper = undefined;
}
