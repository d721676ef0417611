// The invitation chain in chromium, with the mail read from the SMTP fake's folder: an admin invites a coach; the
// coach sets a password from the mail's link and lands signed in; the coach invites a student for a player of their
// own; the student sets a password, lands signed in and sees that player's sessions. Screenshots in artifacts/.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { generateSession } from '@/lib/signal/synthetic';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { linkIn, waitForMail } from '../http/support/mail';
import { axeViolations } from './support/axe';
import { launchBrowser, screenshotPath, signInAt, type Browser } from './support/browser';

let browser: Browser;
let page: Page;
let baseUrl: string;
const run = Date.now().toString(36);
const coachEmail = `new-coach-${run}@stanceline.test`;
const studentEmail = `new-student-${run}@stanceline.test`;
const playerName = `Perrin Odell ${run}`;
let sessionId = 0;

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
});

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
  await page.screenshot({ path: screenshotPath(`e2e-invite-${name}-1280`), fullPage: true });
  await page.setViewportSize({ width: 1024, height: 768 });
  await page.screenshot({ path: screenshotPath(`e2e-invite-${name}-1024`), fullPage: true });
  await page.setViewportSize({ width: 1280, height: 800 });
}

/** Opens the invitation link signed out, checks the form with axe, sets a password and waits for the home page. */
async function acceptFromMail(email: string, name: string | null, screenshot: string): Promise<void> {
  const mail = await waitForMail(email, new Set());
  const { url } = linkIn(mail, '/invite');
  await page.context().clearCookies();
  await page.goto(url);
  await page.getByTestId('accept-invitation').waitFor();
  expect(await axeViolations(page)).toEqual([]);
  if (name) await page.getByLabel('Your name').fill(name);
  await page.getByLabel('Choose a password').fill('a-long-enough-password');
  await page.getByLabel('Type it again').fill('a-long-enough-password');
  await shoot(screenshot);
  await page.getByRole('button', { name: 'Create my account' }).click();
  await page.waitForURL(`${baseUrl}/`);
}

describe('invitations in the browser', () => {
  it('an admin invites a coach from the Invitations page', async () => {
    await signInAt(page, baseUrl, DEMO.admin, DEMO_PASSWORD, '/invitations');
    await page.getByLabel('E-mail address').fill(coachEmail);
    await page.getByLabel('Role').selectOption('coach');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(page.getByTestId('invite-status').textContent()).resolves.toBeDefined();
    await page.getByTestId('pending-invitations').getByText(coachEmail).waitFor();
    await shoot('admin-sent');
  });

  it('the coach opens the mail’s link, sets a password and lands signed in', async () => {
    await acceptFromMail(coachEmail, 'Idris Fenlow', 'coach-accept');
    await expect(page.getByTestId('viewer-name').textContent()).resolves.toBe('Idris Fenlow');
    await shoot('coach-home');
  });

  it('the new coach adds a player with a recorded session and invites the player as a student', async () => {
    // set-up through the API with the browser's own session (the upload flow has its own browser test)
    const athlete = await page.request.post(`${baseUrl}/api/athletes`, { data: { displayName: playerName, handedness: 'right', stanceWidthMm: 390, dateOfBirth: null, homeClub: null } });
    expect(athlete.status()).toBe(201);
    const athleteId = ((await athlete.json()) as { athlete: { id: number } }).athlete.id;
    const csv = generateSession({ seed: 5151, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 390, swings: 2, withMarker: true }).csv();
    const uploaded = await page.request.post(`${baseUrl}/api/recordings`, {
      multipart: { athleteId: String(athleteId), handedness: 'right', stanceWidthMm: '390', file: { name: 'first-lesson.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) } },
    });
    expect(uploaded.status()).toBe(202);
    sessionId = ((await uploaded.json()) as { recordings: { sessionId: number }[] }).recordings[0]!.sessionId;

    await page.goto(`${baseUrl}/invitations`);
    await page.getByLabel('E-mail address').fill(studentEmail);
    await page.getByLabel('Player on your roster').selectOption({ label: playerName });
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByTestId('pending-invitations').getByText(studentEmail).waitFor();
    await shoot('coach-sent');
  });

  it('the student opens the link, sets a password, lands signed in and sees the player’s session', async () => {
    await acceptFromMail(studentEmail, null, 'student-accept');
    await expect(page.getByTestId('viewer-name').textContent()).resolves.toBe(playerName);
    await page.locator(`a[href="/sessions/${sessionId}"]`).first().waitFor();
    await shoot('student-home');
    await page.goto(`${baseUrl}/sessions/${sessionId}`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(page.url()).toBe(`${baseUrl}/sessions/${sessionId}`);
  });
});
