import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';

/**
 * The local S3 stand-in (s3rver) on loopback, for development and tests, with the documents bucket
 * created on start. `npm start` keeps its files in a directory under .data/; the test runner's
 * instance uses a temporary directory that is removed when it stops. A development dependency:
 * loaded only when started, so the production bundle leaves it out.
 */
export interface FakeS3 {
  url: string;
  stop(): Promise<void>;
}

export interface FakeS3Options {
  port?: number;
  bucket: string;
  /** Where the objects are kept; a fresh temporary directory (removed at stop) when omitted. */
  directory?: string;
}

export async function startFakeS3({ port = 0, bucket, directory }: FakeS3Options): Promise<FakeS3> {
  const host = '127.0.0.1';
  const dir = directory ?? (await fs.mkdtemp(path.join(os.tmpdir(), 'thalpos-s3-')));
  await fs.mkdir(dir, { recursive: true });
  const { default: S3rver } = await import('s3rver');
  const s3 = new S3rver({
    address: host,
    port,
    directory: dir,
    silent: true,
    configureBuckets: [{ name: bucket }],
  });
  const { port: bound } = await s3.run();
  return {
    url: `http://${host}:${bound}`,
    stop: async () => {
      s3.httpServer?.closeAllConnections();
      await s3.close();
      if (!directory) await fs.rm(dir, { recursive: true, force: true });
    },
  };
}
