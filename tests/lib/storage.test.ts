import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { text } from 'node:stream/consumers';
import S3rver from 's3rver';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLocalStore, createS3Store, spoolUpload, StorageNotFoundError, type RawFileStore } from '@/lib/storage';
import { tempDir } from './support/recordings';

// The two raw-file stores behave the same: a file put under a key reads back byte for byte, is reported by exists(),
// and is gone after remove(). Checked against Node's own SHA-256 (node:crypto) of the bytes written.

function spoolFile(content: string): { path: string; size: number } {
  const path = join(tempDir('put'), 'a.part');
  writeFileSync(path, content);
  return { path, size: Buffer.byteLength(content) };
}

function contract(name: string, makeStore: () => RawFileStore) {
  describe(`${name} store`, () => {
    it('keeps a file byte for byte and removes it', async () => {
      const store = makeStore();
      const content = '# format: stanceline-recording/1\ntime_s,L1\n0.00,1.5\n'.repeat(2000) + 'ünïcode ✓\n';
      const { path, size } = spoolFile(content);
      await store.putFile('recordings/1/abc-123', path, size);
      expect(await store.exists('recordings/1/abc-123')).toBe(true);
      expect(await text(await store.read('recordings/1/abc-123'))).toBe(content);
      await store.remove('recordings/1/abc-123');
      expect(await store.exists('recordings/1/abc-123')).toBe(false);
    });

    it('reports a missing key as StorageNotFoundError', async () => {
      await expect(makeStore().read('recordings/1/never-stored')).rejects.toBeInstanceOf(StorageNotFoundError);
    });

    it('refuses keys that could leave the store', async () => {
      const { path, size } = spoolFile('x');
      await expect(makeStore().putFile('../outside', path, size)).rejects.toThrow(/unsafe storage key/);
      await expect(makeStore().putFile('/abs/path', path, size)).rejects.toThrow(/unsafe storage key/);
      await expect(makeStore().putFile('a//b', path, size)).rejects.toThrow(/unsafe storage key/);
    });
  });
}

const localDir = tempDir('local-store');
contract('local', () => createLocalStore(localDir));

describe('local store on disk', () => {
  it('moves the spool file into the folder under the key', async () => {
    const { path, size } = spoolFile('hello\n');
    await createLocalStore(localDir).putFile('recordings/7/k1', path, size);
    expect(existsSync(path)).toBe(false);
    expect(readFileSync(join(localDir, 'recordings/7/k1'), 'utf8')).toBe('hello\n');
  });
});

// The S3 path against a local S3 fake (s3rver), started here on a free loopback port.
let fake: S3rver;
let endpoint = '';
beforeAll(async () => {
  fake = new S3rver({ address: '127.0.0.1', port: 0, directory: tempDir('s3rver'), silent: true });
  const address = (await fake.run()) as AddressInfo;
  endpoint = `http://127.0.0.1:${address.port}`;
});
afterAll(async () => {
  await new Promise<void>((resolve) => fake.close(() => resolve()));
});

// A bucket that does not exist yet: the store creates it on first use (createBucket).
contract('S3', () =>
  createS3Store({ bucket: 'raw-test', endpoint, region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER', createBucket: true }),
);

describe('spoolUpload', () => {
  it('counts and hashes what it writes', async () => {
    const chunks = ['time_s,L1\n', '0,1\n'.repeat(10_000), 'end\n'];
    const spooled = await spoolUpload(Readable.from(chunks.map((c) => Buffer.from(c))), tempDir('spool'));
    const all = chunks.join('');
    expect(spooled.byteSize).toBe(Buffer.byteLength(all));
    expect(spooled.sha256).toBe(createHash('sha256').update(all).digest('hex')); // node:crypto reference
    expect(readFileSync(spooled.path, 'utf8')).toBe(all);
    expect(spooled.head.toString('utf8')).toBe(all.slice(0, 8192));
  });

  it('removes the spool file when the source fails', async () => {
    const dir = tempDir('spool-fail');
    const source = new Readable({
      read() {
        this.push(Buffer.from('partial'));
        this.destroy(new Error('connection reset'));
      },
    });
    await expect(spoolUpload(source, dir)).rejects.toThrow(/connection reset/);
    expect(readdirSync(dir)).toEqual([]);
  });
});
