// Minimal typing of s3rver 3.7 (a local S3 fake; the package ships no types): only what scripts/lib/fakes uses.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  interface S3rverOptions {
    address?: string;
    port?: number;
    directory?: string;
    silent?: boolean;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: unknown[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(callback?: (error?: Error) => void): void;
  }
}
