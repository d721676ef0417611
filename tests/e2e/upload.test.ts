import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { DEMO_ATHLETES } from '@/db/demo/scenario';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { serverDb } from '../http/support/recordings-http';
import { launchBrowser, screenshotPath, type Browser } from './support/browser';

// The coach's upload page in chromium: drop a good and a bad file, watch the byte progress, the processing state,
// the swings found and the bad file's error with its line and column; then the session's swing table, a swing's
// phase table, and the shared walking file (read through its import profile and layout) with no golf swings.
// Expected numbers come from `npm run analyze` on the same bytes with the same parameters (the product's own CLI,
// itself checked against scipy and the generator's truth in tests/signal); the bad cell's line and column are where
// this test puts it.

const athlete = DEMO_ATHLETES.find((a) => a.id === 3)!; // Sunniva Ashdale, on coach@'s roster (db/demo/scenario.ts)
const dir = mkdtempSync(join(tmpdir(), 'stanceline-upload-e2e-'));

// Invented session from the project's generator, with the athlete's own handedness and stance width.
const golfCsv = generateSession({
  seed: 23,
  sampleRateHz: 100,
  sensorsPerFoot: 8,
  units: 'N',
  handedness: athlete.handedness,
  stanceWidthMm: athlete.stanceWidthMm,
  swings: 4,
  withMarker: false,
  distractors: ['walk', 'waggle'],
}).csv();
const golfPath = join(dir, 'bay-2-golf.csv');
writeFileSync(golfPath, golfCsv);

// The same file with one sensor cell garbled: 40th data row, 6th cell (L5).
const lines = golfCsv.split('\n');
const headerLine = lines.findIndex((l) => l.startsWith('time_s'));
const badLineIndex = headerLine + 40;
const badCells = lines[badLineIndex].split(',');
badCells[5] = '4o.2';
lines[badLineIndex] = badCells.join(',');
const badPath = join(dir, 'bay-2-garbled.csv');
writeFileSync(badPath, lines.join('\n'));
const BAD_LINE = badLineIndex + 1; // 1-based line of the file
const BAD_COLUMN = 6; // 1-based field

const walkingPath = 'tests/fixtures/gaitpdb/GaCo01_01.txt'; // PhysioNet gaitpdb (ODC-By, see its README)

type AnalyzeJson = { swings: { events: Record<string, number>; tempo_ratio: number | null; impact_source: string; phases: { name: string; duration_s: number | null; mean_lead_pct: number | null }[] }[] };

async function analyzeCli(file: string): Promise<AnalyzeJson> {
  const args = ['--handedness', athlete.handedness, '--stance-width-mm', String(athlete.stanceWidthMm), '--cutoff-hz', '20'];
  const { stdout } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', file, ...args], { maxBuffer: 64 << 20 });
  return JSON.parse(stdout) as AnalyzeJson;
}

let browser: Browser;
let page: Page;
let baseUrl: string;
let db: Knex;
let expected: AnalyzeJson;

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  db = serverDb();
  await seedDemo(db);
  expected = await analyzeCli(golfPath);
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail' && page) {
    await page.screenshot({ path: screenshotPath(`e2e-upload-failed-${task.name.replace(/\W+/g, '-').slice(0, 60)}`), fullPage: true });
  }
});

afterAll(async () => {
  await browser?.close();
  if (db) {
    await seedDemo(db); // the next test files expect the plain demo scenario
    await db.destroy();
  }
});

/** Drops files on the drop zone as a desktop drag would: a DataTransfer holding File objects. */
async function dropFiles(target: Page, files: { path: string; type: string }[]): Promise<void> {
  const payload = files.map((f) => ({ name: f.path.split('/').pop()!, type: f.type, content: readFileSync(f.path, 'utf8') }));
  const transfer = await target.evaluateHandle((list) => {
    const dt = new DataTransfer();
    for (const f of list) dt.items.add(new File([f.content], f.name, { type: f.type }));
    return dt;
  }, payload);
  await target.getByTestId('drop-zone').dispatchEvent('dragover', { dataTransfer: transfer });
  await target.getByTestId('drop-zone').dispatchEvent('drop', { dataTransfer: transfer });
}

const item = (name: string) => page.locator(`[data-testid="upload-item"][data-filename="${name}"]`);

describe('uploading recordings in the browser', () => {
  it('signs in as the coach and opens the upload page with the athlete’s defaults', async () => {
    await page.goto(`${baseUrl}/upload?athlete=${athlete.id}`);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('Email').fill(DEMO.coach);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/upload?athlete=${athlete.id}`);
    await page.getByRole('heading', { name: 'Upload recordings' }).waitFor();
    // Handedness and stance width are left to the file (else the athlete's profile) unless chosen here; the cutoff
    // defaults to the core's.
    expect(await page.getByLabel(/As the file says/).isChecked()).toBe(true);
    expect(await page.getByLabel('Stance width (mm)').inputValue()).toBe('');
    expect(await page.getByLabel('Filter cutoff (Hz)').inputValue()).toBe('20');
    expect(await page.getByLabel('Add the files to').inputValue()).toBe(''); // a new session
  });

  it('refuses a bad option on its field before sending anything (the server’s own zod schema)', async () => {
    await dropFiles(page, [{ path: golfPath, type: 'text/csv' }]);
    await page.getByLabel('Filter cutoff (Hz)').fill('80');
    await page.getByRole('button', { name: 'Upload 1 file' }).click();
    const error = page.locator('[data-field-error="cutoffHz"]');
    await error.waitFor();
    expect(await error.textContent()).toBe('The filter cutoff must be at most 50 Hz.'); // lib/recordings/fields.ts
    expect(await item('bay-2-golf.csv').getAttribute('data-state')).toBe('pending');
    await page.getByLabel('Filter cutoff (Hz)').fill('20');
    await item('bay-2-golf.csv').getByRole('button', { name: 'Remove' }).click();
    await expect(page.getByTestId('upload-item').count()).resolves.toBe(0);
  });

  it('uploads a good and a bad file dropped together: progress, processing, swings, and the error’s line and column', async () => {
    await dropFiles(page, [
      { path: golfPath, type: 'text/csv' },
      { path: badPath, type: 'text/csv' },
    ]);
    await expect(page.getByTestId('upload-item').count()).resolves.toBe(2);
    // Record every progress value the bars show, to see the bytes move and not just the end state.
    await page.evaluate(() => {
      const seen: number[] = [];
      (window as unknown as { progressSeen: number[] }).progressSeen = seen;
      new MutationObserver((records) => {
        for (const r of records) {
          const el = r.target as HTMLElement;
          if (el.getAttribute?.('role') === 'progressbar') seen.push(Number(el.getAttribute('aria-valuenow')));
        }
      }).observe(document.body, { subtree: true, attributes: true, attributeFilter: ['aria-valuenow'] });
    });
    await page.getByRole('button', { name: 'Upload 2 files' }).click();

    for (const [name, path] of [
      ['bay-2-golf.csv', golfPath],
      ['bay-2-garbled.csv', badPath],
    ]) {
      await item(name).locator('[data-testid="upload-progress"][aria-valuenow="100"]').waitFor();
      const size = statSync(path).size;
      const kb = `${(size / 1024).toFixed(0)} KB`; // components/recordings/format.ts formatBytes for 10-1024 KB
      expect(await item(name).getByTestId('upload-bytes').textContent()).toBe(`${kb} of ${kb} sent`);
    }
    const seen = await page.evaluate(() => (window as unknown as { progressSeen: number[] }).progressSeen);
    expect(Math.max(...seen)).toBe(100);

    // The good file: ready, with the swings `npm run analyze` finds, at the same impact times.
    const good = item('bay-2-golf.csv');
    await good.locator('[data-testid="recording-status"][data-status="ready"]').waitFor({ timeout: 60_000 });
    expect(expected.swings.length).toBeGreaterThan(0);
    expect(await good.getByTestId('swing-count').textContent()).toBe(`${expected.swings.length} swings found`);
    const impacts = await good.locator('[data-testid="found-swings"] tbody tr td:nth-child(4)').allTextContents();
    expect(impacts).toEqual(expected.swings.map((s) => s.events.impact.toFixed(3)));

    // The bad file: kept, then failed with what and where.
    const bad = item('bay-2-garbled.csv');
    await bad.locator('[data-testid="recording-status"][data-status="failed"]').waitFor({ timeout: 60_000 });
    expect(await bad.getByTestId('recording-error-where').textContent()).toBe(` at line ${BAD_LINE}, column ${BAD_COLUMN}`);
    expect(await bad.getByTestId('recording-error').textContent()).toContain('"4o.2" is not a number');
    await page.screenshot({ path: screenshotPath('e2e-upload-good-and-bad'), fullPage: true });
  });

  it('shows the new session with its recordings and a sortable, filterable swing table', async () => {
    await page.getByTestId('open-session').click();
    await page.waitForURL(/\/sessions\/\d+$/);
    await page.getByTestId('swing-table').waitFor();
    const rows = page.locator('[data-testid="swing-table"] tbody tr[data-testid="swing-row"]');
    await expect(rows.count()).resolves.toBe(expected.swings.length);
    expect(await page.locator('[data-testid="recording-row"][data-filename="bay-2-garbled.csv"] [data-testid="recording-error-where"]').textContent()).toBe(
      ` at line ${BAD_LINE}, column ${BAD_COLUMN}`,
    );
    // Club and label are not set yet: a dash in every row.
    const clubs = await rows.locator('td:nth-child(3)').allTextContents();
    expect(clubs.every((c) => c === '—')).toBe(true);

    // Sort by tempo, ascending: the order of analyze's tempo ratios.
    const tempoText = (r: number | null) => (r === null ? '—' : `${r.toFixed(2)} : 1`);
    await page.getByRole('button', { name: 'Tempo' }).click();
    const sorted = [...expected.swings].map((s) => s.tempo_ratio).sort((a, b) => (a ?? Infinity) - (b ?? Infinity));
    expect(await rows.locator('td:nth-child(7)').allTextContents()).toEqual(sorted.map(tempoText));

    // Filter: tempo at least the median value keeps the upper half.
    const threshold = sorted[Math.floor(sorted.length / 2)]!;
    await page.getByLabel('Tempo (x : 1), at least').fill(String(threshold));
    const kept = sorted.filter((t) => t !== null && t >= threshold);
    await page.waitForFunction((n) => document.querySelectorAll('[data-testid="swing-row"]').length === n, kept.length);
    expect(await rows.locator('td:nth-child(7)').allTextContents()).toEqual(kept.map(tempoText));
    await page.screenshot({ path: screenshotPath('e2e-session-swings'), fullPage: true });
    await page.getByLabel('Tempo (x : 1), at least').fill('');
    await page.waitForFunction((n) => document.querySelectorAll('[data-testid="swing-row"]').length === n, expected.swings.length);
  });

  it('opens a swing: phase table, tempo, impact source, parameters and the caution', async () => {
    await page.getByRole('button', { name: 'Swing' }).first().click(); // sort by swing number
    await page.getByRole('link', { name: 'Swing 1', exact: true }).click();
    await page.waitForURL(/\/swings\/\d+$/);
    const first = expected.swings[0];
    const phaseRows = page.locator('[data-testid="phase-table"] tbody tr');
    await expect(phaseRows.count()).resolves.toBe(first.phases.length);
    const durations = await phaseRows.locator('td:nth-child(2)').allTextContents();
    expect(durations).toEqual(first.phases.map((p) => (p.duration_s === null ? '—' : p.duration_s.toFixed(3))));
    const meanLead = await phaseRows.locator('td:nth-child(5)').allTextContents();
    expect(meanLead).toEqual(first.phases.map((p) => (p.mean_lead_pct === null ? '—' : p.mean_lead_pct.toFixed(1))));
    expect(await page.getByTestId('swing-tempo').textContent()).toBe(`${first.tempo_ratio!.toFixed(2)} : 1`);
    expect(await page.getByTestId('swing-impact-source').textContent()).toBe('Detected from pressure'); // no impact column
    const params = (await page.getByTestId('processing-parameters').textContent()) ?? '';
    expect(params).toContain('stanceline-signal/');
    expect(params).toContain(`Stance width (mm)${athlete.stanceWidthMm}`);
    expect((await page.locator('main').textContent()) ?? '').toContain('Coaching information, not a medical assessment');
    await page.screenshot({ path: screenshotPath('e2e-swing-phases'), fullPage: true });
  });

  it('says plainly that the shared walking file holds no golf swings', async () => {
    await page.goto(`${baseUrl}/upload?athlete=${athlete.id}`);
    await page.getByLabel('Sensor layout').selectOption('file');
    await page.getByTestId('layout-file').setInputFiles('tests/fixtures/layouts/gaitpdb.json');
    await page.getByText('Using gaitpdb.json').first().waitFor();
    await page.getByLabel('Import profile').selectOption('file');
    await page.getByTestId('profile-file').setInputFiles('tests/fixtures/profiles/gaitpdb.json');
    await page.getByLabel('Save this profile as (optional)').fill('Walking lab export');
    await page.getByTestId('file-input').setInputFiles(walkingPath);
    await page.getByRole('button', { name: 'Upload 1 file' }).click();
    const walking = item('GaCo01_01.txt');
    await walking.locator('[data-testid="recording-status"][data-status="ready"]').waitFor({ timeout: 60_000 });
    expect(await walking.getByTestId('swing-count').textContent()).toBe('0 swings found');
    expect(await walking.getByTestId('no-swings').textContent()).toContain('No golf swings were found in this file.');
    await page.screenshot({ path: screenshotPath('e2e-upload-walking'), fullPage: true });

    // The profile was saved for this coach and is offered on the next upload.
    await page.goto(`${baseUrl}/upload?athlete=${athlete.id}`);
    await expect(page.getByLabel('Import profile').locator('option', { hasText: 'Saved: Walking lab export' }).count()).resolves.toBe(1);
  });
});
