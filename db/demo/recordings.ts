// Demo recordings: invented sessions made by the project's synthetic generator (lib/signal/synthetic), stored
// and processed through the same pipeline as an upload (raw file into the store, recording row + job, the worker's
// processing code), so the demo coach opens sessions that already have swings. Deterministic: fixed seeds and ids.
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { enqueueRecording } from '../../lib/jobs/queue';
import { drainQueue } from '../../lib/jobs/worker';
import type { RecordingOptions } from '../../lib/recordings/options';
import { DISTRACTORS, generateSession } from '../../lib/signal/synthetic';
import type { RawFileStore } from '../../lib/storage/types';
import { DEMO_ATHLETES, DEMO_SESSIONS } from './scenario';
import { seedDemoShots } from './shots';
import { seedDemoSwingNotes } from './swing-notes';

export interface DemoRecording {
  id: number;
  sessionId: number;
  athleteId: number;
  filename: string;
  seed: number;
  swings: number;
  durationS: number;
}

// Sessions of coach@ (Maren Solberg): Ada Fenwick's lesson, practice and on-course round (so practice can be compared
// with play on the course), Jonah Pelliker's lesson (left-handed), Sunniva Ashdale's lesson. Session ids from
// scenario.ts.
export const DEMO_RECORDINGS: readonly DemoRecording[] = [
  { id: 1, sessionId: 1, athleteId: 1, filename: 'ada-lesson-block-1.csv', seed: 101, swings: 6, durationS: 150 },
  { id: 2, sessionId: 1, athleteId: 1, filename: 'ada-lesson-block-2.csv', seed: 102, swings: 5, durationS: 120 },
  { id: 3, sessionId: 2, athleteId: 1, filename: 'ada-step-drill.csv', seed: 103, swings: 8, durationS: 180 },
  { id: 4, sessionId: 4, athleteId: 2, filename: 'jonah-lesson.csv', seed: 104, swings: 6, durationS: 150 },
  { id: 5, sessionId: 6, athleteId: 3, filename: 'sunniva-narrow-stance.csv', seed: 105, swings: 5, durationS: 120 },
  { id: 6, sessionId: 3, athleteId: 1, filename: 'ada-front-nine.csv', seed: 106, swings: 6, durationS: 180 },
];

/** When each demo recording began: 10:00 UTC on its session's date, the next block of the same session 4 minutes later. */
export function recordedAt(demo: DemoRecording): string {
  const date = DEMO_SESSIONS.find((s) => s.id === demo.sessionId)!.sessionDate;
  const block = DEMO_RECORDINGS.filter((d) => d.sessionId === demo.sessionId).indexOf(demo);
  return `${date}T10:${String(4 * block).padStart(2, '0')}:00Z`;
}

/** Adds the demo recordings to a freshly seeded demo database and processes them. Returns how many ended ready. */
export async function seedDemoRecordings(knex: Knex, store: RawFileStore): Promise<number> {
  const dir = mkdtempSync(join(tmpdir(), 'stanceline-demo-'));
  try {
    for (const demo of DEMO_RECORDINGS) {
      const athlete = DEMO_ATHLETES.find((a) => a.id === demo.athleteId)!;
      const csv = generateSession({
        seed: demo.seed,
        sampleRateHz: 100,
        sensorsPerFoot: 8,
        units: 'N',
        handedness: athlete.handedness,
        stanceWidthMm: athlete.stanceWidthMm,
        swings: demo.swings,
        withMarker: false,
        distractors: DISTRACTORS,
        durationS: demo.durationS,
        metadata: { recorded_at: recordedAt(demo) },
      }).csv();
      const path = join(dir, demo.filename);
      writeFileSync(path, csv);
      const key = `demo/recording-${demo.id}.csv`;
      await store.putFile(key, path, Buffer.byteLength(csv));
      const options: RecordingOptions = { layout: null, profile: null, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm, cutoffHz: null };
      await knex.transaction(async (trx) => {
        await trx('recordings').insert({
          id: demo.id,
          athlete_id: demo.athleteId,
          session_id: demo.sessionId,
          uploaded_by: 2,
          filename: demo.filename,
          byte_size: Buffer.byteLength(csv),
          sha256: createHash('sha256').update(csv).digest('hex'),
          storage_key: key,
          status: 'received',
          options: JSON.stringify(options),
        });
        await enqueueRecording(trx, demo.id, 3);
      });
    }
    await drainQueue({ db: knex, store, workerId: 'demo-seed', pollMs: 100, lockTimeoutS: 60 });
    await seedDemoSwingNotes(knex);
    await seedDemoShots(knex, store);
    const [row] = await knex('recordings').where({ status: 'ready' }).whereIn('id', DEMO_RECORDINGS.map((d) => d.id)).count({ n: '*' });
    return Number(row.n);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
