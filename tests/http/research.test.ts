import knex from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knexConfig } from '@/knexfile';
import { consentResponseSchema, cohortSummarySchema, exportAuditSchema, tokenCreatedSchema, tokenListSchema, tokenRevokedSchema } from '@/lib/contracts/research';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { sampleRecording, type Sample } from './support/recordings-http';

// Research over HTTP on the running app: the role matrix of every research route (each role, a personal token, a
// revoked token and no session), tokens valid on the export routes only, a consent set and revoked through the API,
// and the export's bytes searched for the personal text of the database. Demo ids (db/demo/scenario.ts): athlete 1 =
// Ada Fenwick on coach@'s roster and student@'s own player; athlete 4 on coach2@'s roster.

type Actor = 'none' | 'admin' | 'coach' | 'coach2' | 'student' | 'researcher' | 'token' | 'revoked';
const actors: Actor[] = ['none', 'admin', 'coach', 'coach2', 'student', 'researcher', 'token', 'revoked'];
type Case = { method: 'GET' | 'POST' | 'PUT' | 'DELETE'; path: string | (() => string); body?: () => unknown; expected: Record<Actor, number> };

const env = e2eEnv();
const sessions = new Map<Actor, HttpSession>();
let token = '';
let revokedToken = '';
let sample: Sample;
const throwaway: number[] = [];
const db = knex(knexConfig(process.env.DATABASE_URL));

const researcherOnly = { none: 401, admin: 403, coach: 403, coach2: 403, student: 403, researcher: 200, token: 401, revoked: 401 };
const exporters = { none: 401, admin: 403, coach: 200, coach2: 200, student: 403, researcher: 200, token: 200, revoked: 401 };

const cases: Case[] = [
  { method: 'GET', path: '/api/athletes/1/consent', expected: { none: 401, admin: 200, coach: 200, coach2: 404, student: 200, researcher: 403, token: 401, revoked: 401 } },
  { method: 'PUT', path: '/api/athletes/1/consent', body: () => ({ research: true }), expected: { none: 401, admin: 200, coach: 200, coach2: 404, student: 200, researcher: 403, token: 401, revoked: 401 } },
  { method: 'PUT', path: '/api/athletes/4/consent', body: () => ({ research: false }), expected: { none: 401, admin: 200, coach: 404, coach2: 200, student: 404, researcher: 403, token: 401, revoked: 401 } },
  { method: 'PUT', path: '/api/athletes/999999/consent', body: () => ({ research: true }), expected: { none: 401, admin: 404, coach: 404, coach2: 404, student: 404, researcher: 403, token: 401, revoked: 401 } },
  { method: 'GET', path: '/api/tokens', expected: researcherOnly },
  { method: 'POST', path: '/api/tokens', body: () => ({ name: 'matrix' }), expected: { ...researcherOnly, researcher: 201 } },
  { method: 'DELETE', path: () => `/api/tokens/${throwaway.shift()}`, expected: researcherOnly },
  { method: 'GET', path: '/api/exports/phase-table?format=csv&shape=long', expected: exporters },
  { method: 'GET', path: '/api/exports/phase-table?format=json&shape=wide&context=lesson', expected: exporters },
  { method: 'GET', path: '/api/exports/phase-table/codebook?format=csv&shape=wide', expected: exporters },
  { method: 'GET', path: '/api/exports/cohort?partial=exclude', expected: exporters },
  { method: 'GET', path: '/api/exports/audit', expected: { ...exporters, admin: 200 } },
  // a bearer token anywhere else is no session at all
  { method: 'GET', path: '/api/me', expected: { none: 401, admin: 200, coach: 200, coach2: 200, student: 200, researcher: 200, token: 401, revoked: 401 } },
  { method: 'GET', path: '/api/athletes', expected: { none: 401, admin: 403, coach: 200, coach2: 200, student: 200, researcher: 403, token: 401, revoked: 401 } },
];

async function newToken(name: string): Promise<{ id: number; token: string }> {
  const res = await sessions.get('researcher')!.json('/api/tokens', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name }) });
  expect(res.status).toBe(201);
  return tokenCreatedSchema.parse(res.body);
}

beforeAll(async () => {
  sessions.set('none', new HttpSession(env.E2E_BASE_URL));
  for (const actor of ['admin', 'coach', 'coach2', 'student', 'researcher'] as const) sessions.set(actor, await signedIn(env.E2E_BASE_URL, DEMO[actor], DEMO_PASSWORD));
  token = (await newToken('matrix token')).token;
  const revoked = await newToken('revoked token');
  revokedToken = revoked.token;
  expect((await sessions.get('researcher')!.json(`/api/tokens/${revoked.id}`, { method: 'DELETE' })).status).toBe(200);
  // one throwaway token per actor for the DELETE row (only the researcher's own revocation succeeds)
  for (let k = 0; k < actors.length; k++) throwaway.push((await newToken(`throwaway ${k}`)).id);
  sample = await sampleRecording(sessions.get('coach')!);
});
afterAll(async () => {
  await db.destroy();
});

async function call(actor: Actor, method: string, path: string, body?: unknown): Promise<Response> {
  const headers: Record<string, string> = {};
  if (body !== undefined) headers['content-type'] = 'application/json';
  const init: RequestInit = { method, headers, ...(body !== undefined ? { body: JSON.stringify(body) } : {}) };
  if (actor === 'token' || actor === 'revoked') {
    headers.authorization = `Bearer ${actor === 'token' ? token : revokedToken}`;
    return fetch(`${env.E2E_BASE_URL}${path}`, { ...init, redirect: 'manual' });
  }
  return sessions.get(actor)!.fetch(path, init);
}

describe('research routes: role matrix', () => {
  for (const c of cases) {
    for (const actor of actors) {
      const expected = c.expected[actor];
      const label = typeof c.path === 'string' ? c.path : c.path.toString().includes('tokens') ? '/api/tokens/:id' : '?';
      it(`${c.method} ${label} as ${actor} -> ${expected}`, async () => {
        const path = typeof c.path === 'string' ? c.path : c.path();
        const res = await call(actor, c.method, path, c.body?.());
        const text = await res.text();
        expect(res.status, text.slice(0, 300)).toBe(expected);
        if (expected >= 400) expect(JSON.parse(text).error.code).toBeTypeOf('string');
      });
    }
  }
});

describe('research over HTTP', () => {
  it('answers match the contracts (every field declared)', async () => {
    const researcher = sessions.get('researcher')!;
    const check = async (path: string, schema: { safeParse(v: unknown): { success: boolean; data?: unknown } }, s: HttpSession = researcher, init?: RequestInit) => {
      const res = await s.json(path, init);
      const parsed = schema.safeParse(res.body);
      expect(parsed.success, path).toBe(true);
      expect(parsed.data).toEqual(res.body);
    };
    await check('/api/exports/cohort', cohortSummarySchema);
    await check('/api/exports/audit', exportAuditSchema);
    await check('/api/tokens', tokenListSchema);
    await check('/api/athletes/1/consent', consentResponseSchema, sessions.get('coach')!);
    const created = await newToken('contract');
    await check(`/api/tokens/${created.id}`, tokenRevokedSchema, researcher, { method: 'DELETE' });
  });

  it('a consented player appears under a code, without personal text; after revocation the next export drops them', async () => {
    const coach = sessions.get('coach')!;
    const put = await coach.json(`/api/athletes/${sample.athleteId}/consent`, { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ research: true, guardianConsent: true }) });
    expect(put.status).toBe(200);
    const exportCsv = async () => {
      const res = await call('token', 'GET', '/api/exports/phase-table?format=csv&shape=wide');
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toContain('text/csv');
      expect(res.headers.get('content-disposition')).toContain('attachment');
      return Buffer.from(await res.arrayBuffer());
    };
    const swingIds = (await db('swings').where({ recording_id: sample.recordingId, hidden: false, stale: false }).select('id')).map((s) => Number(s.id));
    const bytes = await exportCsv();
    const lines = bytes.toString('utf8').trim().split('\r\n');
    const header = lines[0].split(',');
    const idCol = header.indexOf('swing_id');
    const exported = lines.slice(1).map((l) => Number(l.split(',')[idCol]));
    for (const id of swingIds) expect(exported).toContain(id);

    const athlete = await db('athletes').where({ id: sample.athleteId }).first('display_name');
    const needles: string[] = [athlete.display_name];
    for (const u of await db('users').select('name', 'email')) needles.push(u.name, u.email);
    for (const a of await db('athletes').select('display_name', 'home_club')) needles.push(a.display_name, ...(a.home_club ? [a.home_club] : []));
    for (const p of await db('practice_sessions').select('location', 'notes')) needles.push(...[p.location, p.notes].filter((v): v is string => !!v));
    for (const r of await db('recordings').select('filename')) needles.push(r.filename);
    for (const n of needles) expect(bytes.includes(Buffer.from(n)), `export holds "${n}"`).toBe(false);

    const revoke = await coach.json(`/api/athletes/${sample.athleteId}/consent`, { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ research: false }) });
    expect(revoke.status).toBe(200);
    const after = (await exportCsv()).toString('utf8');
    for (const id of swingIds) expect(after.split('\r\n').slice(1).map((l) => Number(l.split(',')[idCol]))).not.toContain(id);

    const audit = exportAuditSchema.parse((await sessions.get('researcher')!.json('/api/exports/audit')).body);
    expect(audit.entries[0]).toMatchObject({ token: 'matrix token', status: 'completed', shape: 'wide', format: 'csv' });
  });

  it('bad filters are 422 naming the parameter; a malformed Authorization header is 401', async () => {
    const res = await sessions.get('researcher')!.json('/api/exports/phase-table?format=xml&clubGroup=putter&colour=red');
    expect(res.status).toBe(422);
    const body = res.body as { error: { fieldErrors: Record<string, string[]> } };
    expect(body.error.fieldErrors.clubGroup).toBeDefined();
    expect(JSON.stringify(body.error.fieldErrors._form)).toContain('colour');
    const bad = await fetch(`${env.E2E_BASE_URL}/api/exports/phase-table`, { headers: { authorization: 'Token abc' } });
    expect(bad.status).toBe(401);
  });
});
