import { request as httpRequest } from 'node:http';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { generateSession } from '@/lib/signal/synthetic';
import { serverDb, settled, upload } from './support/recordings-http';

// Reproductions of the defects an outside probe of the running app found (issue 11), each now answered properly.
// Demo ids (db/demo/scenario.ts, drills.ts): athlete 1 Ada Fenwick = student@, on coach@'s roster; drill 1 coach@'s.

const env = e2eEnv();
let db: Knex;
let coach: HttpSession;
let admin: HttpSession;

const sendJson = (session: HttpSession, method: string, path: string, body: unknown) =>
  session.json(path, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

let swingCache: { id: number; start: number; end: number } | null = null;

/** A swing of a generated recording uploaded for demo athlete 3 (coach@'s roster, session 6) and processed. */
async function adaSwing(): Promise<{ id: number; start: number; end: number }> {
  if (swingCache) return swingCache;
  const csv = generateSession({ seed: 31, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 1, withMarker: false }).csv();
  const res = await upload(coach, { athleteId: 3, sessionId: 6, handedness: 'right', stanceWidthMm: 400 }, [{ name: 'hardening-swing.csv', content: csv }]);
  expect(res.status).toBe(202);
  const done = await settled(coach, res.body.recordings[0].id, 120_000);
  expect(done.status).toBe('ready');
  const row = await db('swings').where({ recording_id: done.id }).orderBy('id').first('id', 'start_s', 'end_s');
  swingCache = { id: Number(row.id), start: Number(row.start_s), end: Number(row.end_s) };
  return swingCache;
}

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
  admin = await signedIn(env.E2E_BASE_URL, DEMO.admin, DEMO_PASSWORD);
});

afterAll(async () => {
  await seedDemo(db);
  await db.destroy();
});

describe('dates and note times are checked, not stored or answered with a 500', () => {
  it('a due date that does not exist is a 422 on dueDate (was 500 ER_TRUNCATED_WRONG_VALUE)', async () => {
    for (const dueDate of ['2026-02-30', '2027-02-29', '2026-13-01', '0000-01-01']) {
      const res = await sendJson(coach, 'POST', '/api/athletes/1/drill-assignments', { drillId: 1, dueDate });
      expect(res.status, dueDate).toBe(422);
      expect(Object.keys((res.body as any).error.fieldErrors), dueDate).toEqual(['dueDate']);
    }
    const leap = await sendJson(coach, 'POST', '/api/athletes/1/drill-assignments', { drillId: 1, dueDate: '2096-02-29' });
    expect(leap.status).toBe(201); // a real leap day (ISO 8601 / Gregorian rule: 2096 is divisible by 4, not by 100)
  });

  it('a due date before the day of the assignment is refused, on create and on change', async () => {
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    const created = await sendJson(coach, 'POST', '/api/athletes/1/drill-assignments', { drillId: 1, dueDate: yesterday });
    expect(created.status).toBe(422);
    expect((created.body as any).error.fieldErrors.dueDate[0]).toMatch(/before the day it was assigned/);
    const ok = await sendJson(coach, 'POST', '/api/athletes/1/drill-assignments', { drillId: 1, dueDate: '2099-01-01' });
    expect(ok.status).toBe(201);
    const id = (ok.body as any).assignment.id;
    const moved = await sendJson(coach, 'PATCH', `/api/drill-assignments/${id}`, { dueDate: '2001-01-01' });
    expect(moved.status).toBe(422);
    expect((await db('drill_assignments').where({ id }).first('due_date'))?.due_date).toBe('2099-01-01');
  });

  it('a note pinned outside its swing (-1 s, 1e308 s) is a 422 on timeS and nothing is stored', async () => {
    const swing = await adaSwing();
    const before = await db('swing_annotations').where({ swing_id: swing.id }).count({ n: '*' });
    for (const timeS of [-1, 1e308, swing.end + 0.5]) {
      const res = await sendJson(coach, 'POST', `/api/swings/${swing.id}/annotations`, { body: 'Check this.', timeS, visibility: 'coach' });
      expect(res.status, String(timeS)).toBe(422);
      expect(Object.keys((res.body as any).error.fieldErrors)).toEqual(['timeS']);
    }
    expect(await db('swing_annotations').where({ swing_id: swing.id }).count({ n: '*' })).toEqual(before);
    const inside = await sendJson(coach, 'POST', `/api/swings/${swing.id}/annotations`, { body: 'Check this.', timeS: (swing.start + swing.end) / 2, visibility: 'coach' });
    expect(inside.status).toBe(201);
    const moved = await sendJson(coach, 'PATCH', `/api/swings/${swing.id}/annotations/${(inside.body as any).annotation.id}`, { timeS: -1 });
    expect(moved.status).toBe(422);
  });
});

describe('unknown fields are refused with 422 everywhere (were silently dropped)', () => {
  const athlete = { displayName: 'Strict Probe', handedness: 'right', stanceWidthMm: 400, dateOfBirth: null, homeClub: null };
  const profile = { header: true, time: { column: 'time_s', unit: 's' }, units: 'N', sensors: { L1: 'L1', R1: 'R1' } };

  it.each([
    ['coach', 'POST', '/api/athletes', { ...athlete, academyId: 2 }, 'academyId'],
    ['coach', 'PATCH', '/api/athletes/1', { displayName: 'Ada Fenwick', coachId: 5 }, 'coachId'],
    ['admin', 'POST', '/api/users', { email: 'strict-probe@stanceline.test', name: 'Strict Probe', role: 'coach', password: 'a-long-password-1', academyId: 2 }, 'academyId'],
    ['admin', 'PATCH', '/api/users/2', { active: true, isAdmin: true }, 'isAdmin'],
    ['coach', 'POST', '/api/import-profiles', { name: 'strict', profile, owner: 9 }, 'owner'],
    ['coach', 'POST', '/api/import-profiles', { name: 'strict', profile: { ...profile, scale: 2 } }, 'profile'],
  ] as const)('%s %s %s with an extra field', async (who, method, path, body, field) => {
    const res = await sendJson(who === 'admin' ? admin : coach, method, path, body);
    expect(res.status).toBe(422);
    const fieldErrors = (res.body as any).error.fieldErrors as Record<string, string[]>;
    expect(JSON.stringify(fieldErrors)).toContain(field);
  });

  it('nothing was created by the refused requests', async () => {
    expect(await db('athletes').where({ display_name: 'Strict Probe' }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await db('users').where({ email: 'strict-probe@stanceline.test' }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});

describe('concurrent label edits', () => {
  it('20 concurrent PATCH {labels} on a swing with no label row all succeed (were 4 x 500 ER_LOCK_DEADLOCK)', async () => {
    const swing = await adaSwing();
    await db('swing_labels').where({ swing_id: swing.id }).delete();
    const ratings = Array.from({ length: 20 }, (_, i) => (i % 5) + 1);
    const answers = await Promise.all(ratings.map((rating, i) => sendJson(coach, 'PATCH', `/api/swings/${swing.id}`, { labels: { rating, tags: [`t${i}`] } })));
    expect(answers.map((a) => a.status)).toEqual(ratings.map(() => 200));
    const rows = await db('swing_labels').where({ swing_id: swing.id });
    expect(rows).toHaveLength(1);
    // the stored row is one of the requests' values, whole (rating and tags from the same request)
    const i = (JSON.parse(rows[0].tags) as string[])[0].slice(1);
    expect(Number(rows[0].rating)).toBe(ratings[Number(i)]);
  });
});

/** Sends `total` bytes of JSON-ish text with a declared Content-Length, stopping as soon as an answer arrives. */
function postDeclared(path: string, cookie: string, total: number): Promise<{ status: number; body: string; written: number }> {
  const chunk = Buffer.alloc(1 << 20, 0x20); // spaces: still valid JSON around a value
  let written = 0;
  return new Promise((resolve, reject) => {
    let answered = false;
    const req = httpRequest(`${env.E2E_BASE_URL}${path}`, { method: 'PATCH', headers: { cookie, 'content-type': 'application/json', 'content-length': String(total) } });
    req.on('response', (res) => {
      answered = true;
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (text += c));
      res.on('end', () => {
        req.destroy();
        resolve({ status: res.statusCode ?? 0, body: text, written });
      });
    });
    req.on('error', (error) => (answered ? undefined : reject(error)));
    const pump = () => {
      while (!answered && written + chunk.length <= total) {
        written += chunk.length;
        if (!req.write(chunk)) return void req.once('drain', pump);
      }
    };
    pump();
  });
}

describe('JSON bodies are limited to 1 MB', () => {
  it('a declared 200 MB JSON body is answered 413 before it is read (was read whole: +390 MB of memory)', async () => {
    const total = 200 * 1024 * 1024;
    const answer = await postDeclared('/api/athletes/1', coach.cookieHeader(), total);
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body).error).toMatchObject({ code: 'payload_too_large', message: expect.stringMatching(/limited to 1 MB/) });
    expect(answer.written).toBeLessThan(total / 4);
  });

  it('a streamed body without Content-Length is refused once it passes 1 MB', async () => {
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode('{"displayName":"'));
      },
      pull(controller) {
        if (sent >= 200) {
          controller.enqueue(new TextEncoder().encode('"}'));
          controller.close();
          return;
        }
        sent++;
        controller.enqueue(new Uint8Array(1 << 20).fill(0x61));
      },
    });
    const outcome = await coach
      .fetch('/api/athletes/1', { method: 'PATCH', headers: { 'content-type': 'application/json' }, body, duplex: 'half' } as RequestInit)
      .then(async (r) => ({ status: r.status, body: await r.json() }))
      .catch((error: Error) => ({ status: 0, body: String(error) }));
    expect(outcome.status).toBe(413);
    expect(sent).toBeLessThan(200);
    expect((await db('athletes').where({ id: 1 }).first('display_name')).display_name).toBe('Ada Fenwick');
  });

  it('a body under the limit still works', async () => {
    const res = await sendJson(coach, 'PATCH', '/api/athletes/1', { homeClub: 'x'.repeat(100) });
    expect(res.status).toBe(200);
  });
});

describe('CSP: per-request nonces instead of script-src unsafe-inline', () => {
  it('each page answer has its own nonce, and every script tag carries it', async () => {
    const nonces: string[] = [];
    for (let i = 0; i < 2; i++) {
      const res = await coach.fetch('/roster');
      expect(res.status).toBe(200);
      const csp = res.headers.get('content-security-policy') ?? '';
      const nonce = /'nonce-([A-Za-z0-9+/=]+)'/.exec(csp)?.[1];
      expect(nonce, csp).toBeDefined();
      expect(/script-src[^;]*'unsafe-inline'/.test(csp)).toBe(false);
      const html = await res.text();
      const scripts = html.match(/<script\b[^>]*>/g) ?? [];
      expect(scripts.length).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
      nonces.push(nonce!);
    }
    expect(nonces[0]).not.toBe(nonces[1]);
  });

  it('the sign-in page has a nonce policy too; API answers allow nothing', async () => {
    const res = await fetch(`${env.E2E_BASE_URL}/sign-in`);
    expect(res.headers.get('content-security-policy')).toMatch(/'nonce-/);
    const api = await fetch(`${env.E2E_BASE_URL}/api/me`);
    expect(api.headers.get('content-security-policy')).toMatch(/default-src 'none'/);
  });
});
