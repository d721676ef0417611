import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import type { Viewer } from '@/lib/auth/viewer';
import { listAthletesForViewer, listAthletesPage } from '@/lib/db/athletes';
import { closeDb, db } from '@/lib/db/client';
import { drainQueue } from '@/lib/jobs/worker';
import { pageQuerySchema } from '@/lib/contracts/pagination';
import { pageOf } from '@/lib/pagination';
import { getRecordingView, getSessionRecordingsView } from '@/lib/recordings/views';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { resetToDemo } from './db-fixture';
import { insertRecording, tempDir } from './support/recordings';

// Paginated lists on the real integration MariaDB: walking the pages one by one gives exactly the whole list, in
// the same order, with no duplicates and nothing left out. Demo ids (db/demo/scenario.ts): coach@ is user 2.

const coach: Viewer = { id: 2, role: 'coach', academyId: 1, name: 'x', email: 'x@stanceline.test' };
const store = createLocalStore(tempDir('pagination-store'));

beforeEach(async () => {
  await resetToDemo();
});
afterAll(async () => {
  await resetToDemo();
  await closeDb();
});

async function walk<T>(limit: number, fetch: (offset: number) => Promise<{ items: T[]; nextOffset: number | null; total: number }>): Promise<{ items: T[]; pages: number; total: number }> {
  const items: T[] = [];
  let offset: number | null = 0;
  let pages = 0;
  let total = 0;
  while (offset !== null) {
    const page = await fetch(offset);
    expect(page.items.length).toBeLessThanOrEqual(limit);
    items.push(...page.items);
    total = page.total;
    offset = page.nextOffset;
    pages++;
  }
  return { items, pages, total };
}

describe('pagination', () => {
  it('page arithmetic: the next offset, none after the last page; limits checked', () => {
    expect(pageOf({ limit: 2, offset: 0 }, 5)).toEqual({ offset: 0, limit: 2, total: 5, nextOffset: 2 });
    expect(pageOf({ limit: 2, offset: 4 }, 5)).toEqual({ offset: 4, limit: 2, total: 5, nextOffset: null });
    expect(pageOf({ limit: 5, offset: 0 }, 5).nextOffset).toBeNull();
    expect(pageQuerySchema(100).parse({})).toEqual({ limit: null, offset: 0 }); // no limit: the whole list
    expect(pageOf({ limit: null, offset: 0 }, 5)).toEqual({ offset: 0, limit: null, total: 5, nextOffset: null });
    expect(pageQuerySchema(100).safeParse({ limit: '101' }).success).toBe(false);
    expect(pageQuerySchema(100).safeParse({ limit: '0' }).success).toBe(false);
    expect(pageQuerySchema(100).safeParse({ offset: '-1' }).success).toBe(false);
    expect(pageQuerySchema(100).safeParse({ limit: '2.5' }).success).toBe(false);
  });

  it('the roster, two at a time, is the whole roster in name order', async () => {
    const all = await listAthletesForViewer(coach);
    const paged = await walk(2, async (offset) => {
      const r = await listAthletesPage(coach, {}, { limit: 2, offset });
      return { items: r.athletes, nextOffset: r.page.nextOffset, total: r.page.total };
    });
    expect(paged.items).toEqual(all);
    expect(all.length).toBeGreaterThan(2);
    expect(paged.total).toBe(all.length);
    expect(paged.pages).toBe(Math.ceil(all.length / 2));
    const filtered = await listAthletesPage(coach, { handedness: 'left' }, { limit: 10, offset: 0 });
    expect(filtered.page.total).toBe(filtered.athletes.length);
    expect(filtered.athletes.every((a) => a.handedness === 'left')).toBe(true);
  });

  it('the swings of a long recording and the recordings of a session, page by page', async () => {
    const opts = { sampleRateHz: 100, sensorsPerFoot: 8 as const, units: 'N' as const, handedness: 'right' as const, stanceWidthMm: 400, withMarker: false };
    const first = await insertRecording(db, store, generateSession({ ...opts, seed: 21, swings: 7 }).csv(), {}, 'a.csv');
    await insertRecording(db, store, generateSession({ ...opts, seed: 22, swings: 2 }).csv(), {}, 'b.csv');
    await insertRecording(db, store, generateSession({ ...opts, seed: 23, swings: 3 }).csv(), {}, 'c.csv');
    expect(await drainQueue({ db, store, workerId: 'pages', pollMs: 50, lockTimeoutS: 30 })).toBe(3);

    const whole = (await getRecordingView(first.recordingId))!;
    expect(whole.swings).toHaveLength(7);
    expect(whole.swingsPage).toEqual({ offset: 0, limit: null, total: 7, nextOffset: null });
    const swings = await walk(3, async (offset) => {
      const r = (await getRecordingView(first.recordingId, { limit: 3, offset }))!;
      return { items: r.swings, nextOffset: r.swingsPage!.nextOffset, total: r.swingsPage!.total };
    });
    expect(swings.items).toEqual(whole.swings);
    expect(swings.pages).toBe(3);

    const session = await db('recordings').where({ id: first.recordingId }).first('session_id');
    const all = (await getSessionRecordingsView(Number(session.session_id)))!;
    const pages = await walk(1, async (offset) => {
      const r = (await getSessionRecordingsView(Number(session.session_id), { limit: 1, offset }))!;
      expect(r.swings.every((s) => s.recordingId === r.recordings[0].id)).toBe(true);
      return { items: r.recordings.map((rec) => ({ rec, swings: r.swings })), nextOffset: r.page.nextOffset, total: r.page.total };
    });
    expect(pages.items.map((p) => p.rec)).toEqual(all.recordings);
    // swing numbers run over the whole session on every page (pages come in upload order, numbers in time order)
    const byNumber = <T extends { number: number }>(list: T[]) => [...list].sort((a, b) => a.number - b.number);
    expect(byNumber(pages.items.flatMap((p) => p.swings))).toEqual(byNumber(all.swings));
    expect(pages.total).toBe(all.recordings.length);
  });
});
