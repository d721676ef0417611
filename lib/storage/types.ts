// The raw-file store: where uploaded recordings are kept, byte for byte, before anything parses them.
import type { Readable } from 'node:stream';

export interface S3StoreConfig {
  bucket: string;
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** create the bucket when it does not exist (local fakes, first start) */
  createBucket?: boolean;
}

/** What makes a store, as plain data: another thread (the job pool's) opens the same store from it. */
export type StoreConfig = { kind: 'local'; dir: string } | ({ kind: 's3' } & S3StoreConfig);

export interface RawFileStore {
  /** "local:/abs/dir" or "s3:bucket", for logs */
  readonly description: string;
  readonly config: StoreConfig;
  /** Moves a finished local file (a spool file of the upload) into the store under `key`. */
  putFile(key: string, localPath: string, byteSize: number): Promise<void>;
  /**
   * The stored bytes as a stream (only bytes start..end, inclusive, when a range is given: HTTP Range for videos);
   * throws StorageNotFoundError when nothing is stored under `key`.
   */
  read(key: string, range?: { start: number; end: number }): Promise<Readable>;
  exists(key: string): Promise<boolean>;
  remove(key: string): Promise<void>;
}

export class StorageNotFoundError extends Error {
  override name = 'StorageNotFoundError';
  constructor(readonly key: string) {
    super(`no stored file under "${key}"`);
  }
}

/** Keys are relative paths of safe characters: no "..", no leading "/", so a key can never leave its folder. */
export function assertSafeKey(key: string): void {
  if (!/^[A-Za-z0-9][A-Za-z0-9._/-]{0,240}$/.test(key) || key.split('/').some((part) => part === '..' || part === '')) {
    throw new RangeError(`unsafe storage key "${key}"`);
  }
}
