import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { launchBrowser, screenshotPath, type Browser } from './support/browser';

let browser: Browser;
let page: Page;
let baseUrl: string;
// Unique per run so a re-run against the same database does not meet the previous run's athlete.
const newAthleteName = `Quinn Harlowe ${Date.now().toString(36)}`;

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
});

afterEach(async ({ task }) => {
  // Keep what the browser showed when a step failed.
  if (task.result?.state === 'fail' && page) {
    await page.screenshot({ path: screenshotPath(`e2e-failed-${task.name.replace(/\W+/g, '-').slice(0, 60)}`), fullPage: true });
  }
});

afterAll(async () => {
  await browser?.close();
});

describe('coach roster in the browser', () => {
  it('sends a visitor to the sign-in page and back to the roster after signing in', async () => {
    await page.goto(`${baseUrl}/roster`);
    await page.waitForURL(/\/sign-in\?callbackUrl=%2Froster/);
    await page.getByLabel('Email').fill(DEMO.coach);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/roster`);
    await expect(page.getByTestId('viewer-name').textContent()).resolves.toBe('Maren Solberg');
  });

  it('shows the demo coach’s roster with Ada Fenwick and only their athletes', async () => {
    const table = page.getByTestId('athlete-table');
    await table.getByRole('link', { name: 'Ada Fenwick' }).waitFor();
    const text = (await table.textContent()) ?? '';
    expect(text).toContain('Ada Fenwick');
    expect(text).not.toContain('Rafe Dunmoor'); // on the other coach's roster (db/demo/scenario.ts)
    await page.screenshot({ path: screenshotPath('e2e-coach-roster'), fullPage: true });
  });

  it('filters the roster through the API as the coach types', async () => {
    await page.getByTestId('roster-search').fill('fenw');
    await page.waitForURL(/\?q=fenw/);
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="athlete-table"] tbody tr').length === 1);
    expect(await page.getByTestId('athlete-table').textContent()).toContain('Ada Fenwick');
    await page.getByTestId('roster-search').fill('');
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="athlete-table"] tbody tr').length > 1);
  });

  it('creates an athlete through the form, showing a field error first', async () => {
    await page.getByRole('link', { name: 'Add athlete' }).first().click();
    await page.waitForURL(`${baseUrl}/athletes/new`);
    await page.getByLabel('Name').fill(newAthleteName);
    await page.getByLabel('Left-handed').check();
    await page.getByLabel('Stance width (mm)').fill('1200');
    await page.getByRole('button', { name: 'Add athlete' }).click();

    const error = page.locator('[data-field-error="stanceWidthMm"]');
    await error.waitFor();
    expect(await error.textContent()).toBe('Stance width must be at most 900 mm.');
    expect(page.url()).toBe(`${baseUrl}/athletes/new`);
    await page.screenshot({ path: screenshotPath('e2e-athlete-form-error'), fullPage: true });

    await page.getByLabel('Stance width (mm)').fill('410');
    await page.getByLabel('Home club (optional)').fill('Fernmoor Links');
    await page.getByRole('button', { name: 'Add athlete' }).click();
    await page.waitForURL(/\/athletes\/\d+$/);
    await page.getByRole('heading', { name: newAthleteName }).waitFor();
    const body = (await page.locator('main').textContent()) ?? '';
    expect(body).toContain('Left-handed');
    expect(body).toContain('410 mm');
    expect(body).toContain('Coaching information, not a medical assessment');
    await page.screenshot({ path: screenshotPath('e2e-athlete-created'), fullPage: true });
  });

  it('lists the new athlete on the roster', async () => {
    await page.getByRole('link', { name: 'Roster' }).click();
    await page.waitForURL(`${baseUrl}/roster`);
    await page.getByTestId('athlete-table').getByRole('link', { name: newAthleteName }).waitFor();
  });

  it('signs out, after which the roster needs a sign-in again', async () => {
    await page.getByRole('link', { name: 'Sign out' }).click();
    await page.waitForURL(`${baseUrl}/sign-out`);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${baseUrl}/roster`);
    await page.waitForURL(/\/sign-in/);
    await page.screenshot({ path: screenshotPath('e2e-signed-out'), fullPage: true });
  });
});
