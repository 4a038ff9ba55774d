/**
 * The process's blob store, chosen by STORAGE_DRIVER: `fs` (default) keeps blobs under
 * MODEWARDEN_DATA_DIR/blobs; `s3` keeps them in S3_BUCKET (S3_ENDPOINT, S3_REGION,
 * S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY, S3_FORCE_PATH_STYLE).
 */
import path from "node:path";
import { env } from "@/lib/config/env";
import type { BlobStore } from "./blob-store";
import { FsBlobStore } from "./fs-blob-store";
import { S3BlobStore } from "./s3-blob-store";

export { contentKey, sha256Hex, type BlobStore } from "./blob-store";

const globalForStore = globalThis as unknown as { __modewardenBlobStore?: BlobStore };

export function blobStore(): BlobStore {
  if (!globalForStore.__modewardenBlobStore) {
    const e = env();
    globalForStore.__modewardenBlobStore = e.STORAGE_DRIVER === "s3"
      ? new S3BlobStore({
          bucket: e.S3_BUCKET,
          region: e.S3_REGION,
          endpoint: e.S3_ENDPOINT,
          accessKeyId: e.S3_ACCESS_KEY_ID,
          secretAccessKey: e.S3_SECRET_ACCESS_KEY,
          forcePathStyle: e.S3_FORCE_PATH_STYLE,
        })
      : new FsBlobStore(blobRoot());
  }
  return globalForStore.__modewardenBlobStore;
}

/** Folder of the filesystem driver: MODEWARDEN_DATA_DIR/blobs (absolute). */
export function blobRoot(): string {
  return path.resolve(env().MODEWARDEN_DATA_DIR, "blobs");
}
