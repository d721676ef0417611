import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// The coach's session in chromium: create an on-course session with its date and place on the upload page, upload
// into it, label a swing and see its club in the session's table; delete the session and restore it; and the swing
// page on a tablet in landscape (1024x768) shows the traces without scrolling. Screenshots at 1280x800 and 1024x768.
// The athlete is made for this file on coach@'s roster, so the demo athletes stay as seeded.

const dir = mkdtempSync(join(tmpdir(), 'stanceline-sessions-e2e-'));
const golfPath = join(dir, 'hole-4.csv');
// Invented golf session from the project's generator.
writeFileSync(golfPath, generateSession({ seed: 77, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 390, swings: 3, withMarker: false }).csv());

let browser: Browser;
let page: Page;
let baseUrl: string;
let coachApi: HttpSession;
let athleteId: number;
let sessionId: number;
let swingUrl: string;
const SIZES = [
  { name: 'laptop', width: 1280, height: 800 },
  { name: 'tablet', width: 1024, height: 768 },
] as const;

async function shots(name: string) {
  for (const s of SIZES) {
    await page.setViewportSize({ width: s.width, height: s.height });
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
    body: JSON.stringify({ displayName: `Course Player ${Date.now().toString(36)}`, handedness: 'right', stanceWidthMm: 390, dateOfBirth: null, homeClub: null }),
  });
  expect(res.status).toBe(201);
  athleteId = (res.body as { athlete: { id: number } }).athlete.id;
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('e2e-sessions', task.name, [['coach', page]]);
});

afterAll(async () => {
  await browser?.close();
});

describe('a coach’s sessions in the browser', () => {
  it('creates an on-course session with date and place on the upload page and uploads into it', async () => {
    await signInAt(page, baseUrl, DEMO.coach, DEMO_PASSWORD, `/upload?athlete=${athleteId}`);
    await page.getByTestId('new-session').click();
    await page.getByLabel('Date').fill('2026-04-18');
    await page.getByLabel('Kind of session').selectOption('on-course');
    await page.getByLabel('Place').fill('Hollowmere, hole 4');
    await page.getByRole('button', { name: 'Create session' }).click();
    await page.waitForURL(/\/upload\?athlete=\d+&session=\d+/);
    sessionId = Number(new URL(page.url()).searchParams.get('session'));
    const chosen = page.getByLabel('Add the files to');
    await expect.poll(() => chosen.inputValue()).toBe(String(sessionId));
    expect(await chosen.locator('option:checked').textContent()).toContain('On course · Hollowmere, hole 4');
    await shots('upload-new-session');

    await page.getByTestId('file-input').setInputFiles(golfPath);
    await page.getByRole('button', { name: 'Upload 1 file' }).click();
    await page.locator('[data-testid="upload-item"][data-filename="hole-4.csv"] [data-testid="recording-status"][data-status="ready"]').waitFor({ timeout: 90_000 });
    await page.getByTestId('open-session').click();
    await page.waitForURL(`${baseUrl}/sessions/${sessionId}`);
    await page.getByRole('heading', { name: /On course/ }).waitFor();
    expect(await page.locator('main').textContent()).toContain('Hollowmere, hole 4');
  });

  it('labels a swing and sees its club in the session’s table, filterable', async () => {
    await page.getByTestId('swing-table').waitFor();
    await page.getByRole('link', { name: 'Swing 2', exact: true }).click();
    await page.waitForURL(/\/swings\/\d+$/);
    swingUrl = page.url();
    await page.locator('[data-testid="swing-workbench"][data-can-edit] [data-swing-viewer]').waitFor({ timeout: 30_000 });
    await page.getByTestId('labels-form').getByLabel('Club').selectOption('iron-7');
    await page.getByRole('button', { name: 'Save labels' }).click();
    await page.getByTestId('labels-saved').waitFor();
    await page.goto(`${baseUrl}/sessions/${sessionId}`);
    const rows = page.locator('[data-testid="swing-table"] tbody tr[data-testid="swing-row"]');
    await rows.first().waitFor();
    const row2 = rows.filter({ has: page.getByRole('link', { name: 'Swing 2', exact: true }) });
    expect(await row2.locator('td:nth-child(3)').textContent()).toBe('7-iron');
    await page.getByLabel('Club', { exact: true }).fill('7-iron');
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="swing-row"]').length === 1);
    expect(await rows.locator('td:nth-child(1)').textContent()).toContain('Swing 2');
    await page.getByLabel('Club', { exact: true }).fill('');
    await shots('session-page');
  });

  it('deletes the session to the bin and restores it with undo', async () => {
    await page.getByRole('button', { name: 'Delete session…' }).click();
    await page.getByRole('alertdialog').getByText('It goes to the bin').waitFor();
    await page.getByRole('button', { name: 'Move to bin' }).click();
    await page.waitForURL(`${baseUrl}/athletes/${athleteId}?binned=${sessionId}`);
    await page.getByTestId('undo-delete').waitFor();
    expect(await page.getByTestId('session-list').count()).toBe(0); // no session in use any more
    await shots('athlete-bin');
    expect((await coachApi.json(`/api/sessions/${sessionId}/recordings`)).status).toBe(404);
    await page.getByTestId('undo-delete').click();
    await page.getByRole('link', { name: 'Open it' }).click();
    await page.waitForURL(`${baseUrl}/sessions/${sessionId}`);
    await page.locator('[data-testid="swing-table"] tbody tr[data-testid="swing-row"]').first().waitFor();
  });

  it('on a tablet in landscape, the swing page shows the traces and the key numbers without scrolling', async () => {
    await page.setViewportSize({ width: 1024, height: 768 });
    await page.goto(swingUrl);
    const viewer = page.locator('[data-swing-viewer]');
    await viewer.waitFor({ timeout: 30_000 });
    const chart = page.locator('[data-chart="swing-lead-share"]');
    const box = (await chart.boundingBox())!;
    const facts = (await page.getByTestId('swing-tempo').boundingBox())!;
    expect(await page.evaluate(() => window.scrollY)).toBe(0);
    expect(facts.y + facts.height).toBeLessThanOrEqual(768);
    expect(box.y + box.height).toBeLessThanOrEqual(768); // the first trace whole on the first screen
    // the caution is one compact line that opens to the full text
    const caution = page.getByTestId('coaching-caution');
    expect((await caution.boundingBox())!.height).toBeLessThanOrEqual(48);
    // touch targets: the zoom buttons and the marker handles at least 44 px
    for (const b of await page.getByRole('group', { name: 'Zoom' }).getByRole('button').all()) expect((await b.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    // a marker with room around it gets the full 44 px (address is far from its neighbour); close markers share the
    // gap between them at the midpoint, and each handle still covers its own line
    expect((await chart.locator('[data-drag-event="address"]').boundingBox())!.width).toBeGreaterThanOrEqual(44);
    const topHandle = (await chart.locator('[data-drag-event="top"]').boundingBox())!;
    const topLine = (await chart.locator('[data-event-marker="top"] line').boundingBox())!;
    expect(topHandle.x).toBeLessThanOrEqual(topLine.x);
    expect(topHandle.x + topHandle.width).toBeGreaterThanOrEqual(topLine.x + topLine.width);
    await page.screenshot({ path: screenshotPath('e2e-swing-1024x768') });
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.screenshot({ path: screenshotPath('e2e-swing-1280x800') });
  });
});
