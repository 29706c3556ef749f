/** The parts of the fake S3 server's API Sphereline uses (the package ships no types). */
declare module 's3rver' {
  import type { IncomingMessage, ServerResponse } from 'node:http';

  interface S3rverOptions {
    silent?: boolean;
    directory: string;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    /** Creates the configured buckets in the store folder (run() does it before listening). */
    configureBuckets(): Promise<void>;
    /** The Koa request handler, for a server of our own. */
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
  }
}
