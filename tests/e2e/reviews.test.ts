// A paid remote review in chromium: the student asks for a review of a ready recording, pays on the payments fake's
// pay page, lands back on the request marked paid; the coach sees it in the queue and opens it. Screenshots in
// artifacts/ at 1280x800 and 1024x768.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn } from '../http/support/http-session';
import { settled, upload } from '../http/support/recordings-http';
import { axeViolations } from './support/axe';
import { launchBrowser, screenshotPath, signInAt, type Browser } from './support/browser';

let browser: Browser;
let page: Page;
let baseUrl: string;
const question = `Does my pressure reach the lead foot early enough? (${Date.now().toString(36)})`;
let recordingId = 0;

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  // a ready recording of the student's own player (athlete 1), uploaded by the coach
  const coachApi = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  const offer = await coachApi.json('/api/review-offer', { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ priceCents: 4500, currency: 'EUR', turnaroundDays: 3 }) });
  expect(offer.status).toBe(200);
  const csv = generateSession({ seed: 1819, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 2, withMarker: true }).csv();
  const res = await upload(coachApi, { athleteId: 1, sessionId: 1, handedness: 'right', stanceWidthMm: 380 }, [{ name: `remote-review-${Date.now().toString(36)}.csv`, content: csv }]);
  expect(res.status).toBe(202);
  recordingId = res.body.recordings[0].id;
  expect((await settled(coachApi, recordingId)).status).toBe('ready');
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
}, 120_000);

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail' && page) {
    await page.screenshot({ path: screenshotPath(`e2e-failed-${task.name.replace(/\W+/g, '-').slice(0, 60)}`), fullPage: true });
  }
});

afterAll(async () => {
  await browser?.close();
});

async function shoot(name: string) {
  await page.setViewportSize({ width: 1280, height: 800 });
  await page.screenshot({ path: screenshotPath(`e2e-reviews-${name}-1280`), fullPage: true });
  await page.setViewportSize({ width: 1024, height: 768 });
  await page.screenshot({ path: screenshotPath(`e2e-reviews-${name}-1024`), fullPage: true });
  await page.setViewportSize({ width: 1280, height: 800 });
}

describe('paid remote review in the browser', () => {
  it('the student requests and pays on the fake’s page; the coach sees the paid review in the queue', async () => {
    await signInAt(page, baseUrl, DEMO.student, DEMO_PASSWORD, '/reviews');
    await page.getByTestId('request-form').waitFor();
    await page.getByLabel('Recording').selectOption(String(recordingId));
    // an empty question is refused on the field
    await page.getByRole('button', { name: /Continue to payment/ }).click();
    await page.locator('#request-question[aria-invalid="true"]').waitFor();
    await page.getByLabel('What should your coach look at?').fill(question);
    await shoot('student-request');
    await page.getByRole('button', { name: /Continue to payment \(45\.00 EUR\)/ }).click();

    // the payments fake's pay page
    await page.getByRole('heading', { name: 'Test payment' }).waitFor();
    expect(await page.getByTestId('amount').textContent()).toBe('45.00 EUR');
    await shoot('pay-page');
    await page.getByRole('button', { name: /^Pay / }).click();

    // back in the app: paid
    await page.waitForURL(/\/reviews\/\d+\?paid=1$/);
    const reviewId = Number(/\/reviews\/(\d+)/.exec(page.url())![1]);
    await page.getByTestId('paid-banner').filter({ hasText: 'your payment went through' }).waitFor();
    expect(await page.getByTestId('review-status').textContent()).toContain('Paid, not started');
    expect(await axeViolations(page)).toEqual([]);
    await shoot('student-paid');

    // the coach's queue
    await page.context().clearCookies();
    await signInAt(page, baseUrl, DEMO.coach, DEMO_PASSWORD, '/reviews');
    const row = page.getByTestId(`review-row-${reviewId}`);
    await row.waitFor();
    expect(await row.textContent()).toContain('Paid, not started');
    expect(await row.textContent()).toContain('Ada Fenwick');
    expect(await axeViolations(page)).toEqual([]);
    await shoot('coach-queue');
    await row.getByRole('link').click();
    await page.getByTestId('deliver-form').waitFor();
    expect(await page.getByTestId('coaching-caution').count()).toBe(1);
    await shoot('coach-review');
  }, 120_000);

  it('the coach stops taking requests (asked first), sees the form say so, and undoes it', async () => {
    await page.context().clearCookies();
    await signInAt(page, baseUrl, DEMO.coach, DEMO_PASSWORD, '/reviews');
    const form = page.getByTestId('offer-form');
    await form.waitFor();
    await page.getByRole('button', { name: 'Stop taking requests…' }).click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Stop taking requests' }).click();
    await form.getByRole('button', { name: 'Offer again' }).waitFor({ timeout: 15_000 });
    expect(await axeViolations(page)).toEqual([]);
    await shoot('coach-offer-withdrawn');
    await page.getByTestId('undo-line').getByRole('button', { name: 'Undo' }).click();
    await form.getByRole('button', { name: 'Save offer' }).waitFor({ timeout: 15_000 });
  }, 60_000);
});
