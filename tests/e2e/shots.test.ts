import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { settled, upload } from '../http/support/recordings-http';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// The coach in chromium: import a shot log on the session page (our plain layout), see the shots paired with the
// swings, unpair one, then open "Shots and pressure" for the player, pick a measure and open a swing from its point
// on the scatter. The player and the recording are made for this file; the shot log is constructed from the
// recording's own impacts with a known clock offset (invented values). Screenshots at 1280x800 and 1024x768.

const OFFSET_S = -64.5;
const RECORDED_AT = '2026-04-02T15:30:00Z';
const dir = mkdtempSync(join(tmpdir(), 'stanceline-shots-e2e-'));
const shotPath = join(dir, 'bay-3-shots.csv');

let browser: Browser;
let page: Page;
let baseUrl: string;
let coachApi: HttpSession;
let athleteId: number;
let sessionId: number;
let swingCount = 0;

async function shots(name: string) {
  for (const s of [
    { width: 1280, height: 800 },
    { width: 1024, height: 768 },
  ]) {
    await page.setViewportSize(s);
    await page.screenshot({ path: screenshotPath(`e2e-${name}-${s.width}x${s.height}`), fullPage: true });
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
    body: JSON.stringify({ displayName: `Range Player ${Date.now().toString(36)}`, handedness: 'right', stanceWidthMm: 390, dateOfBirth: null, homeClub: null }),
  });
  athleteId = (res.body as { athlete: { id: number } }).athlete.id;
  const csv = generateSession({ seed: 9090, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 390, swings: 12, withMarker: true, metadata: { recorded_at: RECORDED_AT } }).csv();
  const up = await upload(coachApi, { athleteId, handedness: 'right', stanceWidthMm: 390 }, [{ name: 'bay-3.csv', content: csv }]);
  const done = await settled(coachApi, up.body.recordings[0].id, 120_000);
  sessionId = done.sessionId;
  const view = await coachApi.json(`/api/sessions/${sessionId}/recordings`);
  const swings = (view.body as { swings: { stale: boolean; hidden: boolean; events: { impact: number } }[] }).swings.filter((s) => !s.stale && !s.hidden);
  swingCount = swings.length;
  const rows = swings.map((s, k) => {
    const t = Date.parse(RECORDED_AT) + (s.events.impact + OFFSET_S) * 1000;
    return `${new Date(t).toISOString().replace('Z', '')},iron-7,${(48 + 0.4 * k).toFixed(2)},${(138 + 1.5 * k + (k % 3)).toFixed(1)}`;
  });
  writeFileSync(shotPath, `shot_time,club,ball_speed_m_s,carry_m\n${rows.join('\n')}\n`);
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
}, 180_000);

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('e2e-shots', task.name, [['coach', page]]);
});

afterAll(async () => {
  await browser?.close();
});

describe('shots and pressure in the browser', () => {
  it('imports a shot log on the session page and sees every shot paired', async () => {
    await signInAt(page, baseUrl, DEMO.coach, DEMO_PASSWORD, `/sessions/${sessionId}`);
    await page.getByTestId('shot-import-form').waitFor();
    await page.getByLabel('Shot log (CSV or TSV)').setInputFiles(shotPath);
    await page.getByRole('button', { name: 'Import shots' }).click();
    await expect.poll(() => page.getByTestId('shot-status').textContent(), { timeout: 30_000 }).toContain(`Imported ${swingCount} shots: ${swingCount} matched`);
    await page.locator('[data-testid="shot-table"] tbody tr').nth(swingCount - 1).waitFor();
    expect(await page.getByLabel('Clock difference, seconds (launch monitor minus insoles)').inputValue()).toBe(OFFSET_S.toFixed(2));
    await page.getByTestId('shot-pairing').scrollIntoViewIfNeeded();
    await shots('shots-session-pairing');
  });

  it('unpairs a shot by hand and pairs it again', async () => {
    await page.getByLabel('Swing for shot 2').selectOption('');
    await expect.poll(() => page.getByTestId('shot-status').textContent()).toBe('Shot unpaired.');
    expect(await page.locator('[data-shot-index="2"]').textContent()).toContain('No swing');
    const options = await page.getByLabel('Swing for shot 2').locator('option').allTextContents();
    await page.getByLabel('Swing for shot 2').selectOption({ label: options[2] });
    await expect.poll(() => page.locator('[data-shot-index="2"]').textContent()).toContain('Set by you');
  });

  it('a file it cannot read shows line and column', async () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'shot_time,carry_m\n2026-04-02T15:31:00,140\n2026-04-02T15:31:40,far\n');
    await page.getByText('Import another shot log').click();
    await page.getByLabel('Shot log (CSV or TSV)').setInputFiles(bad);
    await page.getByRole('button', { name: 'Import shots' }).click();
    await page.getByTestId('shot-import-errors').waitFor();
    expect(await page.getByTestId('shot-import-errors').textContent()).toContain('line 3, column 2');
  });

  it('shows what goes with carry, with the cautions, and opens a swing from the scatter', async () => {
    await page.goto(`${baseUrl}/athletes/${athleteId}/outcomes`);
    await page.getByTestId('ranking-table').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('correlation-note').textContent()).toContain('not what caused what');
    expect(await page.getByTestId('coaching-caution').count()).toBe(1);
    await page.getByRole('button', { name: 'Lead foot % at impact' }).click();
    await expect.poll(() => page.getByTestId('scatter-summary').textContent()).toContain(`${swingCount} shots`);
    expect(await page.getByTestId('scatter-point').count()).toBe(swingCount);
    await page.getByTestId('fitted-line').waitFor();
    await shots('shots-outcomes-scatter');
    await page.getByTestId('scatter-point').first().click();
    await page.waitForURL(/\/swings\/\d+$/);
  });
});
