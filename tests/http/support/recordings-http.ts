// Helpers of the recordings HTTP tests: multipart uploads through the signed-in session, polling a recording until
// processing ends, and direct looks at the server's database and S3 fake to check what was kept.
import knex, { type Knex } from 'knex';
import { expect } from 'vitest';
import { knexConfig } from '@/knexfile';
import { createLocalStore } from '@/lib/storage/local';
import { createS3Store } from '@/lib/storage/s3';
import type { RawFileStore } from '@/lib/storage/types';
import type { HttpSession } from './http-session';
import { generateSession } from '@/lib/signal/synthetic';

export type UploadFile = { name: string; content: string | Uint8Array; type?: string };

export async function upload(
  session: HttpSession,
  fields: Record<string, string | number | undefined>,
  files: UploadFile[],
): Promise<{ status: number; body: any }> {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) if (value !== undefined) form.append(key, String(value));
  for (const file of files) form.append('file', new Blob([file.content as BlobPart], { type: file.type ?? 'text/csv' }), file.name);
  const response = await session.fetch('/api/recordings', { method: 'POST', body: form });
  const body = response.headers.get('content-type')?.includes('json') ? await response.json() : await response.text();
  return { status: response.status, body };
}

/** Polls GET /api/recordings/:id until it is ready or failed (the worker runs off the request path). */
export async function settled(session: HttpSession, id: number, timeoutMs = 60_000): Promise<any> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const { status, body } = await session.json(`/api/recordings/${id}`);
    expect(status).toBe(200);
    const b = body as { status: string };
    if (b.status === 'ready' || b.status === 'failed') return body;
    if (Date.now() > until) throw new Error(`recording ${id} still ${b.status} after ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

export function serverDb(): Knex {
  return knex(knexConfig(process.env.DATABASE_URL));
}

/** The raw-file store the server uses: the S3 fake that scripts/test.ts started, or its STORAGE_DIR folder. */
export function serverStore(): RawFileStore | null {
  const bucket = process.env.STORAGE_S3_BUCKET;
  if (!bucket) return process.env.STORAGE_DIR ? createLocalStore(process.env.STORAGE_DIR) : null;
  return createS3Store({
    bucket,
    endpoint: process.env.STORAGE_S3_ENDPOINT,
    region: process.env.STORAGE_S3_REGION ?? 'us-east-1',
    accessKeyId: process.env.STORAGE_S3_ACCESS_KEY_ID,
    secretAccessKey: process.env.STORAGE_S3_SECRET_ACCESS_KEY,
  });
}

export async function resultRows(db: Knex, recordingId: number): Promise<number> {
  const swings = await db('swings').where({ recording_id: recordingId }).select('id');
  const ids = swings.map((s) => s.id);
  if (ids.length === 0) return 0;
  const [e] = await db('swing_events').whereIn('swing_id', ids).count({ n: '*' });
  const [p] = await db('swing_phase_metrics').whereIn('swing_id', ids).count({ n: '*' });
  const [v] = await db('swing_event_values').whereIn('swing_id', ids).count({ n: '*' });
  return ids.length + Number(e.n) + Number(p.n) + Number(v.n);
}

/**
 * A processed recording with swings on an athlete of coach@'s made for it (so the demo athletes' sessions, which other
 * tests count and compare, stay as seeded): a new athlete, a new practice session, the synthetic generator's invented
 * golf session uploaded and processed. Made once per test file.
 */
export type Sample = { athleteId: number; sessionId: number; recordingId: number; swingId: number };
let sample: Promise<Sample> | undefined;
export function sampleRecording(coach: HttpSession): Promise<Sample> {
  sample ??= (async () => {
    const athlete = await coach.json('/api/athletes', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ displayName: `Sample Player ${Date.now().toString(36)}`, handedness: 'right', stanceWidthMm: 380, dateOfBirth: null, homeClub: null }),
    });
    expect(athlete.status).toBe(201);
    const athleteId = (athlete.body as { athlete: { id: number } }).athlete.id;
    const content = generateSession({ seed: 4242, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 3, withMarker: true }).csv();
    const res = await upload(coach, { athleteId, handedness: 'right', stanceWidthMm: 380 }, [{ name: 'sample.csv', content }]);
    expect(res.status).toBe(202);
    const done = await settled(coach, res.body.recordings[0].id);
    expect(done.status).toBe('ready');
    const swing = (done.swings as { id: number; stale: boolean }[]).find((w) => !w.stale);
    if (!swing) throw new Error('the uploaded sample recording has no swings');
    return { athleteId, sessionId: done.sessionId, recordingId: done.id, swingId: swing.id };
  })();
  return sample;
}
