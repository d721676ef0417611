// A local S3-compatible server (s3rver) on loopback for `npm start` and `npm test`, so the app's object-storage
// path runs for real without any outside service. Files live under `dir`; the bucket is created on start.
import { mkdirSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import S3rver from 's3rver';

// s3rver verifies request signatures against this fixed key pair.
const FAKE_KEY = 'S3RVER';
export const FAKE_BUCKET = 'stanceline-raw';

export async function startS3Fake(dir: string, port = 0): Promise<{ name: string; env: Record<string, string>; stop(): Promise<void> }> {
  mkdirSync(dir, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port, directory: dir, silent: true, configureBuckets: [{ name: FAKE_BUCKET }] });
  const address = (await server.run()) as AddressInfo;
  const endpoint = `http://127.0.0.1:${address.port}`;
  return {
    name: `S3 fake (s3rver) at ${endpoint}, files in ${dir}`,
    env: {
      STORAGE_S3_BUCKET: FAKE_BUCKET,
      STORAGE_S3_ENDPOINT: endpoint,
      STORAGE_S3_REGION: 'us-east-1',
      STORAGE_S3_ACCESS_KEY_ID: FAKE_KEY,
      STORAGE_S3_SECRET_ACCESS_KEY: FAKE_KEY,
    },
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
