import { readdirSync, writeFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import type { Knex } from 'knex';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';
import { DEMO_ATHLETES, DEMO_SESSIONS } from '@/db/demo/scenario';
import { generateSession } from '@/lib/signal/synthetic';
import { bandsResponseSchema } from '@/lib/contracts/bands';
import { drillsResponseSchema } from '@/lib/contracts/drills';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { serverDb, settled, upload } from '../http/support/recordings-http';
import { A11Y_CHECKS, type A11yFixture, type A11yRole } from './support/a11y-pages';
import { axeViolations, describeViolations } from './support/axe';
import { launchBrowser, lookScreenshot, screenshotFailure, screenshotPath, type Browser } from './support/browser';

// WCAG 2.0/2.1 level A and AA (axe-core's wcag2a, wcag2aa, wcag21a, wcag21aa rules) on every page of every role
// and on the states reached by acting, from the one list in tests/e2e/support/a11y-pages.ts, at 1280x800 and again
// at 1024x768. Zero violations allowed. The swings come from an invented lesson of the project's generator uploaded through POST /api/recordings;
// a band is built from three of them and a demo drill is assigned, so the pages show real content, not empty states.

const athlete = DEMO_ATHLETES.find((a) => a.id === 1)!; // coach@'s student, account student@ (db/demo/scenario.ts)
const session = DEMO_SESSIONS.find((s) => s.athleteId === athlete.id)!;
const accounts: Record<Exclude<A11yRole, 'signed-out'>, string> = { coach: DEMO.coach, student: DEMO.student, admin: DEMO.admin, researcher: DEMO.researcher };

let baseUrl: string;
let db: Knex;
let fixture: A11yFixture;
const browsers = new Map<A11yRole, { browser: Browser; page: Page }>();
let current: Page | undefined;

/** app/**\/page.tsx as routes: route groups dropped, '/' for the root. */
function appRoutes(dir = join(process.cwd(), 'app')): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = join(dir, entry.name);
    if (entry.isDirectory() && entry.name !== 'api') out.push(...appRoutes(full));
    else if (entry.name === 'page.tsx') {
      const parts = relative(join(process.cwd(), 'app'), dir).split(sep).filter((p) => p && !/^\(.*\)$/.test(p));
      out.push(`/${parts.join('/')}`);
    }
  }
  return out;
}

async function pageFor(role: A11yRole): Promise<Page> {
  const known = browsers.get(role);
  if (known) return known.page;
  const browser = await launchBrowser(e2eEnv().CHROMIUM_PATH);
  const page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
  if (role !== 'signed-out') {
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('Email').fill(accounts[role]);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/`);
  }
  browsers.set(role, { browser, page });
  return page;
}

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  db = serverDb();
  await seedDemo(db);
  const coachApi: HttpSession = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  const csv = generateSession({ seed: 77, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm, swings: 5, withMarker: false, distractors: ['walk'] }).csv();
  const res = await upload(coachApi, { athleteId: athlete.id, sessionId: session.id, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm }, [{ name: 'a11y-lesson.csv', content: csv }]);
  expect(res.status).toBe(202);
  const done = await settled(coachApi, res.body.recordings[0].id);
  expect(done.status).toBe('ready');
  const swingIds = (done.swings as { id: number; stale: boolean }[]).filter((s) => !s.stale).map((s) => s.id);
  expect(swingIds.length).toBeGreaterThanOrEqual(4);
  // a file that fails processing, so the session page shows a failed recording with its error too
  const bad = await upload(coachApi, { athleteId: athlete.id, sessionId: session.id, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm }, [{ name: 'a11y-garbled.csv', content: csv.replace(/\n([^\n]*)\n/, '\n$1,extra-cell\n') }]);
  expect(bad.status).toBe(202);
  expect((await settled(coachApi, bad.body.recordings[0].id)).status).toBe('failed');
  const built = await coachApi.json('/api/bands', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Accessibility check band', swingIds: swingIds.slice(0, 3) }) });
  expect(built.status).toBe(201);
  const band = bandsResponseSchema.parse((await coachApi.json('/api/bands')).body).bands.find((b) => b.name === 'Accessibility check band')!;
  const drill = drillsResponseSchema.parse((await coachApi.json('/api/drills')).body).drills[0];
  const assigned = await coachApi.json(`/api/athletes/${athlete.id}/drill-assignments`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ drillId: drill.id, dueDate: '2030-01-15' }) });
  expect(assigned.status).toBe(201);
  // a club on the viewed swing, so a target applies and the score panel shows pass and miss
  const labelled = await coachApi.json(`/api/swings/${swingIds[3]}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ labels: { club: 'iron-7' } }) });
  expect(labelled.status).toBe(200);
  // a paid remote review of this lesson (the student asks, pays on the payments fake's page)
  const studentApi: HttpSession = await signedIn(baseUrl, DEMO.student, DEMO_PASSWORD);
  const asked = await studentApi.json('/api/reviews', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ recordingId: done.id, question: 'Accessibility check request' }) });
  expect(asked.status).toBe(201);
  const { id: reviewId, checkoutUrl } = asked.body as { id: number; checkoutUrl: string };
  expect((await fetch(checkoutUrl, { method: 'POST', redirect: 'manual' })).status).toBe(303);
  fixture = { athleteId: athlete.id, sessionId: session.id, swingIds, bandId: band.id, reviewId };
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('e2e-a11y', task.name, [['page', current]]);
});

afterAll(async () => {
  for (const { browser } of browsers.values()) await browser.close();
  if (db) {
    await seedDemo(db); // the next test files expect the plain demo scenario
    await db.destroy();
  }
});

describe('accessibility: WCAG 2 A/AA with axe-core, zero violations', () => {
  it('the page list covers every page under app/', () => {
    const covered = new Set(A11Y_CHECKS.map((c) => c.route));
    const missing = appRoutes().filter((r) => !covered.has(r));
    expect(missing, 'add these routes to tests/e2e/support/a11y-pages.ts').toEqual([]);
    expect(new Set(A11Y_CHECKS.map((c) => c.name)).size).toBe(A11Y_CHECKS.length);
    for (const role of ['coach', 'student', 'admin', 'researcher', 'signed-out'] as const) expect(A11Y_CHECKS.some((c) => c.as === role)).toBe(true);
  });

  it('pass and miss are said in words beside their colour (WCAG 2.1 SC 1.4.1)', async () => {
    const page = await pageFor('coach');
    current = page;
    await page.goto(`${baseUrl}/swings/${fixture.swingIds[3]}`);
    const rows = page.locator('[data-testid="score-panel"] [data-check][data-pass]');
    await rows.first().waitFor({ timeout: 30_000 });
    const results = await rows.evaluateAll((trs) => trs.map((tr) => ({ pass: tr.getAttribute('data-pass'), text: tr.lastElementChild?.textContent?.trim() ?? '' })));
    expect(results.length).toBeGreaterThan(0);
    for (const r of results) {
      if (r.pass === 'true') expect(r.text).toMatch(/^✓ pass$/);
      else if (r.pass === 'false') expect(r.text).toMatch(/^✗ (miss by .+ (high|low)|outside range)$/);
      else expect(r.text).toMatch(/not measured|—/);
    }
  });

  it('prefers-reduced-motion: nothing on the viewer animates or transitions', async () => {
    const page = await pageFor('coach');
    current = page;
    // every element's longest transition or animation, s (computed durations are lists like "0.15s, 0s")
    const longest = () =>
      page.evaluate(() => {
        const secs = (v: string) => Math.max(0, ...v.split(',').map((d) => (d.trim().endsWith('ms') ? parseFloat(d) / 1000 : parseFloat(d)) || 0));
        let max = 0;
        for (const el of document.querySelectorAll('*')) {
          const cs = getComputedStyle(el);
          max = Math.max(max, secs(cs.transitionDuration), cs.animationName === 'none' ? 0 : secs(cs.animationDuration));
        }
        return max;
      });
    await page.goto(`${baseUrl}/swings/${fixture.swingIds[3]}`);
    await page.locator('[data-testid="swing-workbench"] [data-swing-viewer]').waitFor({ timeout: 30_000 });
    await page.emulateMedia({ reducedMotion: 'no-preference' });
    expect(await longest()).toBeGreaterThan(0.05); // the page does use transitions (buttons fade their colours)
    await page.emulateMedia({ reducedMotion: 'reduce' });
    expect(await longest()).toBeLessThanOrEqual(0.001);
    await page.emulateMedia({ reducedMotion: null });
  });

  for (const check of A11Y_CHECKS) {
    it(`${check.as}: ${check.name}`, async () => {
      const page = await pageFor(check.as);
      current = page;
      const url = `${baseUrl}${check.path(fixture)}`;
      await page.goto(url);
      await page.waitForLoadState('networkidle');
      expect(new URL(page.url()).pathname, 'the page did not redirect elsewhere').toBe(new URL(url).pathname);
      await check.ready?.(page);
      await check.act?.(page, fixture);
      await page.waitForLoadState('networkidle');
      const violations = await axeViolations(page);
      const slug = `e2e-a11y-${check.as}-${check.name.replace(/\W+/g, '-')}`;
      if (violations.length) writeFileSync(screenshotPath(slug).replace(/\.png$/, '.json'), JSON.stringify(violations, null, 2));
      expect(violations, describeViolations(violations)).toEqual([]);
      // for a look at the colours and layout at the two common laptop sizes (artifacts/, not compared)
      await lookScreenshot(page, screenshotPath(`${slug}-1280x800`));
      // the narrower window again, where tables may start to scroll and charts redraw narrower
      await page.setViewportSize({ width: 1024, height: 768 });
      await page.waitForLoadState('networkidle');
      const narrow = await axeViolations(page);
      if (narrow.length) writeFileSync(screenshotPath(`${slug}-1024x768`).replace(/\.png$/, '.json'), JSON.stringify(narrow, null, 2));
      await lookScreenshot(page, screenshotPath(`${slug}-1024x768`));
      await page.setViewportSize({ width: 1280, height: 800 });
      expect(narrow, `at 1024x768:\n${describeViolations(narrow)}`).toEqual([]);
    });
  }
});
