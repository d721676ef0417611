// The app's raw-file store, chosen by env: S3-compatible storage when STORAGE_S3_BUCKET is set, else STORAGE_DIR.
import { getEnv, type ServerEnv } from '@/lib/env';
import { createLocalStore } from './local';
import { createS3Store } from './s3';
import type { RawFileStore } from './types';

export { createLocalStore } from './local';
export { createS3Store, type S3StoreConfig } from './s3';
export { assertSafeKey, StorageNotFoundError, type RawFileStore, type StoreConfig } from './types';
import type { StoreConfig } from './types';
export { spoolUpload, type SpooledFile } from './spool';

export function storeFromEnv(env: Pick<ServerEnv, 'STORAGE_DIR' | 'STORAGE_S3_BUCKET' | 'STORAGE_S3_ENDPOINT' | 'STORAGE_S3_REGION' | 'STORAGE_S3_ACCESS_KEY_ID' | 'STORAGE_S3_SECRET_ACCESS_KEY'>): RawFileStore {
  if (env.STORAGE_S3_BUCKET) {
    return createS3Store({
      bucket: env.STORAGE_S3_BUCKET,
      endpoint: env.STORAGE_S3_ENDPOINT,
      region: env.STORAGE_S3_REGION,
      accessKeyId: env.STORAGE_S3_ACCESS_KEY_ID,
      secretAccessKey: env.STORAGE_S3_SECRET_ACCESS_KEY,
      createBucket: true,
    });
  }
  return createLocalStore(env.STORAGE_DIR);
}

/** The store a StoreConfig describes (a job thread opening the server's store). */
export function storeFromConfig(config: StoreConfig): RawFileStore {
  if (config.kind === 'local') return createLocalStore(config.dir);
  const { kind: _kind, ...s3 } = config;
  return createS3Store(s3);
}

const globalForStore = globalThis as typeof globalThis & { __stancelineStore?: RawFileStore };

/** The process-wide store (created on first use from the validated environment). */
export function getStore(): RawFileStore {
  globalForStore.__stancelineStore ??= storeFromEnv(getEnv());
  return globalForStore.__stancelineStore;
}
