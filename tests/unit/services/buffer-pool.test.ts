import { describe, expect, it } from "vitest";
import { BufferPool, PooledBytes } from "@/lib/services/ingest/buffer-pool";

const KIB = 1024;

describe("BufferPool (reused upload buffers)", () => {
  it("lends a released buffer again instead of making a new one", () => {
    const pool = new BufferPool(64 * KIB, KIB);
    const a = pool.acquire(3000);
    expect(a.length).toBe(3 * KIB);
    pool.release(a);
    expect(pool.keptBytes).toBe(3 * KIB);
    expect(pool.acquire(2000)).toBe(a);
    expect(pool.keptBytes).toBe(0);
    // Reuse makes nothing new: only the first buffer was ever allocated.
    expect(pool.allocatedBytes).toBe(3 * KIB);
  });

  it("picks the smallest kept buffer that fits and keeps no more than its bound", () => {
    const pool = new BufferPool(10 * KIB, KIB);
    const [small, mid, big] = [pool.acquire(KIB), pool.acquire(4 * KIB), pool.acquire(6 * KIB)];
    pool.release(small);
    pool.release(mid);
    pool.release(big); // 11 KiB > 10 KiB: the smallest goes first
    expect(pool.keptBytes).toBe(10 * KIB);
    expect(pool.acquire(KIB)).toBe(mid);
    expect(pool.acquire(5 * KIB)).toBe(big);
  });

  it("ignores a buffer it did not make and a buffer released twice", () => {
    const pool = new BufferPool(64 * KIB, KIB);
    pool.release(Buffer.alloc(100));
    const a = pool.acquire(KIB);
    pool.release(a);
    pool.release(a);
    expect(pool.keptBytes).toBe(KIB);
  });
});

describe("PooledBytes (a growing upload body)", () => {
  it("keeps every byte in order across growth past the first buffer", () => {
    const pool = new BufferPool(64 * KIB, KIB);
    const bytes = new PooledBytes(pool, 10);
    const expected: number[] = [];
    for (let i = 0; i < 50; i++) {
      const chunk = Uint8Array.from({ length: 97 }, (_, j) => (i * 97 + j) % 251);
      bytes.append(chunk);
      expected.push(...chunk);
    }
    expect(bytes.byteLength).toBe(50 * 97);
    expect([...bytes.view()]).toEqual(expected);
    // The outgrown buffer went back to the pool.
    expect(pool.keptBytes).toBeGreaterThan(0);
  });

  it("ignores appends after release, so a late chunk cannot write into a buffer lent again", () => {
    const pool = new BufferPool(64 * KIB, KIB);
    const first = new PooledBytes(pool, KIB);
    first.append(Uint8Array.of(1, 2, 3));
    first.release();
    const second = new PooledBytes(pool, KIB);
    second.append(Uint8Array.of(9, 9, 9));
    first.append(Uint8Array.of(7, 7, 7));
    expect([...second.view()]).toEqual([9, 9, 9]);
    expect(() => first.view()).toThrow(/after release/);
  });
});
