import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { videoBinnedSchema, videoListSchema, videoSchema, videoUploadedSchema } from '@/lib/contracts/videos';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { type HttpSession, signedIn } from './support/http-session';
import { serverDb, serverStore, settled, upload } from './support/recordings-http';

// Videos over HTTP on the running app: a clip made here with Debian's ffmpeg whose clicks sit at the recording's
// impacts + a constructed offset (truth = construction), upload -> worker -> sync, the stream's Range answers
// (RFC 9110 §14), manual sync, a corrupt file, and access like the recording's.

const env = e2eEnv();
let coach: HttpSession;
let student: HttpSession;
let recordingId = 0;
let sessionId = 0;
let impacts: { swingId: number; t: number }[] = [];
const OFFSET = -7.4; // video time = recording time + OFFSET (construction)
const dir = mkdtempSync(join(tmpdir(), 'stanceline-video-http-'));

function clip(name: string, durationS: number, clicks: number[] | null): Uint8Array {
  const path = join(dir, name);
  const args = ['-v', 'error', '-y', '-f', 'lavfi', '-i', `testsrc=size=320x240:rate=60:duration=${durationS}`];
  if (clicks) {
    const bursts = clicks.map((t) => `between(t,${t},${t + 0.03})*0.6*sin(2*PI*3000*(t-${t}))*exp(-abs(t-${t})*150)`);
    args.push('-f', 'lavfi', '-i', `aevalsrc=exprs='${bursts.join('+')}+0.02*(random(0)*2-1)':s=48000:d=${durationS}`, '-c:a', 'aac', '-shortest');
  }
  args.push('-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p', path);
  const res = spawnSync('/usr/bin/ffmpeg', args, { encoding: 'utf8' });
  if (res.status !== 0) throw new Error(res.stderr);
  return readFileSync(path);
}

async function postVideo(session: HttpSession, rid: number, name: string, bytes: Uint8Array) {
  const form = new FormData();
  form.append('file', new Blob([bytes as BlobPart], { type: 'video/mp4' }), name);
  const res = await session.fetch(`/api/recordings/${rid}/videos`, { method: 'POST', body: form });
  return { status: res.status, body: (await res.json()) as any };
}

async function videoSettled(id: number, timeoutMs = 120_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const { status, body } = await coach.json(`/api/videos/${id}`);
    expect(status).toBe(200);
    const v = videoSchema.parse(body);
    expect(v).toEqual(body); // every field declared in the contract
    if (v.status === 'ready' || v.status === 'failed') return v;
    if (Date.now() > until) throw new Error(`video ${id} still ${v.status}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

beforeAll(async () => {
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
  student = await signedIn(env.E2E_BASE_URL, DEMO.student, DEMO_PASSWORD);
  const athlete = await coach.json('/api/athletes', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ displayName: `Video Player ${Date.now().toString(36)}`, handedness: 'right', stanceWidthMm: 380, dateOfBirth: null, homeClub: null }),
  });
  const athleteId = (athlete.body as { athlete: { id: number } }).athlete.id;
  const content = generateSession({ seed: 7319, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 4, withMarker: true }).csv();
  const res = await upload(coach, { athleteId, handedness: 'right', stanceWidthMm: 380 }, [{ name: 'range.csv', content }]);
  expect(res.status).toBe(202);
  const done = await settled(coach, res.body.recordings[0].id, 120_000);
  expect(done.status).toBe('ready');
  recordingId = res.body.recordings[0].id;
  sessionId = done.sessionId;
  impacts = (done.swings as { id: number; events: { impact: number } }[]).map((s) => ({ swingId: s.id, t: s.events.impact })).sort((a, b) => a.t - b.t);
  expect(impacts.length).toBeGreaterThanOrEqual(3);
}, 180_000);

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  if (sessionId) await coach.json(`/api/sessions/${sessionId}`, { method: 'DELETE' });
});

describe('videos of a recording', () => {
  let videoId = 0;
  let fps = 60;

  it('upload answers 202, the worker syncs by the sound of impact within one frame', async () => {
    const first3 = impacts.slice(0, 3).map((i) => i.t);
    const offset = OFFSET + (2 - (first3[0] + OFFSET)); // the first click 2 s into the clip
    const clicks = [0.8, ...first3.map((t) => t + offset)]; // 0.8 s: a tap that is not an impact
    const bytes = clip('lesson.mp4', Math.ceil(clicks.at(-1)! + 1.5), clicks);
    const res = await postVideo(coach, recordingId, 'lesson.mp4', bytes);
    expect(res.status).toBe(202);
    expect(videoUploadedSchema.parse(res.body)).toEqual(res.body);
    videoId = res.body.videos[0].id;
    const v = await videoSettled(videoId);
    expect(v.status).toBe('ready');
    expect(v.syncSource).toBe('audio');
    fps = v.fps!;
    expect(fps).toBeCloseTo(60, 3);
    expect(Math.abs(v.offsetS! - offset)).toBeLessThan(1 / fps);
    expect(v.posterUrl).toBe(`/api/videos/${videoId}/poster`);
    const list = await coach.json(`/api/recordings/${recordingId}/videos`);
    expect(videoListSchema.parse(list.body)).toEqual(list.body);
  });

  it('streams with Range 206, the right bytes, ETag and Content-Type', async () => {
    const whole = await coach.fetch(`/api/videos/${videoId}/stream`);
    expect(whole.status).toBe(200);
    expect(whole.headers.get('content-type')).toBe('video/mp4');
    const etag = whole.headers.get('etag');
    expect(etag).toMatch(/^".+"$/);
    const all = new Uint8Array(await whole.arrayBuffer());
    const part = await coach.fetch(`/api/videos/${videoId}/stream`, { headers: { range: 'bytes=100-1099' } });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe(`bytes 100-1099/${all.length}`);
    expect(Buffer.from(await part.arrayBuffer()).equals(Buffer.from(all.subarray(100, 1100)))).toBe(true);
    const tail = await coach.fetch(`/api/videos/${videoId}/stream`, { headers: { range: 'bytes=-500' } });
    expect(tail.status).toBe(206);
    expect(Buffer.from(await tail.arrayBuffer()).equals(Buffer.from(all.subarray(all.length - 500)))).toBe(true);
    const beyond = await coach.fetch(`/api/videos/${videoId}/stream`, { headers: { range: `bytes=${all.length}-` } });
    expect(beyond.status).toBe(416);
    await beyond.arrayBuffer();
    const again = await coach.fetch(`/api/videos/${videoId}/stream`, { headers: { 'if-none-match': etag! } });
    expect(again.status).toBe(304);
  });

  it('a student cannot see or stream another athlete’s video (404, like the recording)', async () => {
    expect((await student.json(`/api/videos/${videoId}`)).status).toBe(404);
    const s = await student.fetch(`/api/videos/${videoId}/stream`, { headers: { range: 'bytes=0-99' } });
    expect(s.status).toBe(404);
    await s.arrayBuffer();
    expect((await student.json(`/api/recordings/${recordingId}/videos`)).status).toBe(404);
  });

  it('"this is impact" and frame nudges store a manual offset', async () => {
    const imp = impacts[1];
    const set = await coach.json(`/api/videos/${videoId}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ impact: { swingId: imp.swingId, videoTimeS: imp.t - 5 } }) });
    expect(set.status).toBe(200);
    expect((set.body as any).syncSource).toBe('manual');
    expect((set.body as any).offsetS).toBeCloseTo(-5, 9);
    const nudged = await coach.json(`/api/videos/${videoId}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ nudgeFrames: 3 }) });
    expect((nudged.body as any).offsetS).toBeCloseTo(-5 + 3 / fps, 9);
    const bad = await coach.json(`/api/videos/${videoId}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ nudgeFrames: 0 }) });
    expect(bad.status).toBe(422);
  });

  it('a clip without sound: syncSource null', async () => {
    const res = await postVideo(coach, recordingId, 'quiet.mp4', clip('quiet.mp4', 2, null));
    expect(res.status).toBe(202);
    const v = await videoSettled(res.body.videos[0].id);
    expect(v.status).toBe('ready');
    expect(v.syncSource).toBeNull();
    expect(v.offsetS).toBeNull();
  });

  it('a corrupt file fails with its reason and the original is kept', async () => {
    const whole = clip('whole.mp4', 2, [0.5]);
    const res = await postVideo(coach, recordingId, 'broken.mov', whole.subarray(0, Math.floor(whole.length / 3)));
    expect(res.status).toBe(202);
    const id = res.body.videos[0].id;
    const v = await videoSettled(id);
    expect(v.status).toBe('failed');
    const list = videoListSchema.parse((await coach.json(`/api/recordings/${recordingId}/videos`)).body);
    expect(list.videos.find((x) => x.id === id)!.error).toMatch(/could not be read as a video|corrupt/);
    const db = serverDb();
    try {
      const row = await db('videos').where({ id }).first('original_key');
      const store = serverStore();
      if (store) expect(await store.exists(String(row.original_key))).toBe(true);
    } finally {
      await db.destroy();
    }
  });

  it('a file that is not a video type is refused at upload with the field named', async () => {
    const res = await postVideo(coach, recordingId, 'notes.txt', new TextEncoder().encode('notes'));
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toMatch(/mp4, mov or webm/);
  });

  it('a video can be deleted into the bin and restored', async () => {
    const del = await coach.json(`/api/videos/${videoId}`, { method: 'DELETE' });
    expect(del.status).toBe(200);
    expect(videoBinnedSchema.parse(del.body)).toEqual(del.body);
    expect((await coach.json(`/api/videos/${videoId}`)).status).toBe(404);
    const list = videoListSchema.parse((await coach.json(`/api/recordings/${recordingId}/videos`)).body);
    expect(list.videos.some((v) => v.id === videoId)).toBe(false);
    expect((await student.json(`/api/videos/${videoId}/restore`, { method: 'POST' })).status).toBeGreaterThanOrEqual(403);
    expect((await coach.json(`/api/videos/${videoId}/restore`, { method: 'POST' })).status).toBe(200);
    expect((await coach.json(`/api/videos/${videoId}`)).status).toBe(200);
  });

  it('binning the recording takes its videos with it', async () => {
    expect((await coach.json(`/api/recordings/${recordingId}`, { method: 'DELETE' })).status).toBe(200);
    expect((await coach.json(`/api/videos/${videoId}`)).status).toBe(404);
    const s = await coach.fetch(`/api/videos/${videoId}/stream`);
    expect(s.status).toBe(404);
    await s.arrayBuffer();
    expect((await coach.json(`/api/recordings/${recordingId}/restore`, { method: 'POST' })).status).toBe(200);
    expect((await coach.json(`/api/videos/${videoId}`)).status).toBe(200);
  });
});
