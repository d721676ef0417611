// Helpers of the lib/jobs and lib/storage integration tests: a knex on the integration database, reset to the demo
// scenario, and recordings inserted the way the upload route does (raw file stored first, then row + job).
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import knex, { type Knex } from 'knex';
import { inject } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { knexConfig } from '@/knexfile';
import { enqueueRecording } from '@/lib/jobs/queue';
import type { RecordingOptions } from '@/lib/recordings/options';
import type { RawFileStore } from '@/lib/storage/types';

export function databaseUrl(): string {
  return process.env.DATABASE_URL || inject('databaseUrl');
}

export function testDb(): Knex {
  return knex(knexConfig(databaseUrl()));
}

export async function resetDemo(db: Knex): Promise<void> {
  await seedDemo(db);
}

export function tempDir(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `stanceline-${prefix}-`));
}

export const DEFAULT_OPTIONS: RecordingOptions = { layout: null, profile: null, handedness: 'right', stanceWidthMm: 400, cutoffHz: null };

/** Demo athlete 1 (Ada Fenwick), demo session 1 of that athlete, uploaded by coach user 2. */
export async function insertRecording(
  db: Knex,
  store: RawFileStore,
  content: string | Buffer,
  options: Partial<RecordingOptions> = {},
  filename = 'file.csv',
): Promise<{ recordingId: number; key: string }> {
  const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  const spool = join(tempDir('spool'), 'upload.part');
  writeFileSync(spool, bytes);
  const key = `recordings/1/${randomUUID()}`;
  await store.putFile(key, spool, bytes.length);
  const session = await db('practice_sessions').where({ athlete_id: 1 }).orderBy('id').first('id');
  const recordingId = await db.transaction(async (trx) => {
    const [id] = await trx('recordings').insert({
      athlete_id: 1,
      session_id: session.id,
      uploaded_by: 2,
      filename,
      byte_size: bytes.length,
      sha256: createHash('sha256').update(bytes).digest('hex'),
      storage_key: key,
      status: 'received',
      options: JSON.stringify({ ...DEFAULT_OPTIONS, ...options }),
    });
    await enqueueRecording(trx, Number(id), 3);
    return Number(id);
  });
  return { recordingId, key };
}

export async function resultCounts(db: Knex, recordingId: number) {
  const swingIds = (await db('swings').where({ recording_id: recordingId }).select('id')).map((r) => r.id as number);
  const count = async (table: string) =>
    swingIds.length === 0 ? 0 : Number((await db(table).whereIn('swing_id', swingIds).count({ n: '*' }))[0].n);
  return {
    swings: swingIds.length,
    events: await count('swing_events'),
    values: await count('swing_event_values'),
    phases: await count('swing_phase_metrics'),
    series: Number((await db('recording_series').where({ recording_id: recordingId }).count({ n: '*' }))[0].n),
  };
}
