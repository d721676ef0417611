import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// The coach starts a live lesson on a tablet-sized screen (1024x768), starts the demo bridge (one of the demo
// recordings replayed at real speed through the same ingest as the insoles' bridge) and sees a swing card appear,
// with pass / miss said in words beside the shapes and the same news in the aria-live status text.

const env = e2eEnv();
let browser: Browser;
let page: Page | undefined;

beforeAll(async () => {
  browser = await launchBrowser(env.CHROMIUM_PATH);
});
afterAll(async () => {
  await browser?.close();
});
afterEach(async (ctx) => {
  if (ctx.task.result?.state === 'fail') await screenshotFailure('live', ctx.task.name, [['coach', page]]);
});

describe('live lesson in the browser', () => {
  it('the demo bridge brings a swing card within the lesson', { timeout: 180_000 }, async () => {
    page = await browser.context.newPage();
    await page.setViewportSize({ width: 1024, height: 768 });
    await signInAt(page, env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD, '/live');
    await page.getByLabel('Drill in focus').fill('Hold the finish');
    await page.getByRole('button', { name: 'Start live lesson' }).click();
    await page.getByTestId('live-screen').waitFor();
    await expect.poll(() => page!.getByRole('button', { name: 'Sound cue: off' }).count()).toBe(1); // off by default
    await page.getByRole('button', { name: 'Start demo bridge' }).click();
    const card = page.getByTestId('live-swing-card');
    await card.waitFor({ timeout: 120_000 });
    await expect.poll(() => page!.getByTestId('live-weight').textContent()).toMatch(/Lead \d+%/);
    const text = (await card.textContent()) ?? '';
    expect(text).toMatch(/Swing 1/);
    expect(text).toMatch(/pass|miss|No target/);
    expect(text).toContain('Drill: Hold the finish');
    expect(await page.getByTestId('live-announce').textContent()).toMatch(/^Swing 1: /);
    await page.screenshot({ path: screenshotPath('live-lesson-1024x768') });
    // one-tap label
    await card.getByRole('button', { name: 'Driver' }).click();
    await expect.poll(() => card.getByRole('button', { name: 'Driver' }).getAttribute('aria-pressed')).toBe('true');
    await page.getByRole('button', { name: 'End lesson' }).click();
    await page.getByText('The whole lesson is now a recording').waitFor({ timeout: 30_000 });
  });
});
