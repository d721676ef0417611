import { existsSync, mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createS3Store } from '@/lib/storage/s3';
import { defaultFakesDir, mailFakeDir, s3FakeDir, startLocalFakes, type LocalFakes } from '@/scripts/lib/local-fakes';

// Two app instances on one machine must not share the S3 fake's folder: each gets the folder it is given.
const started: LocalFakes[] = [];
afterAll(async () => {
  for (const fakes of started) await fakes.stop();
});

function storeOf(fakes: LocalFakes) {
  return createS3Store({
    bucket: fakes.env.STORAGE_S3_BUCKET,
    endpoint: fakes.env.STORAGE_S3_ENDPOINT,
    region: fakes.env.STORAGE_S3_REGION,
    accessKeyId: fakes.env.STORAGE_S3_ACCESS_KEY_ID,
    secretAccessKey: fakes.env.STORAGE_S3_SECRET_ACCESS_KEY,
  });
}

describe('local fakes: the S3 fake folder is configurable', () => {
  it('S3_FAKE_DIR and LOCAL_FAKES_DIR are honoured; a second MARIADB_DIR gets its own folder', () => {
    expect(s3FakeDir('/x/fakes', { S3_FAKE_DIR: '/y/bucket' })).toBe(resolve('/y/bucket'));
    expect(s3FakeDir('/x/fakes', {})).toBe(join('/x/fakes', 's3'));
    expect(defaultFakesDir({ LOCAL_FAKES_DIR: '/z/f' })).toBe(resolve('/z/f'));
    expect(defaultFakesDir({ MARIADB_DIR: '/data/second-db' })).toBe(resolve('/data/second-db-fakes'));
    expect(defaultFakesDir({})).toBe(join('.data', 'fakes'));
    // the SMTP fake: MAIL_DIR, else .data/mail for npm start's own folder, else the given folder's mail/
    expect(mailFakeDir('/x/fakes', { MAIL_DIR: '/y/mail' })).toBe(resolve('/y/mail'));
    expect(mailFakeDir(join('.data', 'fakes'), {})).toBe(resolve('.data', 'mail'));
    expect(mailFakeDir('/x/fakes', {})).toBe(join('/x/fakes', 'mail'));
  });

  it('two instances with their own folders do not see each other’s objects', async () => {
    const saved = { bucket: process.env.STORAGE_S3_BUCKET, off: process.env.LOCAL_S3_FAKE };
    delete process.env.STORAGE_S3_BUCKET;
    delete process.env.LOCAL_S3_FAKE;
    try {
      const a = await startLocalFakes(mkdtempSync(join(tmpdir(), 'stanceline-fakes-a-')));
      started.push(a);
      const b = await startLocalFakes(mkdtempSync(join(tmpdir(), 'stanceline-fakes-b-')));
      started.push(b);
      expect(a.env.STORAGE_S3_ENDPOINT).not.toBe(b.env.STORAGE_S3_ENDPOINT);
      const file = join(mkdtempSync(join(tmpdir(), 'stanceline-obj-')), 'raw.csv');
      (await import('node:fs')).writeFileSync(file, 'time_s,L1\n');
      await storeOf(a).putFile('recordings/1/one', file, 10);
      expect(await storeOf(a).exists('recordings/1/one')).toBe(true);
      expect(await storeOf(b).exists('recordings/1/one')).toBe(false);
      const dirA = a.names[0].split('files in ')[1];
      const dirB = b.names[0].split('files in ')[1];
      expect(dirA).not.toBe(dirB);
      expect(existsSync(dirA) && readdirSync(dirA).length > 0).toBe(true);
    } finally {
      if (saved.bucket !== undefined) process.env.STORAGE_S3_BUCKET = saved.bucket;
      if (saved.off !== undefined) process.env.LOCAL_S3_FAKE = saved.off;
    }
  });
});
