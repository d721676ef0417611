import type { Knex } from 'knex';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { DEMO_ATHLETES, DEMO_SESSIONS } from '@/db/demo/scenario';
import { generateSession } from '@/lib/signal/synthetic';
import { bandsResponseSchema } from '@/lib/contracts/bands';
import { assignmentsResponseSchema, drillsResponseSchema } from '@/lib/contracts/drills';
import { scoreResponseSchema } from '@/lib/contracts/targets';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { serverDb, settled, upload } from '../http/support/recordings-http';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// Targets, bands and drills in chromium. The coach builds a reference band from three swings and overlays it on a
// fourth, where the band is drawn on the lead % chart and the score numbers on the page are the API's own
// (GET /api/swings/:id/score?band=); the coach assigns a drill; the student signs in, sees it with its cautions and
// marks practice done with a note, which the coach's API then reports. The swings come from an invented lesson of
// the project's generator uploaded through POST /api/recordings.

const athlete = DEMO_ATHLETES.find((a) => a.id === 1)!; // coach@'s student, account student@ (db/demo/scenario.ts)
const session = DEMO_SESSIONS.find((s) => s.athleteId === athlete.id)!;
const BAND = 'Four-swing test band';
const NOTE = 'Did three sets of ten at half speed.';
const DUE = '2030-01-15';

let coachBrowser: Browser;
let studentBrowser: Browser;
let coachPage: Page;
let studentPage: Page;
let baseUrl: string;
let db: Knex;
let coachApi: HttpSession;
let swingIds: number[];
let bandId: number;
let assignmentId: number;

const signIn = (page: Page, email: string, path: string) => signInAt(page, baseUrl, email, DEMO_PASSWORD, path);

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  db = serverDb();
  await seedDemo(db);
  coachApi = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  const csv = generateSession({ seed: 63, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm, swings: 5, withMarker: false, distractors: ['walk'] }).csv();
  const res = await upload(coachApi, { athleteId: athlete.id, sessionId: session.id, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm }, [{ name: 'band-lesson.csv', content: csv }]);
  expect(res.status).toBe(202);
  const done = await settled(coachApi, res.body.recordings[0].id);
  expect(done.status).toBe('ready');
  swingIds = (done.swings as { id: number; stale: boolean }[]).filter((s) => !s.stale).map((s) => s.id);
  expect(swingIds.length).toBeGreaterThanOrEqual(4);
  coachBrowser = await launchBrowser(env.CHROMIUM_PATH);
  studentBrowser = await launchBrowser(env.CHROMIUM_PATH);
  coachPage = await coachBrowser.context.newPage();
  studentPage = await studentBrowser.context.newPage();
  await coachPage.setViewportSize({ width: 1280, height: 800 });
  await studentPage.setViewportSize({ width: 1280, height: 800 });
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') {
    await screenshotFailure('e2e-targets-bands', task.name, [['coach', coachPage], ['student', studentPage]]);
  }
});

afterAll(async () => {
  await coachBrowser?.close();
  await studentBrowser?.close();
  if (db) {
    await seedDemo(db); // the next test files expect the plain demo scenario
    await db.destroy();
  }
});

describe('targets, bands and drills in the browser', () => {
  it('coach: the targets page marks the defaults as common practice and shows the cautions', async () => {
    await signIn(coachPage, DEMO.coach, '/targets');
    await coachPage.getByTestId('target-list').waitFor();
    expect(await coachPage.getByText('Common practice', { exact: true }).count()).toBeGreaterThan(0);
    expect(await coachPage.getByRole('note', { name: 'Health caution' }).count()).toBe(1);
    await coachPage.screenshot({ path: screenshotPath('e2e-targets-coach'), fullPage: true });
  });

  it('coach: copies the irons default into a target for the student, with the tolerance checked on the field', async () => {
    const card = coachPage.locator('[data-target]', { hasText: 'Irons: common practice default' });
    await card.getByRole('button', { name: 'Copy and edit' }).click();
    const form = coachPage.getByTestId('target-form');
    await form.getByLabel('For').selectOption({ label: athlete.displayName });
    await form.getByLabel('Check 1 tolerance').fill('0');
    await form.getByRole('button', { name: 'Save as my target' }).click();
    // lib/validations/target.ts: a tolerance must be above 0; the message sits under the field
    await form.getByRole('alert').filter({ hasText: 'Tolerance must be above 0.' }).waitFor();
    await form.getByLabel('Check 1 tolerance').fill('8');
    await form.getByRole('button', { name: 'Save as my target' }).click();
    const mine = coachPage.locator('[data-target]', { hasText: 'Irons: common practice default (my copy)' });
    await mine.waitFor();
    expect(await mine.getByText(`For ${athlete.displayName}`).count()).toBe(1);
    expect(await mine.getByText('50 ± 8').count()).toBe(1); // check 1 is address lead % 50 (lib/targets/defaults.ts)
  });

  it('coach: two swings are refused on the form, three build a band', async () => {
    await coachPage.goto(`${baseUrl}/bands`);
    await coachPage.getByLabel('Swings of').selectOption({ label: athlete.displayName });
    await coachPage.getByLabel('Band name').fill(BAND);
    for (const id of swingIds.slice(0, 2)) await coachPage.locator(`[data-swing-choice="${id}"]`).check();
    await coachPage.getByRole('button', { name: 'Build band' }).click();
    await coachPage.locator('[data-field-error="swingIds"]').waitFor(); // fewer than 3: the form says so before sending
    await coachPage.locator(`[data-swing-choice="${swingIds[2]}"]`).check();
    await coachPage.getByRole('button', { name: 'Build band' }).click();
    expect(await coachPage.getByTestId('band-built').textContent()).toBe(`Band “${BAND}” built from 3 swings.`);
    await coachPage.getByTestId('band-list').getByText(BAND).waitFor();
    const { body } = await coachApi.json('/api/bands');
    const band = bandsResponseSchema.parse(body).bands.find((b) => b.name === BAND)!;
    expect(band).toMatchObject({ swingCount: 3, k: 1, shared: false });
    bandId = band.id;
    await coachPage.screenshot({ path: screenshotPath('e2e-bands-builder'), fullPage: true });
  });

  it('coach: overlays the band on a fourth swing and sees the score numbers the API gives', async () => {
    const fourth = swingIds[3];
    await coachPage.goto(`${baseUrl}/swings/${fourth}`);
    await coachPage.locator('[data-testid="swing-workbench"][data-can-edit] [data-swing-viewer]').waitFor({ timeout: 30_000 });
    const chart = coachPage.locator('[data-chart="swing-lead-share"]');
    expect(await chart.locator('[data-layer="band"]').count()).toBe(0);
    await coachPage.getByLabel('Reference band').selectOption(String(bandId));
    await chart.locator('[data-layer="band"]').waitFor();
    await coachPage.getByTestId('band-score').waitFor();
    const { status, body } = await coachApi.json(`/api/swings/${fourth}/score?band=${bandId}`);
    expect(status).toBe(200);
    const score = scoreResponseSchema.parse(body);
    expect(score.band).not.toBeNull();
    // the page shows the API's numbers with the panel's rounding (components/targets/score-panel.tsx)
    expect(await coachPage.getByTestId('band-inside').textContent()).toBe(`${score.band!.insidePct!.toFixed(1)} %`);
    expect(await coachPage.getByTestId('band-rms').textContent()).toBe(score.band!.rms!.toFixed(2));
    expect(await coachPage.getByTestId('band-cmc').textContent()).toBe(score.band!.cmc!.toFixed(3));
    if (score.target) {
      const passed = score.target.checks.filter((c) => c.pass).length;
      expect(await coachPage.getByTestId('score-summary').textContent()).toContain(`${score.target.summary?.passed ?? passed} of`);
      expect(await coachPage.locator('[data-check][data-pass="false"]').count()).toBe(score.target.checks.filter((c) => c.pass === false).length + (score.target.tempo?.pass === false ? 1 : 0));
    }
    await coachPage.getByTestId('score-panel').scrollIntoViewIfNeeded();
    await coachPage.screenshot({ path: screenshotPath('e2e-band-overlay'), fullPage: true });
  });

  it('coach: the session table shows each swing’s target checks and the session page the drill report', async () => {
    await coachPage.goto(`${baseUrl}/sessions/${session.id}`);
    await coachPage.getByTestId('swing-score').first().waitFor({ timeout: 30_000 });
    expect(await coachPage.getByTestId('swing-score').first().textContent()).toMatch(/^\d+\/\d+$/);
    await coachPage.getByText('Drills before this session').waitFor();
  });

  it('coach: compare and progress pages draw their charts', async () => {
    await coachPage.goto(`${baseUrl}/athletes/${athlete.id}/compare`);
    await coachPage.getByTestId('compare-differences').waitFor({ timeout: 30_000 });
    expect(await coachPage.locator('[data-chart="compare-strip"]').count()).toBeGreaterThan(0);
    await coachPage.screenshot({ path: screenshotPath('e2e-compare'), fullPage: true });
    await coachPage.goto(`${baseUrl}/athletes/${athlete.id}/progress`);
    await coachPage.locator('[data-chart="progress-trend"]').first().waitFor({ timeout: 30_000 });
    await coachPage.screenshot({ path: screenshotPath('e2e-progress'), fullPage: true });
  });

  it('coach: assigns a drill to the student with a due date', async () => {
    const drills = drillsResponseSchema.parse((await coachApi.json('/api/drills')).body).drills;
    expect(drills.length).toBeGreaterThan(0);
    const drill = drills[0];
    await coachPage.goto(`${baseUrl}/drills`);
    await coachPage.getByTestId('drill-library').waitFor();
    await coachPage.getByLabel(`Assign ${drill.name} to`).selectOption({ label: athlete.displayName });
    await coachPage.getByLabel(`Due date for ${drill.name}`).fill(DUE);
    const card = coachPage.locator(`[data-drill="${drill.name}"]`);
    await card.getByRole('button', { name: 'Assign' }).click();
    await card.getByRole('status').waitFor();
    await coachPage.getByTestId('coach-assignments').locator('tr', { hasText: drill.name }).filter({ hasText: '15 Jan 2030' }).waitFor();
    const all = assignmentsResponseSchema.parse((await coachApi.json('/api/drill-assignments')).body).assignments;
    const made = all.filter((a) => a.dueDate === DUE && a.athleteId === athlete.id && a.drill?.name === drill.name);
    expect(made).toHaveLength(1);
    expect(made[0].practiceDone).toBe(false);
    assignmentId = made[0].id;
    await coachPage.screenshot({ path: screenshotPath('e2e-drills-coach'), fullPage: true });
  });

  it('student: sees the drill with its cautions and marks practice done with a note', async () => {
    await signIn(studentPage, DEMO.student, '/drills');
    await studentPage.getByTestId('student-drills').waitFor();
    expect(await studentPage.getByTestId('drill-caution').count()).toBeGreaterThan(0);
    expect(await studentPage.getByRole('note', { name: 'Health caution' }).count()).toBe(1);
    const id = assignmentId;
    const open = studentPage.locator(`[data-assignment="${id}"][data-done="false"]`);
    await open.getByLabel('Note for your coach').fill(NOTE);
    await open.getByRole('button', { name: 'Mark practice done' }).click();
    await studentPage.locator(`[data-assignment="${id}"][data-done="true"]`).waitFor();
    await studentPage.screenshot({ path: screenshotPath('e2e-drills-student'), fullPage: true });
    const mine = assignmentsResponseSchema.parse((await coachApi.json('/api/drill-assignments')).body).assignments.find((a) => a.id === id)!;
    expect(mine).toMatchObject({ practiceDone: true, studentNote: NOTE });
  });

  it('student: reads the score on their swing (no band picker) and their targets, without edit controls', async () => {
    await studentPage.goto(`${baseUrl}/swings/${swingIds[3]}`);
    await studentPage.getByTestId('score-summary').waitFor({ timeout: 30_000 });
    expect(await studentPage.getByLabel('Reference band').count()).toBe(0);
    await studentPage.screenshot({ path: screenshotPath('e2e-student-swing-score'), fullPage: true });
    await studentPage.goto(`${baseUrl}/targets`);
    await studentPage.getByTestId('target-list').waitFor();
    expect(await studentPage.getByRole('button', { name: /edit|New target/i }).count()).toBe(0);
    expect(await studentPage.getByText('Common practice', { exact: true }).count()).toBeGreaterThan(0);
    await studentPage.screenshot({ path: screenshotPath('e2e-student-targets'), fullPage: true });
  });
});
