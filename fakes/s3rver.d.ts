// s3rver 3.x ships no type declarations; this covers what fakes/s3.ts uses.
declare module "s3rver" {
  import type { AddressInfo } from "node:net";

  export interface S3rverBucketConfig {
    name: string;
    configs?: Array<string | Buffer>;
  }

  export interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    serviceEndpoint?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: S3rverBucketConfig[];
  }

  export default class S3rver {
    constructor(options?: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
    reset(): void;
  }
}
