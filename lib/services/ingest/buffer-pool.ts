/**
 * Reusable large buffers for upload bodies. A standard record arrives as ~7 MB of gzip; copying
 * it into a fresh buffer per upload costs more in first-touch page faults and in garbage
 * collection (V8 schedules full collections by the external memory allocated) than the copy
 * itself (measured in `npm run bench:ingest`). Buffers handed back are kept, up to a bound, and
 * lent again to later uploads.
 */

const MIB = 1024 * 1024;

export class BufferPool {
  private readonly free: Buffer[] = [];
  private freeBytes = 0;
  private madeBytes = 0;

  /**
   * @param maxFreeBytes most bytes kept while not lent (the rest is left to the collector)
   * @param granule sizes are rounded up to a multiple of this, so buffers fit later uploads
   */
  constructor(private readonly maxFreeBytes: number, private readonly granule = MIB) {}

  /** A buffer of at least `minBytes` (contents undefined): the smallest kept one that fits, or a new one. */
  acquire(minBytes: number): Buffer {
    let best = -1;
    for (let i = 0; i < this.free.length; i++) {
      const b = this.free[i];
      if (b.length >= minBytes && (best < 0 || b.length < this.free[best].length)) best = i;
    }
    if (best >= 0) {
      const [b] = this.free.splice(best, 1);
      this.freeBytes -= b.length;
      return b;
    }
    const size = Math.max(this.granule, Math.ceil(minBytes / this.granule) * this.granule);
    this.madeBytes += size;
    // Shared memory of its own (never a slice of Node's 8 KiB pool), so the digest helper
    // thread can read an upload in place (./digest-thread).
    return Buffer.from(new SharedArrayBuffer(size));
  }

  /** Hand a buffer from {@link acquire} back; the caller must not touch it afterwards. */
  release(buf: Buffer): void {
    if (buf.length % this.granule !== 0 || this.free.includes(buf)) return;
    // Keep the largest buffers when over the bound: small ones are cheap to make again.
    this.free.push(buf);
    this.freeBytes += buf.length;
    this.free.sort((a, b) => b.length - a.length);
    while (this.freeBytes > this.maxFreeBytes && this.free.length) this.freeBytes -= this.free.pop()!.length;
  }

  /** Bytes of all buffers this pool has made so far (for tests and diagnostics: reuse keeps it flat). */
  get allocatedBytes(): number {
    return this.madeBytes;
  }

  /** Bytes currently kept for reuse (for tests and diagnostics). */
  get keptBytes(): number {
    return this.freeBytes;
  }
}

/**
 * Bytes appended piece by piece into a pooled buffer, grown (by acquiring a larger one) when a
 * piece does not fit. After {@link PooledBytes.release} appends are ignored, so a late chunk of
 * an abandoned request can never write into a buffer already lent to another upload.
 */
export class PooledBytes {
  private buf: Buffer | null;
  private length = 0;

  constructor(private readonly pool: BufferPool, expectedBytes: number) {
    this.buf = pool.acquire(Math.max(1, expectedBytes));
  }

  append(chunk: Uint8Array): void {
    if (!this.buf) return;
    const need = this.length + chunk.byteLength;
    if (need > this.buf.length) {
      const bigger = this.pool.acquire(Math.max(need, 2 * this.buf.length));
      this.buf.copy(bigger, 0, 0, this.length);
      this.pool.release(this.buf);
      this.buf = bigger;
    }
    this.buf.set(chunk, this.length);
    this.length = need;
  }

  /** The bytes appended so far, a view of the pooled buffer (valid until release). */
  view(): Buffer {
    if (!this.buf) throw new Error("PooledBytes used after release");
    return this.buf.subarray(0, this.length);
  }

  get byteLength(): number {
    return this.length;
  }

  release(): void {
    if (this.buf) this.pool.release(this.buf);
    this.buf = null;
  }
}

const globalForPool = globalThis as unknown as { __modewardenUploadPool?: BufferPool };

/** The process's pool for upload bodies: keeps up to 128 MiB (about 16 standard gzip records). */
export function uploadBufferPool(): BufferPool {
  globalForPool.__modewardenUploadPool ??= new BufferPool(128 * MIB);
  return globalForPool.__modewardenUploadPool;
}
