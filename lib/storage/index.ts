/**
 * The process's blob store, chosen by STORAGE_DRIVER: `fs` (default) keeps blobs under
 * MODEWARDEN_DATA_DIR/blobs. The S3 driver is not written yet and fails at first use.
 */
import path from "node:path";
import { env } from "@/lib/config/env";
import type { BlobStore } from "./blob-store";
import { FsBlobStore } from "./fs-blob-store";

export { contentKey, sha256Hex, type BlobStore } from "./blob-store";

const globalForStore = globalThis as unknown as { __modewardenBlobStore?: BlobStore };

export function blobStore(): BlobStore {
  if (!globalForStore.__modewardenBlobStore) {
    const e = env();
    if (e.STORAGE_DRIVER !== "fs") throw new Error(`STORAGE_DRIVER=${e.STORAGE_DRIVER} is not available yet; use fs`);
    globalForStore.__modewardenBlobStore = new FsBlobStore(blobRoot());
  }
  return globalForStore.__modewardenBlobStore;
}

/** Folder of the filesystem driver: MODEWARDEN_DATA_DIR/blobs (absolute). */
export function blobRoot(): string {
  return path.resolve(env().MODEWARDEN_DATA_DIR, "blobs");
}
