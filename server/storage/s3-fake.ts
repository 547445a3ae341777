import { mkdirSync } from 'node:fs';

import S3rver from 's3rver';

export interface S3Fake {
  endpoint: string;
  stop(): Promise<void>;
}

/** Local S3-compatible server (s3rver) on loopback, storing objects under `directory`. */
export async function startS3Fake(directory: string, port = 0): Promise<S3Fake> {
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port, directory, silent: true, configureBuckets: [] });
  const address = (await server.run()) as { address: string; port: number };
  return { endpoint: `http://127.0.0.1:${address.port}`, stop: () => server.close() as Promise<void> };
}
