import type { Knex } from 'knex';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { swingViewResponseSchema } from '@/lib/contracts/swings';
import { timeAxis } from '@/components/swings/swing-view-model';
import type { Viewer } from '@/lib/auth/viewer';
import { closeDb, db as appDb } from '@/lib/db/client';
import { getSwingDetail, swingViewText } from '@/lib/db/swings';
import { patchSwing } from '@/lib/swings/patch';
import { SWING_PART_FORMAT } from '@/lib/swings/payload-build';
import { drainQueue } from '@/lib/jobs/worker';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { resetToDemo } from './db-fixture';
import { insertRecording, tempDir } from './support/recordings';

// The stored viewer payload (lib/swings/payload-build.ts) spliced into GET /api/swings/:id's body: the text is one
// JSON document in the shape the viewer's zod schema checks, and its columns line up with the stored full-rate window.

const coach: Viewer = { id: 2, role: 'coach', academyId: 1, name: 'x', email: 'x@stanceline.test' };
const store = createLocalStore(tempDir('payload-store'));
let db: Knex;

beforeEach(async () => {
  await resetToDemo();
  db = appDb;
});
afterAll(async () => {
  await resetToDemo();
  await closeDb();
});

describe('stored swing payload', () => {
  it('every swing of a processed recording answers a body the viewer schema accepts', async () => {
    const csv = generateSession({ seed: 12, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 4, withMarker: false, distractors: ['walk', 'waggle'] }).csv();
    const { recordingId } = await insertRecording(db, store, csv);
    expect(await drainQueue({ db, store, workerId: 'payload', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
    const swings = await db('swings').where({ recording_id: recordingId }).orderBy('swing_index').select('id', 'start_s', 'end_s');
    expect(swings.length).toBe(4);
    for (const s of swings) {
      const text = await swingViewText(coach, Number(s.id));
      const parsed = swingViewResponseSchema.safeParse(JSON.parse(text));
      expect(parsed.error?.issues ?? []).toEqual([]);
      const view = parsed.data!.swing;
      const time = timeAxis(view.series.time);
      expect(time[0]).toBeCloseTo(Number(s.start_s), 3);
      expect(time.at(-1)).toBeCloseTo(Number(s.end_s), 3);
      expect(view.series.leadPct).toHaveLength(time.length);
    }
  });

  it('the same body for the inline and the stored path: a missing payload row is rebuilt identically', async () => {
    const csv = generateSession({ seed: 4, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 2, withMarker: true }).csv();
    const { recordingId } = await insertRecording(db, store, csv);
    expect(await drainQueue({ db, store, workerId: 'payload', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
    const id = Number((await db('swings').where({ recording_id: recordingId }).orderBy('swing_index').first('id')).id);
    const stored = await swingViewText(coach, id);
    await db('swing_payloads').where({ swing_id: id }).delete(); // a swing processed before payloads were stored
    expect(await swingViewText(coach, id)).toBe(stored);
    expect(await db('swing_payloads').where({ swing_id: id }).first('swing_id')).toBeTruthy();
  });

  it('the stored events, values and phases are the tables’ own: after processing, a correction and its reset', async () => {
    const csv = generateSession({ seed: 9, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 3, withMarker: true }).csv();
    const { recordingId } = await insertRecording(db, store, csv);
    expect(await drainQueue({ db, store, workerId: 'payload', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
    const ids = (await db('swings').where({ recording_id: recordingId }).orderBy('swing_index').select('id')).map((r) => Number(r.id));
    // getSwingDetail reads swing_events, swing_event_values and swing_phase_metrics afresh (the swing page's tables)
    const same = async (id: number) => {
      const view = JSON.parse(await swingViewText(coach, id)).swing;
      const { detail } = await getSwingDetail(coach, id);
      expect(view.events).toEqual(detail.events);
      expect(view.phases).toEqual(detail.phases);
      return view as { events: { name: string; timeS: number; source: string }[]; phases: unknown[] };
    };
    for (const id of ids) expect((await same(id)).events.length).toBeGreaterThan(0);
    const before = await same(ids[1]);
    const top = before.events.find((e) => e.name === 'top')!;
    await patchSwing(coach, ids[1], { events: { top: top.timeS + 0.03 } });
    const moved = await same(ids[1]);
    expect(moved.events.find((e) => e.name === 'top')).toMatchObject({ source: 'manual' });
    expect(moved.phases).not.toEqual(before.phases); // the phases around top changed length
    await patchSwing(coach, ids[1], { resetEvents: 'all' });
    expect((await same(ids[1])).events).toEqual(before.events);
  });

  it('a stored part of an older form is rebuilt on its next read', async () => {
    const csv = generateSession({ seed: 5, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 1, withMarker: true }).csv();
    const { recordingId } = await insertRecording(db, store, csv);
    expect(await drainQueue({ db, store, workerId: 'payload', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
    const id = Number((await db('swings').where({ recording_id: recordingId }).first('id')).id);
    const current = await swingViewText(coach, id);
    const row = await db('swing_payloads').where({ swing_id: id }).first('body', 'format');
    expect(row.format).toBe(SWING_PART_FORMAT);
    // form 1: the series and sensor frames only
    const { series, sensorFrames } = JSON.parse(String(row.body));
    await db('swing_payloads').where({ swing_id: id }).update({ body: JSON.stringify({ series, sensorFrames }), format: 1 });
    expect(await swingViewText(coach, id)).toBe(current);
    expect((await db('swing_payloads').where({ swing_id: id }).first('format')).format).toBe(SWING_PART_FORMAT);
  });

  it('a student gets a 404 for another athlete’s swing, stored payload or not', async () => {
    const csv = generateSession({ seed: 6, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 1, withMarker: true }).csv();
    const { recordingId } = await insertRecording(db, store, csv); // athlete 1 (tests/lib/support/recordings.ts)
    expect(await drainQueue({ db, store, workerId: 'payload', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
    const id = Number((await db('swings').where({ recording_id: recordingId }).first('id')).id);
    const athlete = await db('athletes').where({ id: 1 }).first('user_id');
    const user = await db('users').where({ id: athlete.user_id }).first('id', 'academy_id', 'name', 'email');
    const student: Viewer = { id: Number(user.id), role: 'student', academyId: Number(user.academy_id), name: user.name, email: user.email };
    expect(JSON.parse(await swingViewText(student, id)).swing.id).toBe(id); // their own swing
    // the same recording, stored payload and all, moved to another athlete's session
    const otherSession = await db('practice_sessions').whereNot({ athlete_id: 1 }).orderBy('id').first('id', 'athlete_id');
    await db('recordings').where({ id: recordingId }).update({ athlete_id: otherSession.athlete_id, session_id: otherSession.id });
    expect(await db('swing_payloads').where({ swing_id: id }).first('swing_id')).toBeTruthy();
    await expect(swingViewText(student, id)).rejects.toMatchObject({ status: 404 });
  });
});
