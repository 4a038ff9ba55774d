/**
 * S3 driver of the blob store (deployments): one object per key in one bucket, through
 * `@aws-sdk/client-s3`. Works with AWS S3 and S3-compatible stores (path-style addressing and a
 * custom endpoint when S3_FORCE_PATH_STYLE / S3_ENDPOINT are set). Keys are content-addressed,
 * so `put` checks for the object first and never rewrites one that exists.
 */
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from "@aws-sdk/client-s3";
import { assertBlobKey, type BlobStore } from "./blob-store";

export interface S3BlobStoreOptions {
  bucket: string;
  region: string;
  /** Empty or undefined = the AWS endpoint of `region`. */
  endpoint?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle?: boolean;
  /** Key prefix inside the bucket (no leading/trailing slash), e.g. `raw`; empty = none. */
  prefix?: string;
}

export class S3BlobStore implements BlobStore {
  private readonly client: S3Client;
  private readonly bucket: string;
  private readonly prefix: string;

  constructor(opts: S3BlobStoreOptions) {
    if (!opts.bucket) throw new Error("S3 blob store: S3_BUCKET must be set");
    const config: S3ClientConfig = {
      region: opts.region,
      forcePathStyle: opts.forcePathStyle ?? false,
      // Checksums only where S3 requires them: S3-compatible stores do not all accept the
      // SDK's default trailing-checksum (aws-chunked) uploads.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    };
    if (opts.endpoint) config.endpoint = opts.endpoint;
    if (opts.accessKeyId && opts.secretAccessKey) {
      config.credentials = { accessKeyId: opts.accessKeyId, secretAccessKey: opts.secretAccessKey };
    }
    this.client = new S3Client(config);
    this.bucket = opts.bucket;
    this.prefix = opts.prefix ? `${opts.prefix.replace(/^\/+|\/+$/g, "")}/` : "";
  }

  private objectKey(key: string): string {
    assertBlobKey(key);
    return `${this.prefix}${key}`;
  }

  async put(key: string, bytes: Uint8Array): Promise<void> {
    const Key = this.objectKey(key);
    if (await this.headExists(Key)) return;
    await this.client.send(new PutObjectCommand({
      Bucket: this.bucket,
      Key,
      Body: bytes,
      ContentLength: bytes.byteLength,
      ContentType: "application/octet-stream",
    }));
  }

  async get(key: string): Promise<Uint8Array | null> {
    const Key = this.objectKey(key);
    try {
      const res = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key }));
      if (!res.Body) return new Uint8Array(0);
      return await res.Body.transformToByteArray();
    } catch (e) {
      if (isNotFound(e)) return null;
      throw e;
    }
  }

  async has(key: string): Promise<boolean> {
    return this.headExists(this.objectKey(key));
  }

  async delete(key: string): Promise<void> {
    // S3 DeleteObject succeeds for an absent key.
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.objectKey(key) }));
  }

  /** Close the client's sockets (tests, shutdown). */
  destroy(): void {
    this.client.destroy();
  }

  private async headExists(Key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key }));
      return true;
    } catch (e) {
      if (isNotFound(e)) return false;
      throw e;
    }
  }
}

/** NoSuchKey / NotFound, or any 404 answer. */
function isNotFound(e: unknown): boolean {
  if (typeof e !== "object" || e === null) return false;
  const err = e as { name?: unknown; $metadata?: { httpStatusCode?: unknown } };
  return err.name === "NoSuchKey" || err.name === "NotFound" || err.$metadata?.httpStatusCode === 404;
}
