// The app's raw-file store, chosen by env: S3-compatible storage when STORAGE_S3_BUCKET is set, else STORAGE_DIR.
import { getEnv, type ServerEnv } from '@/lib/env';
import { createLocalStore } from './local';
import { createS3Store } from './s3';
import type { RawFileStore } from './types';

export { createLocalStore } from './local';
export { createS3Store, type S3StoreConfig } from './s3';
export { assertSafeKey, StorageNotFoundError, type RawFileStore } from './types';
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

const globalForStore = globalThis as typeof globalThis & { __stancelineStore?: RawFileStore };

/** The process-wide store (created on first use from the validated environment). */
export function getStore(): RawFileStore {
  globalForStore.__stancelineStore ??= storeFromEnv(getEnv());
  return globalForStore.__stancelineStore;
}
