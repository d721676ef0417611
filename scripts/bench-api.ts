// Benchmark of the API under load (npm run bench:api). Prints figures beside the targets; asserts nothing.
// One throwaway app (MariaDB, local fakes, `next start` on a free port, built first when sources changed), in one run:
// 1. autocannon (50 connections, 10 s each, after a 4 s warm-up of each URL) on a static file, GET /api/health (a route handler that does nothing: the
//    floor of any route), GET /api/me, GET /api/recordings/:id and GET /api/swings/:id (a generated 10-minute lesson
//    uploaded first), req/s and p50/p99, ratios to the static file;
// 2. GET /api/me while a generated 60-minute lesson (100 Hz, 8 sensors per foot) is processed, under the same load
//    (50 connections) and under a light one (5 connections), each beside the same load without an upload: its p99,
//    and upload -> ready for that file. At 50 connections the server is saturated and every request queues behind
//    the others (p50 ~ connections / req/s), so the light load is the one that shows a stall of the event loop.
import { execFile } from 'node:child_process';
import { createRequire } from 'node:module';
import { createWriteStream, mkdtempSync, openAsBlob, readdirSync, rmSync } from 'node:fs';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { decode, encode } from 'next-auth/jwt';
import { DISTRACTORS, generateSession } from '../lib/signal/synthetic';
import { signedIn, type HttpSession } from '../tests/http/support/http-session';
import { startThrowawayApp } from './lib/throwaway-app';

const TARGET = { swingsVsMe: 0.5, meVsStatic: 0.6, meP99DuringUploadMs: 150, readyS: 5 }; // from the issue
const CONNECTIONS = 50;
const LIGHT_CONNECTIONS = 5;
const SECONDS = 10;
const WARM_UP_SECONDS = 4;
const root = process.cwd();

type Load = { rps: number; p50: number; p99: number; total: number; non2xx: number; errors: number };

async function autocannon(url: string, headers: Record<string, string>, seconds = SECONDS, connections = CONNECTIONS): Promise<Load> {
  const args = [join(root, 'node_modules', 'autocannon', 'autocannon.js'), '-c', String(connections), '-d', String(seconds), '-j'];
  for (const [k, v] of Object.entries(headers)) args.push('-H', `${k}=${v}`);
  const { stdout } = await promisify(execFile)(process.execPath, [...args, url], { maxBuffer: 16 << 20 });
  const r = JSON.parse(stdout) as { requests: { average: number; total: number }; latency: { p50: number; p99: number }; non2xx: number; errors: number };
  return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, total: r.requests.total, non2xx: r.non2xx, errors: r.errors };
}

async function writeLesson(path: string, durationS: number, swings: number, seed: number): Promise<void> {
  const session = generateSession({ seed, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, withMarker: true, distractors: DISTRACTORS, durationS, swings });
  const out = createWriteStream(path);
  for (const piece of session.chunks()) if (!out.write(piece)) await once(out, 'drain');
  out.end();
  await once(out, 'finish');
}

async function uploadLesson(coach: HttpSession, file: string, name: string): Promise<number> {
  const form = new FormData();
  form.append('athleteId', '3');
  form.append('handedness', 'right');
  form.append('stanceWidthMm', '400');
  form.append('file', await openAsBlob(file), name);
  const response = await coach.fetch('/api/recordings', { method: 'POST', body: form });
  const body = (await response.json()) as { recordings: { id: number }[] };
  if (response.status !== 202) throw new Error(`upload answered ${response.status}: ${JSON.stringify(body)}`);
  return body.recordings[0].id;
}

async function waitReady(coach: HttpSession, id: number): Promise<{ status: string; swings: { id: number; stale: boolean }[] }> {
  for (;;) {
    const body = (await (await coach.fetch(`/api/recordings/${id}`)).json()) as { status: string; swings: { id: number; stale: boolean }[] };
    if (body.status === 'ready' || body.status === 'failed') return body;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

/**
 * Where a signed-in request's authentication goes, in this process: next-auth's session handler (what getServerSession
 * runs: decode, callbacks, and a re-encoded token the route throws away) against the JWT decode alone (what
 * getViewer now does before its user lookup).
 */
async function authParts(): Promise<void> {
  const require = createRequire(import.meta.url);
  const { AuthHandler } = require(join(root, 'node_modules', 'next-auth', 'core', 'index.js')) as {
    AuthHandler: (p: { options: object; req: object }) => Promise<unknown>;
  };
  const secret = 'bench-'.repeat(11);
  const token = await encode({ token: { uid: 2, sv: 0, role: 'coach', academyId: 1, name: 'Bench Coach', email: 'coach@stanceline.test' }, secret });
  const options = { secret, session: { strategy: 'jwt', maxAge: 28_800 }, providers: [], logger: { error() {}, warn() {}, debug() {} } };
  process.env.NEXTAUTH_URL ??= 'http://127.0.0.1:3000';
  const perCall = async (fn: () => Promise<unknown>, n = 1000) => {
    for (let i = 0; i < 100; i++) await fn();
    const t = performance.now();
    for (let i = 0; i < n; i++) await fn();
    return ((performance.now() - t) / n) * 1000;
  };
  const handler = await perCall(() => AuthHandler({ options, req: { action: 'session', method: 'GET', cookies: { 'next-auth.session-token': token }, headers: {} } }));
  const decodeOnly = await perCall(() => decode({ token, secret }));
  console.log(`\n## Authentication per request, in-process (1000 calls each)`);
  console.log(`next-auth session handler (getServerSession): ${handler.toFixed(0)} us per call`);
  console.log(`JWT decode only (getViewer now):             ${decodeOnly.toFixed(0)} us per call`);
  console.log('(the user row is still read on every request, so a deactivated user is refused on the next one)');
}

const row = (name: string, l: Load, base: Load) =>
  console.log(
    `${name.padEnd(28)} ${l.rps.toFixed(0).padStart(6)} req/s  p50 ${String(l.p50).padStart(5)} ms  p99 ${String(l.p99).padStart(5)} ms  ${(l.rps / base.rps).toFixed(2)} x static` +
      `   (${l.total} requests, ${l.non2xx} non-2xx, ${l.errors} errors)`,
  );

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'stanceline-bench-api-'));
  console.log(`# Stanceline API benchmark (node ${process.version}, ${new Date().toISOString()})`);
  console.log('# figures from a machine shared with other work: compare ratios within this run, not absolute numbers');
  await authParts();
  const app = await startThrowawayApp(root);
  try {
    const base = app.server.url;
    const coach = await signedIn(base, 'coach@stanceline.test', 'stanceline-demo');
    const cookie = coach.cookieHeader();
    const lesson10 = join(dir, 'lesson-10min.csv');
    await writeLesson(lesson10, 600, 20, 3);
    const recordingId = await uploadLesson(coach, lesson10, 'bench-api-10min.csv');
    const rec = await waitReady(coach, recordingId);
    const swingId = rec.swings.find((s) => !s.stale)?.id;
    if (rec.status !== 'ready' || swingId === undefined) throw new Error(`the 10-minute lesson gave no swing (status ${rec.status})`);
    const chunk = readdirSync(join(root, '.next', 'static', 'chunks')).find((f) => f.endsWith('.js'));
    if (!chunk) throw new Error('no static chunk in .next/static/chunks');
    const swing = await coach.fetch(`/api/swings/${swingId}`);
    const swingBytes = (await swing.arrayBuffer()).byteLength;

    console.log(`\n## ${CONNECTIONS} connections, ${SECONDS} s each after a ${WARM_UP_SECONDS} s warm-up of each, one server (${base})`);
    console.log(`GET /api/swings/${swingId}: ${(swingBytes / 1024).toFixed(1)} KB of JSON (${swing.headers.get('content-encoding') ?? 'identity'} on the wire)`);
    // warm-up, not reported: each URL for a few seconds first, so the figures are of JIT-compiled code paths (a cold
    // server answered the first route measured at about half its later rate)
    const urls: [string, Record<string, string>][] = [
      [`${base}/_next/static/chunks/${chunk}`, {}],
      [`${base}/api/health`, {}],
      [`${base}/api/me`, { cookie }],
      [`${base}/api/recordings/${recordingId}`, { cookie }],
      [`${base}/api/swings/${swingId}`, { cookie, 'accept-encoding': 'gzip' }],
    ];
    for (const [url, headers] of urls) await autocannon(url, headers, WARM_UP_SECONDS);
    const staticLoad = await autocannon(`${base}/_next/static/chunks/${chunk}`, {});
    const health = await autocannon(`${base}/api/health`, {});
    const me = await autocannon(`${base}/api/me`, { cookie });
    const recording = await autocannon(`${base}/api/recordings/${recordingId}`, { cookie });
    const swings = await autocannon(`${base}/api/swings/${swingId}`, { cookie, 'accept-encoding': 'gzip' });
    const swings304 = await autocannon(`${base}/api/swings/${swingId}`, { cookie, 'accept-encoding': 'gzip', 'if-none-match': swing.headers.get('etag') ?? '' });
    row('static file', staticLoad, staticLoad);
    row('GET /api/health (floor)', health, staticLoad);
    row('GET /api/me', me, staticLoad);
    row('GET /api/recordings/:id', recording, staticLoad);
    row('GET /api/swings/:id (gzip)', swings, staticLoad);
    row('GET /api/swings/:id (304)', swings304, staticLoad);
    const verdict = (ok: boolean) => (ok ? 'met' : 'NOT met');
    console.log(`/api/swings/:id vs /api/me:  ${(swings.rps / me.rps).toFixed(2)}   (target >= ${TARGET.swingsVsMe}: ${verdict(swings.rps / me.rps >= TARGET.swingsVsMe)})`);
    console.log(`/api/me vs static file:      ${(me.rps / staticLoad.rps).toFixed(2)}   (target >= ${TARGET.meVsStatic}: ${verdict(me.rps / staticLoad.rps >= TARGET.meVsStatic)})`);
    console.log(`/api/me vs the route floor:  ${(me.rps / health.rps).toFixed(2)}   (GET /api/health is ${(health.rps / staticLoad.rps).toFixed(2)} x static: what Next costs per route request before any of ours)`);

    console.log(`\n## GET /api/me while a 60-minute lesson (100 Hz, 8 sensors per foot) is processed`);
    const lesson60 = join(dir, 'lesson-60min.csv');
    await writeLesson(lesson60, 3600, 120, 1);
    for (const [k, connections] of [CONNECTIONS, LIGHT_CONNECTIONS].entries()) {
      const quiet = await autocannon(`${base}/api/me`, { cookie }, 6, connections);
      const t0 = performance.now();
      const id60 = await uploadLesson(coach, lesson60, `bench-api-60min-${k}.csv`);
      const uploadS = (performance.now() - t0) / 1000;
      const during = autocannon(`${base}/api/me`, { cookie }, 6, connections);
      const done = await waitReady(coach, id60);
      const readyS = (performance.now() - t0) / 1000;
      const load = await during;
      console.log(`${connections} connections:`);
      console.log(`  upload -> ${done.status}:        ${readyS.toFixed(2)} s   (target <= ${TARGET.readyS} s: ${verdict(readyS <= TARGET.readyS)}; the upload request itself ${uploadS.toFixed(2)} s; ${done.swings.length} swings)`);
      console.log(`  GET /api/me without upload: ${quiet.rps.toFixed(0)} req/s  p50 ${quiet.p50} ms  p99 ${quiet.p99} ms`);
      console.log(`  GET /api/me during it:      ${load.rps.toFixed(0)} req/s  p50 ${load.p50} ms  p99 ${load.p99} ms   (target p99 <= ${TARGET.meP99DuringUploadMs} ms: ${verdict(load.p99 <= TARGET.meP99DuringUploadMs)})`);
    }
  } finally {
    await app.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.stack : error);
  process.exitCode = 1;
});
