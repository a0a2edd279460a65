// s3rver 3.7.1 ships no types; only what the tests use.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  export default class S3rver {
    constructor(options: {
      address?: string;
      port?: number;
      silent?: boolean;
      directory: string;
      resetOnClose?: boolean;
      allowMismatchedSignatures?: boolean;
      configureBuckets?: Array<{ name: string }>;
    });
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
