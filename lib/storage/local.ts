// Raw files in a local folder (default .data/uploads, git-ignored). putFile renames the spool file when it is on the
// same file system and copies it otherwise; either way the final name appears only once the file is complete.
import { createReadStream } from 'node:fs';
import { copyFile, mkdir, rename, rm, stat } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import type { Readable } from 'node:stream';
import { assertSafeKey, StorageNotFoundError, type RawFileStore } from './types';

export function createLocalStore(dir: string): RawFileStore {
  const root = resolve(dir);
  const pathOf = (key: string) => {
    assertSafeKey(key);
    return join(root, key);
  };
  return {
    description: `local:${root}`,
    config: { kind: 'local', dir: root },
    async putFile(key, localPath) {
      const target = pathOf(key);
      await mkdir(dirname(target), { recursive: true });
      try {
        await rename(localPath, target);
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'EXDEV') throw error;
        const partial = `${target}.partial`;
        await copyFile(localPath, partial);
        await rename(partial, target);
        await rm(localPath, { force: true });
      }
    },
    async read(key, range): Promise<Readable> {
      const path = pathOf(key);
      try {
        await stat(path);
      } catch {
        throw new StorageNotFoundError(key);
      }
      return createReadStream(path, { highWaterMark: 1 << 20, ...(range ? { start: range.start, end: range.end } : {}) });
    },
    async exists(key) {
      try {
        return (await stat(pathOf(key))).isFile();
      } catch {
        return false;
      }
    },
    async remove(key) {
      await rm(pathOf(key), { force: true });
    },
  };
}
