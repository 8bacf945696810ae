// The parts of s3rver 3.7 (which ships no types) that the local S3 stand-in uses.
declare module 's3rver' {
  import type { Server } from 'node:http';
  import type { AddressInfo } from 'node:net';
  interface S3rverOptions {
    address?: string;
    port?: number;
    directory: string;
    silent?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    httpServer?: Server;
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
