// s3rver ships no types; this is the part the tests use.
declare module 's3rver' {
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory: string;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: unknown[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}
