import type { Knex } from 'knex';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { DEMO_ATHLETES, DEMO_SESSIONS } from '@/db/demo/scenario';
import { generateSession } from '@/lib/signal/synthetic';
import { swingViewResponseSchema, type SwingView } from '@/lib/contracts/swings';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { serverDb, settled, upload } from '../http/support/recordings-http';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// The swing viewer in chromium, coach then student: the coach drags the top marker by 50 ms, saves, reloads and
// finds it kept and marked corrected; adds a shared note and a club label. The student sees the same traces
// read-only with the shared note and no edit controls, and a PATCH from the student's own session is refused.
// The swing comes from an invented session of the project's generator uploaded through POST /api/recordings.
// Expected times are the API's own (GET /api/swings/:id) plus the move; 50 ms at 100 Hz is 5 samples, so the
// dragged marker snaps onto a sample exactly 0.050 s away (the viewer snaps to samples, components/charts/lib/event-edit.ts).

const athlete = DEMO_ATHLETES.find((a) => a.id === 1)!; // Ada Fenwick, coach@'s student, account student@ (db/demo/scenario.ts)
const session = DEMO_SESSIONS.find((s) => s.athleteId === athlete.id)!;
const MOVE_S = 0.05;
const NOTE = 'Hold the trail heel down a moment longer at the top.';

let coachBrowser: Browser;
let studentBrowser: Browser;
let coachPage: Page;
let studentPage: Page;
let baseUrl: string;
let db: Knex;
let coachApi: HttpSession;
let swingId: number;
let before: SwingView;
let direction: 1 | -1;

const getSwing = async (api: HttpSession, id: number) => {
  const { status, body } = await api.json(`/api/swings/${id}`);
  expect(status).toBe(200);
  return swingViewResponseSchema.parse(body).swing;
};
const eventTime = (s: SwingView, name: string) => s.events.find((e) => e.name === name)!.timeS;

const signIn = (page: Page, email: string, path: string) => signInAt(page, baseUrl, email, DEMO_PASSWORD, path);

const viewerReady = (page: Page) => page.locator('[data-testid="swing-workbench"][data-can-edit] [data-swing-viewer]').waitFor({ timeout: 30_000 });

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  db = serverDb();
  await seedDemo(db);
  coachApi = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  // Invented lesson from the project's generator with the athlete's handedness and stance width.
  const csv = generateSession({ seed: 41, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm, swings: 3, withMarker: false, distractors: ['walk'] }).csv();
  const res = await upload(coachApi, { athleteId: athlete.id, sessionId: session.id, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm }, [{ name: 'viewer-lesson.csv', content: csv }]);
  expect(res.status).toBe(202);
  const done = await settled(coachApi, res.body.recordings[0].id);
  expect(done.status).toBe('ready');
  const swings = (done.swings as { id: number; stale: boolean }[]).filter((s) => !s.stale);
  expect(swings.length).toBeGreaterThan(0);
  // The swing with the most room after its top, so a +50 ms move stays before the transition; else move it back.
  const details = await Promise.all(swings.map((s) => getSwing(coachApi, s.id)));
  const room = (s: SwingView) => eventTime(s, 'transition') - eventTime(s, 'top');
  before = details.reduce((a, b) => (room(b) > room(a) ? b : a));
  swingId = before.id;
  direction = room(before) > MOVE_S + 0.015 ? 1 : -1;
  coachBrowser = await launchBrowser(env.CHROMIUM_PATH);
  studentBrowser = await launchBrowser(env.CHROMIUM_PATH);
  coachPage = await coachBrowser.context.newPage();
  studentPage = await studentBrowser.context.newPage();
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') {
    await screenshotFailure('e2e-swing-viewer', task.name, [['coach', coachPage], ['student', studentPage]]);
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

describe('the swing viewer', () => {
  it('coach: drags the top marker by 50 ms, saves, reloads and sees it kept and marked corrected', async () => {
    await coachPage.setViewportSize({ width: 1280, height: 800 });
    await signIn(coachPage, DEMO.coach, `/swings/${swingId}`);
    await viewerReady(coachPage);
    expect(await coachPage.locator('[data-testid="corrected-mark"]').count()).toBe(0);

    // Screen pixels per second from two markers whose times the API gives, then a real pointer drag.
    const chart = coachPage.locator('[data-chart="swing-lead-share"]');
    // the marker's own line (its drag target is cut at the midpoint to a close neighbour, so not centred on it)
    const centre = async (name: string) => {
      const box = (await chart.locator(`[data-drag-event="${name}"]`).boundingBox())!;
      const line = (await chart.locator(`[data-event-marker="${name}"] line`).boundingBox())!;
      return { x: line.x + line.width / 2, y: box.y + box.height / 2 };
    };
    const top = await centre('top');
    const impact = await centre('impact');
    const pxPerS = (impact.x - top.x) / (eventTime(before, 'impact') - eventTime(before, 'top'));
    expect(pxPerS).toBeGreaterThan(0);
    await coachPage.mouse.move(top.x, top.y);
    await coachPage.mouse.down();
    const target = top.x + direction * MOVE_S * pxPerS;
    for (let k = 1; k <= 5; k++) await coachPage.mouse.move(top.x + ((target - top.x) * k) / 5, top.y);
    await coachPage.mouse.up();

    const expectedTop = Math.round((eventTime(before, 'top') + direction * MOVE_S) * 1000) / 1000;
    const unsaved = coachPage.getByTestId('unsaved-moves');
    await unsaved.waitFor();
    expect(await unsaved.textContent()).toBe(`Unsaved: Top → ${(expectedTop - eventTime(before, 'address')).toFixed(2)} s`);
    // the viewer marks the moved marker before saving too
    expect(await chart.locator('[data-event-marker="top"]').getAttribute('data-corrected')).toBe('true');

    await coachPage.getByRole('button', { name: 'Save corrections' }).click();
    await coachPage.locator('[data-testid="corrected-mark"] [data-corrected-event="top"]').waitFor();
    await expect(unsaved.count()).resolves.toBe(0);

    await coachPage.reload();
    await viewerReady(coachPage);
    await coachPage.locator('[data-testid="corrected-mark"] [data-corrected-event="top"]').waitFor();
    expect(await coachPage.locator('[data-chart="swing-lead-share"] [data-event-marker="top"]').getAttribute('data-corrected')).toBe('true');
    const after = await getSwing(coachApi, swingId);
    const topAfter = after.events.find((e) => e.name === 'top')!;
    expect(topAfter.source).toBe('manual');
    expect(topAfter.timeS).toBeCloseTo(expectedTop, 3);
    expect(topAfter.autoTimeS).toBeCloseTo(eventTime(before, 'top'), 3); // the automatic value is kept
    // the other events did not move
    for (const name of ['address', 'transition', 'impact', 'finish']) expect(eventTime(after, name)).toBe(eventTime(before, name));
    expect(after.corrections[0]).toMatchObject({ event: 'top', byName: 'Maren Solberg' }); // coach@ in db/demo/scenario.ts
  });

  it('coach: adds a shared note at the cursor and a club label', async () => {
    await coachPage.getByLabel('New note').fill(NOTE);
    await coachPage.getByLabel('Visible to').selectOption('shared');
    await coachPage.getByRole('button', { name: 'Add note' }).click();
    await coachPage.locator('[data-testid="annotation-body"]', { hasText: NOTE }).waitFor();

    await coachPage.getByLabel('Club').selectOption('iron-7');
    await coachPage.getByRole('button', { name: 'Save labels' }).click();
    await coachPage.getByTestId('labels-saved').waitFor();

    const after = await getSwing(coachApi, swingId);
    expect(after.labels.club).toBe('iron-7');
    expect(after.annotations).toHaveLength(1);
    expect(after.annotations[0]).toMatchObject({ body: NOTE, visibility: 'shared', phase: null });
    // pinned to the cursor, which sits on the top marker after the drag
    expect(after.annotations[0].timeS).toBeCloseTo(eventTime(after, 'top'), 2);
    await coachPage.screenshot({ path: screenshotPath('e2e-swing-viewer-coach'), fullPage: true });
  });

  it('student: sees the traces and the shared note read-only, with no edit controls', async () => {
    await studentPage.setViewportSize({ width: 1280, height: 800 });
    await signIn(studentPage, DEMO.student, `/swings/${swingId}`);
    await viewerReady(studentPage);
    expect(await studentPage.getByTestId('swing-workbench').getAttribute('data-can-edit')).toBe('false');
    await studentPage.locator('[data-testid="annotation-body"]', { hasText: NOTE }).waitFor();
    for (const testId of ['event-edit-bar', 'labels-form', 'annotation-form']) await expect(studentPage.getByTestId(testId).count()).resolves.toBe(0);
    for (const name of ['Save corrections', 'Reset to automatic', 'Add note', 'Save labels', 'Delete', 'Share']) {
      await expect(studentPage.getByRole('button', { name, exact: true }).count()).resolves.toBe(0);
    }
    expect(await studentPage.locator('[data-undo]').count()).toBe(0);
    expect(await studentPage.locator('[data-drag-event]').count()).toBe(0); // markers cannot be grabbed
    // the markers stay readable sliders for screen readers, marked read-only
    const markers = studentPage.locator('[data-chart="swing-lead-share"] [data-event-marker]');
    await expect(markers.count()).resolves.toBe(5);
    expect(await markers.evaluateAll((els) => els.every((e) => e.getAttribute('aria-readonly') === 'true'))).toBe(true);
    // the corrected top is shown at its corrected time (marked), the phases in plain words, and the cautions
    expect(await studentPage.locator('[data-chart="swing-lead-share"] [data-event-marker="top"]').getAttribute('data-corrected')).toBe('true');
    await studentPage.getByTestId('phase-explainer').waitFor();
    expect((await studentPage.locator('main').textContent()) ?? '').toContain('Coaching information, not a medical assessment');
    await studentPage.screenshot({ path: screenshotPath('e2e-swing-viewer-student'), fullPage: true });
  });

  it('student: a direct PATCH or note from their own browser session is refused with 403', async () => {
    const statuses = await studentPage.evaluate(async (id) => {
      const send = (url: string, method: string, body: unknown) =>
        fetch(url, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) }).then((r) => r.status);
      return [
        await send(`/api/swings/${id}`, 'PATCH', { labels: { club: 'driver' } }),
        await send(`/api/swings/${id}`, 'PATCH', { resetEvents: 'all' }),
        await send(`/api/swings/${id}/annotations`, 'POST', { body: 'mine', visibility: 'shared' }),
      ];
    }, swingId);
    expect(statuses).toEqual([403, 403, 403]);
    const after = await getSwing(coachApi, swingId);
    expect(after.labels.club).toBe('iron-7');
    expect(after.events.find((e) => e.name === 'top')!.source).toBe('manual');
  });

  it('the lesson summary lists the swings and the shared note, with the chosen traces drawn', async () => {
    await studentPage.goto(`${baseUrl}/sessions/${session.id}/summary?swings=${swingId}`);
    await studentPage.getByTestId('summary-table').waitFor();
    expect(await studentPage.locator(`[data-summary-traces="${swingId}"] svg`).count()).toBeGreaterThanOrEqual(3); // two time charts and the stance path
    expect(await studentPage.getByTestId('summary-shared-notes').textContent()).toContain(NOTE);
    expect(await studentPage.getByTestId('session-notes').textContent()).toBe(session.notes);
    const row = studentPage.locator('[data-testid="summary-row"]', { has: studentPage.locator(`a[href="/swings/${swingId}"]`) });
    expect(await row.locator('td:nth-child(3)').textContent()).toBe('7-iron');
    await studentPage.screenshot({ path: screenshotPath('e2e-lesson-summary'), fullPage: true });
  });

  it('coach: a keyboard nudge is undone before saving, and reset restores the automatic top', async () => {
    await coachPage.goto(`${baseUrl}/swings/${swingId}`);
    await viewerReady(coachPage);
    const marker = coachPage.locator('[data-chart="swing-lead-share"] [data-event-marker="top"]');
    await marker.focus();
    await coachPage.keyboard.press('ArrowLeft'); // one sample (10 ms at 100 Hz) per press
    await coachPage.keyboard.press('ArrowLeft');
    const current = eventTime(await getSwing(coachApi, swingId), 'top');
    const unsaved = coachPage.getByTestId('unsaved-moves');
    await unsaved.waitFor();
    expect(await unsaved.textContent()).toBe(`Unsaved: Top → ${(current - 0.02 - eventTime(before, 'address')).toFixed(2)} s`);
    await coachPage.locator('[data-undo]').click();
    await coachPage.locator('[data-undo]').click();
    await expect(unsaved.count()).resolves.toBe(0);

    await coachPage.getByRole('button', { name: 'Reset to automatic' }).click();
    await coachPage.locator('[data-testid="event-edit-bar"]', { hasText: 'Events as detected' }).waitFor();
    await expect(coachPage.getByTestId('corrected-mark').count()).resolves.toBe(0);
    const after = await getSwing(coachApi, swingId);
    const top = after.events.find((e) => e.name === 'top')!;
    expect(top.source).toBe('auto');
    expect(top.timeS).toBeCloseTo(eventTime(before, 'top'), 3); // the automatic value, kept through the correction
    expect(await marker.getAttribute('data-corrected')).toBeNull();
  });
  it('coach at 1024x768: sends the swing to the student, edits the note, removes it and undoes; the student sees it', async () => {
    await coachPage.setViewportSize({ width: 1024, height: 768 });
    await coachPage.goto(`${baseUrl}/swings/${swingId}`);
    await viewerReady(coachPage);
    const control = coachPage.getByTestId('share-with-student');
    await control.locator('summary').click();
    const sent = control.getByTestId('sent-shares');
    await sent.getByText(/Nothing sent to|Sent to the student/).first().waitFor();
    const sharesBefore = await sent.locator('li[data-share-id]').count();
    await control.locator('#share-note').fill('Watch the lead heel at the top.');
    await control.getByRole('button', { name: 'Send', exact: true }).click();
    await expect.poll(() => sent.locator('li[data-share-id]').count(), { timeout: 15_000 }).toBe(sharesBefore + 1);
    const item = sent.locator('li[data-share-id]').first(); // newest first
    await item.getByText('Watch the lead heel at the top.').waitFor();

    await item.getByRole('button', { name: /^Edit the note/ }).click();
    const field = item.getByRole('textbox');
    await field.fill('Watch the lead heel from the top to impact.');
    await coachPage.screenshot({ path: screenshotPath('e2e-share-edit-1024'), fullPage: false });
    await item.getByRole('button', { name: 'Save note' }).click();
    await item.getByText('Watch the lead heel from the top to impact.').waitFor();

    await item.getByRole('button', { name: /^Remove the swing/ }).click();
    await item.getByRole('alertdialog').getByRole('button', { name: 'Remove', exact: true }).click();
    await expect.poll(() => sent.locator('li[data-share-id]').count(), { timeout: 15_000 }).toBe(sharesBefore);
    await sent.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => sent.locator('li[data-share-id]').count(), { timeout: 15_000 }).toBe(sharesBefore + 1);
    await coachPage.screenshot({ path: screenshotPath('e2e-share-sent-1024'), fullPage: false });
    await coachPage.setViewportSize({ width: 1280, height: 800 });

    await studentPage.goto(`${baseUrl}/`);
    const list = studentPage.getByTestId('shared-with-me');
    await list.getByText('Watch the lead heel from the top to impact.').waitFor({ timeout: 15_000 });
  });
  it('coach: deletes the shared note after a confirmation and undoes it: the same note comes back', async () => {
    await coachPage.goto(`${baseUrl}/swings/${swingId}`);
    await viewerReady(coachPage);
    const before = (await getSwing(coachApi, swingId)).annotations.find((a) => a.body === NOTE)!;
    const item = coachPage.getByTestId('annotation').filter({ hasText: NOTE });
    await item.getByRole('button', { name: /^Delete the note/ }).click();
    await item.getByRole('alertdialog').getByRole('button', { name: 'Delete note' }).click();
    await expect.poll(() => coachPage.getByTestId('annotation').filter({ hasText: NOTE }).count(), { timeout: 15_000 }).toBe(0);
    expect((await getSwing(coachApi, swingId)).annotations.some((a) => a.body === NOTE)).toBe(false);
    await coachPage.getByTestId('undo-line').getByRole('button', { name: 'Undo' }).click();
    await coachPage.getByTestId('annotation').filter({ hasText: NOTE }).waitFor({ timeout: 15_000 });
    const after = (await getSwing(coachApi, swingId)).annotations.find((a) => a.body === NOTE)!;
    expect(after).toEqual(before); // the same note, id, pin, visibility and times
  });
});
