/** The subset of s3rver's API the storage tests use (the package ships no types). */
declare module "s3rver" {
  import type { AddressInfo } from "node:net";

  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: { name: string; configs?: string[] }[];
  }

  export default class S3rver {
    constructor(options?: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
