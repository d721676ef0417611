import { existsSync, readdirSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { signedIn, type HttpSession } from './support/http-session';
import { serverDb, serverStore, settled, upload } from './support/recordings-http';

// Upload defects an outside probe found (issue 11): a hanging request with a big text field, garbled non-ASCII file
// names, huge cells and lines that broke the failure reason, CR-only files and implausible values that passed.
// Demo ids (db/demo/scenario.ts): athlete 3 Sunniva Ashdale on coach@'s roster, session 6.

const env = e2eEnv();
let coach: HttpSession;
let db: Knex;

const golf = generateSession({ seed: 12, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 1, withMarker: false }).csv();
const golfLines = golf.split('\n');
/** 1-based line number of the first data row of the generated file (after its metadata and header). */
const firstDataLine = golfLines.findIndex((l) => l.startsWith('time_s')) + 2;

function spoolFiles(): string[] {
  const dir = join(process.env.STORAGE_DIR ?? '', '.incoming');
  return process.env.STORAGE_DIR && existsSync(dir) ? readdirSync(dir).filter((n) => n.endsWith('.part')) : [];
}

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
});
afterAll(async () => {
  await seedDemo(db);
  await db.destroy();
});

/** Uploads one file and waits for processing; returns the recording as GET /api/recordings/:id shows it. */
async function processed(name: string, content: string): Promise<any> {
  const res = await upload(coach, { athleteId: 3, sessionId: 6 }, [{ name, content }]);
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  return settled(coach, res.body.recordings[0].id, 120_000);
}

async function rawKept(id: number, content: string): Promise<void> {
  const row = await db('recordings').where({ id }).first('storage_key', 'byte_size');
  expect(Number(row.byte_size)).toBe(Buffer.byteLength(content));
  const store = serverStore();
  if (store) expect(await store.exists(row.storage_key)).toBe(true);
}

describe('a text field over 1 MB before the file part', () => {
  it('is answered 413 at once (was no answer for 60 s and a .part file left behind)', async () => {
    const boundary = 'stanceline-field';
    const head = Buffer.from(`--${boundary}\r\ncontent-disposition: form-data; name="athleteId"\r\n\r\n3\r\n--${boundary}\r\ncontent-disposition: form-data; name="layout"\r\n\r\n`);
    const field = Buffer.alloc(2 * 1024 * 1024, 0x61);
    const tail = Buffer.from(`\r\n--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="after-field.csv"\r\n\r\n${'0.01,1\n'.repeat(5_000_000)}\r\n--${boundary}--\r\n`);
    const started = Date.now();
    const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      let answered = false;
      const req = httpRequest(`${env.E2E_BASE_URL}/api/recordings`, {
        method: 'POST',
        headers: { cookie: coach.cookieHeader(), 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(head.length + field.length + tail.length) },
      });
      req.on('response', (res) => {
        answered = true;
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('end', () => {
          req.destroy();
          resolve({ status: res.statusCode ?? 0, body: text });
        });
      });
      req.on('error', (error) => (answered ? undefined : reject(error)));
      // a safety net for the old behaviour (no answer at all): fail instead of waiting for the test timeout
      req.setTimeout(30_000, () => reject(new Error(`no answer after ${Date.now() - started} ms`)));
      req.write(head);
      req.write(field);
      req.end(tail);
    });
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body).error.message).toMatch(/The field "layout" is longer than 1 MB/);
    // no spool file outlives the request (give the server a moment to finish its clean-up)
    for (let i = 0; i < 50 && spoolFiles().length > 0; i++) await new Promise((r) => setTimeout(r, 100));
    expect(spoolFiles()).toEqual([]);
    expect(await db('recordings').where({ filename: 'after-field.csv' }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});

describe('file names', () => {
  it('a non-ASCII file name is kept as sent (was stored as latin1 mojibake)', async () => {
    const res = await upload(coach, { athleteId: 3, sessionId: 6 }, [{ name: 'naïve-日本語.csv', content: golf }]);
    expect(res.status).toBe(202);
    expect(res.body.recordings[0].filename).toBe('naïve-日本語.csv');
    expect((await db('recordings').where({ id: res.body.recordings[0].id }).first('filename')).filename).toBe('naïve-日本語.csv');
  });
});

describe('bad files fail once, with a short reason naming line and column', () => {
  const cases: [string, () => string, RegExp, number, number][] = [
    // a 100,000-character cell (was: the whole cell in last_error, and "processing stopped 3 time(s)")
    ['huge-cell.csv', () => golfLines.map((l, i) => (i === firstDataLine + 100 ? l.replace(/,[^,]*/, `,${'9x'.repeat(50_000)}`) : l)).join('\n'), /longer than 65536 characters/, firstDataLine + 101, 65_537],
    // 30 MB without a newline at the end of the file (was: ROLLBACK - write ECONNRESET)
    ['endless-line.csv', () => `${golf}${'1,'.repeat(15 * 1024 * 1024)}`, /longer than 65536 characters/, golfLines.length, 65_537],
    // CR-only line ends (was: the misleading "no header row")
    ['cr-only.csv', () => golf.replace(/\n/g, '\r'), /carriage return \(CR\) only/, 1, golfLines[0].length + 1],
    // a -500 N force (was accepted)
    ['negative.csv', () => golfLines.map((l, i) => (i === firstDataLine + 4 ? l.replace(/^([^,]*),[^,]*,[^,]*,/, '$1,1,-500,') : l)).join('\n'), /"-500" is below -10/, firstDataLine + 5, 3],
    // sample_rate_hz 1e12 (was accepted)
    ['rate.csv', () => golf.replace(/# sample_rate_hz: [^\n]*/, '# sample_rate_hz: 1e12'), /at most 10000 Hz/, golfLines.findIndex((l) => l.startsWith('# sample_rate_hz')) + 1, 1],
  ];

  it.each(cases)('%s', async (name, make, reason, line, column) => {
    const content = make();
    const done = await processed(name, content);
    expect(done.status).toBe('failed');
    expect(done.error).toMatchObject({ line, column });
    expect(done.error.message).toMatch(reason);
    expect(done.error.message).toMatch(new RegExp(`^line ${line}, column ${column}: `));
    expect(done.error.message.length).toBeLessThan(300);
    const job = await db('processing_jobs').where({ recording_id: done.id }).first('state', 'attempts', 'last_error');
    expect(job).toMatchObject({ state: 'failed', attempts: 1 }); // failed at the first try, not after 3 "stopped" attempts
    expect(job.last_error.length).toBeLessThan(300);
    expect(await db('swings').where({ recording_id: done.id }).count({ n: '*' })).toEqual([{ n: 0 }]);
    await rawKept(done.id, content);
  });
});
