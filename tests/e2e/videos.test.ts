import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { settled, upload } from '../http/support/recordings-http';
import { axeViolations, describeViolations } from './support/axe';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// The coach in chromium: a swing whose recording has a video synced by its impact sounds (a clip made here with
// Debian's ffmpeg, clicks at the recording's impacts + a constructed offset). "Top" moves the trace cursor and the
// video together: the video's time must be the top event's time + the stored offset (within one frame).
// Screenshots at 1280x800 and 1024x768.

const dir = mkdtempSync(join(tmpdir(), 'stanceline-video-e2e-'));
let browser: Browser;
let page: Page;
let baseUrl: string;
let coachApi: HttpSession;
let swingId = 0;
let sessionId = 0;
let topS = 0;

function clip(durationS: number, clicks: number[]): Uint8Array {
  const path = join(dir, 'lesson.mp4');
  const bursts = clicks.map((t) => `between(t,${t},${t + 0.03})*0.6*sin(2*PI*3000*(t-${t}))*exp(-abs(t-${t})*150)`);
  const res = spawnSync('/usr/bin/ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', `testsrc=size=320x240:rate=30:duration=${durationS}`, '-f', 'lavfi', '-i', `aevalsrc=exprs='${bursts.join('+')}+0.02*(random(0)*2-1)':s=48000:d=${durationS}`, '-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p', '-c:a', 'aac', '-shortest', path], { encoding: 'utf8' });
  if (res.status !== 0) throw new Error(res.stderr);
  return readFileSync(path);
}

async function shots(name: string) {
  for (const s of [
    { width: 1280, height: 800 },
    { width: 1024, height: 768 },
  ]) {
    await page.setViewportSize(s);
    await page.getByTestId('swing-videos').scrollIntoViewIfNeeded();
    await page.screenshot({ path: screenshotPath(`e2e-${name}-${s.width}x${s.height}`) });
  }
  await page.setViewportSize({ width: 1280, height: 800 });
}

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  coachApi = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  const res = await coachApi.json('/api/athletes', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ displayName: `Filmed Player ${Date.now().toString(36)}`, handedness: 'right', stanceWidthMm: 380, dateOfBirth: null, homeClub: null }),
  });
  const athleteId = (res.body as { athlete: { id: number } }).athlete.id;
  const csv = generateSession({ seed: 4242, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 3, withMarker: true }).csv();
  const up = await upload(coachApi, { athleteId, handedness: 'right', stanceWidthMm: 380 }, [{ name: 'lesson.csv', content: csv }]);
  const done = await settled(coachApi, up.body.recordings[0].id, 120_000);
  sessionId = done.sessionId;
  const swings = (done.swings as { id: number; events: { top: number; impact: number } }[]).sort((a, b) => a.events.impact - b.events.impact);
  const impacts = swings.map((s) => s.events.impact);
  const offset = 1.5 - impacts[0];
  const form = new FormData();
  form.append('file', new Blob([clip(Math.ceil(impacts.at(-1)! + offset + 1.5), impacts.map((t) => t + offset)) as BlobPart], { type: 'video/mp4' }), 'lesson.mp4');
  const posted = await coachApi.fetch(`/api/recordings/${up.body.recordings[0].id}/videos`, { method: 'POST', body: form });
  const videoId = ((await posted.json()) as { videos: { id: number }[] }).videos[0].id;
  const until = Date.now() + 120_000;
  for (;;) {
    const v = (await coachApi.json(`/api/videos/${videoId}`)).body as { status: string; syncSource: string | null };
    if (v.status === 'ready') {
      expect(v.syncSource).toBe('audio');
      break;
    }
    if (v.status === 'failed' || Date.now() > until) throw new Error(`video ${v.status}`);
    await new Promise((r) => setTimeout(r, 300));
  }
  swingId = swings[1].id;
  topS = swings[1].events.top;
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
}, 240_000);

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('e2e-videos', task.name, [['coach', page]]);
});

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  await browser?.close();
  if (sessionId) await coachApi.json(`/api/sessions/${sessionId}`, { method: 'DELETE' });
});

describe('video beside the traces', () => {
  it('“Top” puts the video at the top event’s time plus the offset', async () => {
    await signInAt(page, baseUrl, DEMO.coach, DEMO_PASSWORD, `/swings/${swingId}`);
    const video = page.getByTestId('swing-video').first();
    await video.waitFor({ timeout: 30_000 });
    await expect.poll(() => video.evaluate((v: HTMLVideoElement) => v.readyState), { timeout: 30_000 }).toBeGreaterThanOrEqual(1);
    const offset = Number(await video.getAttribute('data-offset-s'));
    await page.getByTestId('video-jump-top').click();
    await expect.poll(() => video.evaluate((v: HTMLVideoElement) => v.seeking)).toBe(false);
    const t = await video.evaluate((v: HTMLVideoElement) => v.currentTime);
    expect(Math.abs(t - (topS + offset))).toBeLessThan(1 / 30);
    await page.getByTestId('video-lead-bar').waitFor();
    // the viewer with a video: axe-core, WCAG 2 A/AA, zero violations (as tests/e2e/accessibility.test.ts)
    const violations = await axeViolations(page);
    expect(violations, describeViolations(violations)).toEqual([]);
    await shots('videos-top');
  });

  it('frame keys step the video and the cursor by one frame', async () => {
    const video = page.getByTestId('swing-video').first();
    const before = await video.evaluate((v: HTMLVideoElement) => v.currentTime);
    await video.focus();
    await page.keyboard.press('.');
    await expect.poll(() => video.evaluate((v: HTMLVideoElement) => v.currentTime)).toBeCloseTo(before + 1 / 30, 3);
  });
});
