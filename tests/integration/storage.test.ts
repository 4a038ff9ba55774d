/**
 * Blob store contract (issue 4 "Raw storage"): one suite run against every driver — the
 * filesystem driver and the S3 driver, the latter against s3rver, a local S3-compatible fake
 * started here on a free loopback port. Contract from lib/storage/blob-store.ts: put/get/has/
 * delete, content-addressed keys (`sha256/<hex>`), put of an existing key is a no-op, a missing
 * key reads as null / false and deletes without error, malformed keys are refused.
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import S3rver from "s3rver";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { contentKey, sha256Hex, type BlobStore } from "@/lib/storage/blob-store";
import { FsBlobStore } from "@/lib/storage/fs-blob-store";
import { S3BlobStore } from "@/lib/storage/s3-blob-store";

interface Driver {
  name: string;
  setup(): Promise<BlobStore>;
  teardown(): Promise<void>;
}

function fsDriver(): Driver {
  let dir = "";
  return {
    name: "fs",
    async setup() {
      dir = await mkdtemp(path.join(tmpdir(), "modewarden-blobs-"));
      return new FsBlobStore(dir);
    },
    async teardown() {
      if (dir) await rm(dir, { recursive: true, force: true });
    },
  };
}

function s3Driver(): Driver {
  let dir = "";
  let server: S3rver | null = null;
  let store: S3BlobStore | null = null;
  const bucket = "modewarden-raw-test";
  return {
    name: "s3 (s3rver)",
    async setup() {
      dir = await mkdtemp(path.join(tmpdir(), "modewarden-s3rver-"));
      server = new S3rver({ address: "127.0.0.1", port: 0, silent: true, directory: dir, configureBuckets: [{ name: bucket }] });
      const { port } = await server.run();
      // s3rver's fixed credentials (S3RVER/S3RVER); signatures are checked with them.
      store = new S3BlobStore({
        bucket,
        region: "us-east-1",
        endpoint: `http://127.0.0.1:${port}`,
        accessKeyId: "S3RVER",
        secretAccessKey: "S3RVER",
        forcePathStyle: true,
        prefix: "raw",
      });
      return store;
    },
    async teardown() {
      store?.destroy();
      if (server) await server.close();
      if (dir) await rm(dir, { recursive: true, force: true });
    },
  };
}

/** Deterministic pseudo-random bytes (xorshift32) so each case has its own content. */
function bytesOf(seed: number, n: number): Uint8Array {
  const out = new Uint8Array(n);
  let x = seed >>> 0 || 1;
  for (let i = 0; i < n; i++) {
    x ^= x << 13; x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5; x >>>= 0;
    out[i] = x & 0xff;
  }
  return out;
}

for (const driver of [fsDriver(), s3Driver()]) {
  describe(`blob store contract: ${driver.name}`, () => {
    let store: BlobStore;
    beforeAll(async () => {
      store = await driver.setup();
    });
    afterAll(async () => {
      await driver.teardown();
    });

    it("put then get returns the same bytes, and has() is true", async () => {
      const bytes = bytesOf(1, 70_000); // larger than one TCP segment / read chunk
      const key = contentKey(sha256Hex(bytes));
      expect(await store.has(key)).toBe(false);
      await store.put(key, bytes);
      expect(await store.has(key)).toBe(true);
      const back = await store.get(key);
      expect(back).not.toBeNull();
      expect(back!.byteLength).toBe(bytes.byteLength);
      // The key is the SHA-256 of the content (FIPS 180-4): reading back must hash to it.
      expect(contentKey(sha256Hex(back!))).toBe(key);
      expect(Buffer.from(back!).equals(Buffer.from(bytes))).toBe(true);
    });

    it("stores an empty blob", async () => {
      const bytes = new Uint8Array(0);
      // SHA-256 of the empty string (FIPS 180-4 / NIST CSRC example values).
      const key = contentKey(sha256Hex(bytes));
      expect(key).toBe("sha256/e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
      await store.put(key, bytes);
      expect(await store.has(key)).toBe(true);
      expect((await store.get(key))!.byteLength).toBe(0);
    });

    it("putting an existing content key again is a no-op (first bytes kept)", async () => {
      const bytes = bytesOf(2, 4096);
      const key = contentKey(sha256Hex(bytes));
      await store.put(key, bytes);
      // A second put under the same content key must not rewrite the blob: pass different
      // bytes to make a rewrite observable.
      await store.put(key, bytesOf(3, 16));
      await store.put(key, bytes);
      const back = await store.get(key);
      expect(Buffer.from(back!).equals(Buffer.from(bytes))).toBe(true);
    });

    it("a missing key reads as null, has() false, and delete() does not throw", async () => {
      const key = contentKey(sha256Hex(bytesOf(4, 32)));
      expect(await store.get(key)).toBeNull();
      expect(await store.has(key)).toBe(false);
      await expect(store.delete(key)).resolves.toBeUndefined();
    });

    it("delete removes a blob and leaves others", async () => {
      const a = bytesOf(5, 1000);
      const b = bytesOf(6, 1000);
      const ka = contentKey(sha256Hex(a));
      const kb = contentKey(sha256Hex(b));
      await store.put(ka, a);
      await store.put(kb, b);
      await store.delete(ka);
      expect(await store.has(ka)).toBe(false);
      expect(await store.get(ka)).toBeNull();
      expect(await store.has(kb)).toBe(true);
      // A deleted content key can be stored again.
      await store.put(ka, a);
      expect(Buffer.from((await store.get(ka))!).equals(Buffer.from(a))).toBe(true);
    });

    it("refuses malformed keys", async () => {
      for (const bad of ["", "../x", "a//b", "Upper/case", "sha256/../../etc"]) {
        await expect(store.put(bad, new Uint8Array(1))).rejects.toThrow(RangeError);
        await expect(store.get(bad)).rejects.toThrow(RangeError);
      }
    });
  });
}
