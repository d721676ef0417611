import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { resultRows, serverDb, serverStore, settled, upload } from './support/recordings-http';

// Upload -> keep -> process through the running app (scripts/test.ts: next start + throwaway MariaDB + S3 fake).
// Expected swings come from `npm run analyze` on the same file with the same parameters (the product's own CLI,
// itself checked against scipy and the synthetic generator's truth in tests/signal).
// Demo ids (db/demo/scenario.ts): athlete 1 Ada Fenwick (student@'s own, coach@'s roster, sessions 1-3),
// athlete 3 Sunniva Ashdale (coach@, session 6), athlete 4 (coach2@).

const env = e2eEnv();
let coach: HttpSession;
let coach2: HttpSession;
let student: HttpSession;
let researcher: HttpSession;
let db: Knex;

const golf = generateSession({ seed: 11, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 3, withMarker: false });
const golfCsv = golf.csv();
const walking = readFileSync('tests/fixtures/gaitpdb/GaCo01_01.txt');
const walkingProfile = readFileSync('tests/fixtures/profiles/gaitpdb.json', 'utf8');
const walkingLayout = readFileSync('tests/fixtures/layouts/gaitpdb.json', 'utf8');

beforeAll(async () => {
  db = serverDb();
  await seedDemo(db);
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
  coach2 = await signedIn(env.E2E_BASE_URL, DEMO.coach2, DEMO_PASSWORD);
  student = await signedIn(env.E2E_BASE_URL, DEMO.student, DEMO_PASSWORD);
  researcher = await signedIn(env.E2E_BASE_URL, DEMO.researcher, DEMO_PASSWORD);
});
afterAll(async () => {
  await seedDemo(db); // the next test files expect the plain demo scenario
  await db.destroy();
});

async function analyzeCli(content: string, args: string[]): Promise<any> {
  const dir = mkdtempSync(join(tmpdir(), 'stanceline-analyze-'));
  const file = join(dir, 'golf.csv');
  writeFileSync(file, content);
  const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', file, ...args], { maxBuffer: 64 << 20 });
  return JSON.parse(stdout);
}

describe('POST /api/recordings and GET /api/recordings/:id', () => {
  let golfId = 0;

  it('a generated golf file ends ready with exactly the swings and events `npm run analyze` prints', async () => {
    const res = await upload(coach, { athleteId: 3, sessionId: 6, handedness: 'right', stanceWidthMm: 400 }, [{ name: 'lesson-golf.csv', content: golfCsv }]);
    expect(res.status).toBe(202);
    expect(res.body.recordings).toHaveLength(1);
    expect(res.body.recordings[0]).toMatchObject({ filename: 'lesson-golf.csv', status: 'received', duplicate: false });
    golfId = res.body.recordings[0].id;

    const done = await settled(coach, golfId);
    const cli = await analyzeCli(golfCsv, ['--handedness', 'right', '--stance-width-mm', '400']);
    expect(cli.swings).toHaveLength(3); // the generator's three swings
    expect(done.status).toBe('ready');
    expect(done.error).toBeNull();
    expect(done.swings.map((s: any) => ({ index: s.index, events: s.events, impactSource: s.impactSource }))).toEqual(
      cli.swings.map((s: any) => ({ index: s.index, events: s.events, impactSource: s.impact_source })),
    );
    const { algorithm_version: version, ...params } = cli.processing;
    expect(done.algorithmVersion).toBe(version);
    expect({ ...done.parameters, sample_rate_hz: params.sample_rate_hz }).toEqual(params);
  });

  it('the same file again in the same session is reported, not duplicated', async () => {
    const res = await upload(coach, { athleteId: 3, sessionId: 6 }, [{ name: 'again.csv', content: golfCsv }]);
    expect(res.status).toBe(202);
    expect(res.body.recordings[0]).toMatchObject({ id: golfId, duplicate: true, status: 'ready' });
    expect(await db('recordings').where({ session_id: 6 }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('without a sessionId a new practice session is created, listed with its recordings', async () => {
    const res = await upload(coach, { athleteId: 3 }, [{ name: 'new-session.csv', content: golfCsv }]);
    expect(res.status).toBe(202);
    const { id, sessionId } = res.body.recordings[0];
    expect(sessionId).not.toBe(6);
    await settled(coach, id);
    const session = await db('practice_sessions').where({ id: sessionId }).first();
    expect(session).toMatchObject({ athlete_id: 3, coach_user_id: 2, context: 'practice' });
    const list = await coach.json(`/api/sessions/${sessionId}/recordings`);
    expect(list.status).toBe(200);
    const body = list.body as any;
    expect(body.recordings.map((r: any) => [r.id, r.status, r.swingCount])).toEqual([[id, 'ready', 3]]);
    expect(body.swings).toHaveLength(3);
    expect(body.swings[0]).toHaveProperty('leadPctAtImpact');
  });

  it('the shared walking file with its profile ends ready with 0 swings', async () => {
    const res = await upload(coach, { athleteId: 3, sessionId: 6, profile: walkingProfile, layout: walkingLayout }, [{ name: 'GaCo01_01.txt', content: walking }]);
    expect(res.status).toBe(202);
    const done = await settled(coach, res.body.recordings[0].id);
    expect(done).toMatchObject({ status: 'ready', error: null, swings: [] });
    expect(done.parameters.sample_rate_hz).toBeCloseTo(100, 0); // gaitpdb README: nominal 100 Hz
  });

  it('reprocess with a new cutoff replaces the results and records the parameters', async () => {
    const res = await coach.json(`/api/recordings/${golfId}/reprocess`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ cutoffHz: 8 }),
    });
    expect(res.status).toBe(202);
    let done: any;
    for (let i = 0; i < 300; i++) {
      done = await settled(coach, golfId);
      if (done.parameters.cutoff_hz === 8) break;
      await new Promise((r) => setTimeout(r, 200));
    }
    const cli = await analyzeCli(golfCsv, ['--handedness', 'right', '--stance-width-mm', '400', '--cutoff-hz', '8']);
    expect(done.parameters.cutoff_hz).toBe(8);
    expect(done.swings.map((s: any) => s.events)).toEqual(cli.swings.map((s: any) => s.events));
    expect(await db('swings').where({ recording_id: golfId }).count({ n: '*' })).toEqual([{ n: cli.swings.length }]);
  });

  it('a bad reprocess request is a 422 naming the field', async () => {
    const res = await coach.json(`/api/recordings/${golfId}/reprocess`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ cutoffHz: 500 }),
    });
    expect(res.status).toBe(422);
    expect((res.body as any).error.fieldErrors.cutoffHz[0]).toMatch(/at most 50 Hz/);
  });

  it('coach of the athlete and the athlete themself may read; another coach gets 404 (lib/auth/access.ts), other roles 403, nobody signed in 401', async () => {
    const mine = await upload(coach, { athleteId: 1, sessionId: 1 }, [{ name: 'ada.csv', content: golfCsv }]);
    const id = mine.body.recordings[0].id;
    await settled(coach, id);
    expect((await student.json(`/api/recordings/${id}`)).status).toBe(200);
    expect((await student.json('/api/sessions/1/recordings')).status).toBe(200);
    expect((await coach2.json(`/api/recordings/${id}`)).status).toBe(404);
    expect((await coach2.json('/api/sessions/1/recordings')).status).toBe(404);
    expect((await researcher.json(`/api/recordings/${id}`)).status).toBe(403);
    const reprocess = { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' };
    expect((await student.json(`/api/recordings/${id}/reprocess`, reprocess)).status).toBe(403);
    expect((await coach2.json(`/api/recordings/${id}/reprocess`, reprocess)).status).toBe(404);
    const anonymous = new HttpSession(env.E2E_BASE_URL);
    expect((await anonymous.json(`/api/recordings/${id}`)).status).toBe(401);
    expect((await anonymous.json('/api/sessions/1/recordings')).status).toBe(401);
    expect((await coach.json('/api/recordings/999999')).status).toBe(404);
  });
});

describe('bad input: a 4xx JSON error, or a failed recording saying what and where', () => {
  const header = golfCsv.slice(0, golfCsv.indexOf('\n', golfCsv.indexOf('time_s')) + 1);
  const lines = golfCsv.split('\n');
  const headerLine = lines.findIndex((l) => l.startsWith('time_s')) + 1; // 1-based
  const rows = (from: number, to: number) => lines.slice(headerLine + from - 1, headerLine + to); // data rows from..to

  const failing: { name: string; content: string | Uint8Array; fields?: Record<string, string>; message: RegExp; line: number | null; column: number | null }[] = [
    { name: 'empty.csv', content: '', message: /the file is empty/, line: 1, column: 1 },
    {
      name: 'photo.csv', // a PNG signature and header chunk
      content: new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52, 0, 0, 1, 0]),
      message: /not text/,
      line: 1,
      column: 1,
    },
    {
      name: 'truncated.csv',
      content: header + rows(1, 40).join('\n') + '\n' + rows(41, 42)[0].slice(0, 12),
      message: /expected 17 fields, found 3/,
      line: headerLine + 41,
      column: 4,
    },
    {
      name: 'non-numeric.csv',
      content: header + rows(1, 40).map((r, i) => (i === 19 ? r.replace(/^([^,]*,[^,]*),[^,]*/, '$1,12.3x') : r)).join('\n') + '\n',
      message: /"12.3x" is not a number/,
      line: headerLine + 20,
      column: 3,
    },
    {
      name: 'time-backwards.csv',
      content: header + rows(1, 40).map((r, i) => (i === 30 ? r.replace(/^[^,]*/, '0.100') : r)).join('\n') + '\n',
      message: /time 0.100 is not after the previous row's/,
      line: headerLine + 31,
      column: 1,
    },
    {
      name: 'unknown-column.csv',
      content: header.replace('time_s,L1,', 'time_s,L1,Q7,') + rows(1, 20).map((r) => r.replace(/^([^,]*,[^,]*),/, '$1,0,')).join('\n') + '\n',
      message: /unknown column "Q7"/,
      line: headerLine,
      column: 3,
    },
    {
      name: 'layout-mismatch.csv', // a pair-8 file processed with the 16-sensor preset
      content: golfCsv,
      fields: { layout: 'pair-16' },
      message: /layout "pair-16" has sensors the file lacks/,
      line: headerLine,
      column: null,
    },
    {
      name: 'GaCo01_01.txt', // the walking file with a profile naming a column it does not have
      content: walking,
      fields: { profile: walkingProfile.replace('"R8": 17', '"R8": 27'), layout: walkingLayout },
      message: /expected 27 fields, found 19/, // the profile's column 27 in a 19-column file (gaitpdb README)
      line: 1,
      column: 20,
    },
  ];

  for (const bad of failing) {
    it(`${bad.name}: failed with line ${bad.line}, raw file kept, no result rows`, async () => {
      const res = await upload(coach, { athleteId: 3, sessionId: 7, ...bad.fields }, [{ name: bad.name, content: bad.content }]);
      expect(res.status).toBe(202);
      const id = res.body.recordings[0].id;
      const done = await settled(coach, id);
      expect(done.status).toBe('failed');
      expect(done.error.message).toMatch(bad.message);
      expect(done.error.line).toBe(bad.line);
      if (bad.column !== null) expect(done.error.column).toBe(bad.column);
      expect(done.swings).toEqual([]);
      expect(await resultRows(db, id)).toBe(0);
      const row = await db('recordings').where({ id }).first('storage_key', 'byte_size');
      expect(Number(row.byte_size)).toBe(typeof bad.content === 'string' ? Buffer.byteLength(bad.content) : bad.content.length);
      expect(await serverStore()!.exists(row.storage_key)).toBe(true);
    });
  }

  it('missing athleteId: 422 on that field, nothing stored', async () => {
    const before = await db('recordings').count({ n: '*' });
    const res = await upload(coach, {}, [{ name: 'x.csv', content: golfCsv }]);
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors.athleteId[0]).toMatch(/athleteId is required/);
    expect(await db('recordings').count({ n: '*' })).toEqual(before);
  });

  it('a layout preset that does not exist: 422 on the layout field', async () => {
    const res = await upload(coach, { athleteId: 3, layout: 'pair-99' }, [{ name: 'x.csv', content: golfCsv }]);
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors.layout[0]).toMatch(/"pair-99" is not a layout preset/);
  });

  it('no file part: 400', async () => {
    const res = await upload(coach, { athleteId: 3 }, []);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('no_file');
  });

  it('too many files: 400 naming the limit', async () => {
    const files = Array.from({ length: 21 }, (_, i) => ({ name: `f${i}.csv`, content: `x${i}` }));
    const res = await upload(coach, { athleteId: 3 }, files);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'too_many_files' });
    expect(res.body.error.message).toMatch(/At most 20 files/);
  });

  it('someone else’s athlete: 404, as if it did not exist; a student or researcher: 403; nobody signed in: 401', async () => {
    const file = [{ name: 'x.csv', content: golfCsv }];
    expect((await upload(coach2, { athleteId: 3 }, file)).status).toBe(404);
    expect((await upload(coach, { athleteId: 4 }, file)).status).toBe(404);
    expect((await upload(student, { athleteId: 1 }, file)).status).toBe(403);
    expect((await upload(researcher, { athleteId: 1 }, file)).status).toBe(403);
    expect((await upload(new HttpSession(env.E2E_BASE_URL), { athleteId: 3 }, file)).status).toBe(401);
  });

  it('a session of another athlete: 422 on sessionId', async () => {
    const res = await upload(coach, { athleteId: 3, sessionId: 1 }, [{ name: 'x.csv', content: golfCsv }]);
    expect(res.status).toBe(422);
    expect(res.body.error.fieldErrors.sessionId[0]).toMatch(/not one of this athlete/);
  });

  it('a 2 GB upload with its Content-Length is cut off at the 200 MB file limit with a 413', async () => {
    const boundary = 'stanceline-big';
    const head = Buffer.from(
      `--${boundary}\r\ncontent-disposition: form-data; name="athleteId"\r\n\r\n3\r\n--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="huge-declared.csv"\r\n\r\n`,
    );
    const total = 2 * 1024 ** 3;
    const chunk = Buffer.alloc(1 << 20, 0x32);
    let written = head.length;
    const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      let answered = false;
      const req = httpRequest(`${env.E2E_BASE_URL}/api/recordings`, {
        method: 'POST',
        headers: { cookie: coach.cookieHeader(), 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(total) },
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
      req.write(head);
      const pump = () => {
        while (!answered && written + chunk.length <= total) {
          written += chunk.length;
          if (!req.write(chunk)) return void req.once('drain', pump);
        }
      };
      pump();
    });
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body).error).toMatchObject({ code: 'payload_too_large' });
    expect(JSON.parse(answer.body).error.message).toMatch(/"huge-declared.csv" is larger than the limit of 200 MB/);
    expect(written).toBeLessThan(total / 2); // answered near the 200 MB mark, not after 2 GB
  });

  it('an upload declaring more than every file could hold at its limit: 413 at once', async () => {
    const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      const req = httpRequest(`${env.E2E_BASE_URL}/api/recordings`, {
        method: 'POST',
        headers: { cookie: coach.cookieHeader(), 'content-type': 'multipart/form-data; boundary=x', 'content-length': String(50 * 1024 ** 3) },
      });
      req.on('response', (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (text += c));
        res.on('end', () => {
          req.destroy();
          resolve({ status: res.statusCode ?? 0, body: text });
        });
      });
      req.on('error', reject);
      req.write('--x\r\n');
    });
    expect(answer.status).toBe(413);
    expect(JSON.parse(answer.body).error.message).toMatch(/at most 20 files of 200 MB each/);
  });

  it('a 2 GB streamed upload is cut off at the 200 MB limit with a 413, and the server stays up', async () => {
    const boundary = 'stanceline-stream';
    const head = `--${boundary}\r\ncontent-disposition: form-data; name="athleteId"\r\n\r\n3\r\n--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="huge.csv"\r\ncontent-type: text/csv\r\n\r\n`;
    const chunk = new Uint8Array(1 << 20).fill(0x31); // 1 MiB of "1"
    let sent = 0;
    const total = 2 * 1024; // MiB
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode(head));
      },
      pull(controller) {
        if (sent >= total) {
          controller.enqueue(new TextEncoder().encode(`\r\n--${boundary}--\r\n`));
          controller.close();
          return;
        }
        sent++;
        controller.enqueue(chunk);
      },
    });
    const outcome = await coach
      .fetch('/api/recordings', {
        method: 'POST',
        headers: { 'content-type': `multipart/form-data; boundary=${boundary}` },
        body,
        duplex: 'half',
      } as RequestInit)
      .then(async (r) => ({ status: r.status, body: await r.json() }))
      .catch((error: Error) => ({ status: 0, body: String(error) }));
    expect(sent).toBeLessThan(total); // the server stopped reading long before 2 GB
    expect(outcome.status).toBe(413);
    expect(outcome.body.error.message).toMatch(/larger than the limit of 200 MB/);
    expect((await coach.json('/api/me')).status).toBe(200);
    expect(await db('recordings').where({ filename: 'huge.csv' }).count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
