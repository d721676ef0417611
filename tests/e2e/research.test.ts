import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import Papa from 'papaparse';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn } from '../http/support/http-session';
import { sampleRecording, type Sample } from '../http/support/recordings-http';
import { artifactsDir, launchBrowser, screenshotPath, signInAt, type Browser } from './support/browser';

// The researcher in the browser: filters a cohort (the count of players and swings follows), sees the note for a
// cohort under five players, previews the first swings, downloads the long table and finds the download in the
// export log. The cohort is a processed invented lesson of a player the coach records consent for through the API.

let browser: Browser;
let page: Page;
let baseUrl: string;
let sample: Sample;

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  const coach = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  sample = await sampleRecording(coach);
  const put = await coach.json(`/api/athletes/${sample.athleteId}/consent`, { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ research: true, guardianConsent: true }) });
  expect(put.status).toBe(200);
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail' && page) await page.screenshot({ path: screenshotPath(`e2e-failed-research-${task.name.replace(/\W+/g, '-').slice(0, 50)}`), fullPage: true });
});

afterAll(async () => {
  await browser?.close();
});

const count = async () => (await page.getByTestId('cohort-count').textContent()) ?? '';
const swingsIn = (text: string) => Number(/(\d+) swings?/.exec(text)?.[1] ?? NaN);

describe('the researcher’s page', () => {
  it('filters a cohort and shows how many players and swings it selects', async () => {
    await signInAt(page, baseUrl, DEMO.researcher, DEMO_PASSWORD, '/');
    await page.getByTestId('cohort-count').filter({ hasText: /swing/ }).waitFor();
    const all = swingsIn(await count());
    expect(all).toBeGreaterThanOrEqual(3); // the sample lesson's swings at least
    await page.getByLabel('Club group').selectOption('driver'); // nobody labelled a driver swing
    await page.getByTestId('cohort-count').filter({ hasText: /0 players, 0 swings/ }).waitFor();
    await page.getByTestId('small-cohort-note').waitFor();
    await page.getByLabel('Club group').selectOption('irons'); // unlabelled swings count as irons
    await page.waitForFunction(() => /[1-9]\d* swings?/.test(document.querySelector('[data-testid="cohort-count"]')?.textContent ?? ''));
    expect(swingsIn(await count())).toBeGreaterThanOrEqual(3);
    await page.screenshot({ path: screenshotPath('e2e-research-cohort-1280x800'), fullPage: false });
  });

  it('previews the first swings under codes, never names', async () => {
    const table = page.getByTestId('preview-table');
    await table.locator('tbody tr').first().waitFor();
    const text = (await table.textContent()) ?? '';
    expect(text).toMatch(/P[0-9a-f]{12}/);
    expect(text).not.toContain('Sample Player');
    expect(text).not.toContain('Ada Fenwick');
  });

  it('downloads the long table, which the export log then lists', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-long-csv').click()]);
    expect(download.suggestedFilename()).toBe('phase-table-long.csv');
    const file = join(artifactsDir, 'e2e-research-phase-table-long.csv');
    await download.saveAs(file);
    const parsed = Papa.parse<Record<string, string>>(readFileSync(file, 'utf8').trim(), { header: true });
    expect(parsed.meta.fields?.slice(0, 10)).toEqual(['player_code', 'session_week', 'context', 'club', 'swing_id', 'event_or_phase', 'measure', 'value', 'unit', 'algorithm_version']);
    expect(parsed.data.length % 47).toBe(0);
    expect(new Set(parsed.data.map((r) => r.club_group))).toEqual(new Set(['irons'])); // the page's filter went with it
    // the log refreshes every 5 s; the newest row is this download, with the page's filter
    await page.getByTestId('export-log').locator('tbody tr').first().filter({ hasText: 'clubGroup=irons' }).waitFor({ timeout: 20_000 });
    expect(await page.getByTestId('export-log').locator('tbody tr').first().textContent()).toMatch(/signed in.*long CSV.*clubGroup=irons.*✓ complete/);
    await page.screenshot({ path: screenshotPath('e2e-research-downloads-1280x800'), fullPage: true });
    await page.setViewportSize({ width: 1024, height: 768 });
    await page.screenshot({ path: screenshotPath('e2e-research-1024x768'), fullPage: false });
  });
});
