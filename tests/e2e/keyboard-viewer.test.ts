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
import { launchBrowser, screenshotFailure, screenshotPath, type Browser } from './support/browser';

// The coach's viewer work with the keyboard alone: sign in, reach the top marker with Tab, move it two samples with
// the arrow keys, Tab to "Save corrections" and press Enter, Tab to the note box, type, Tab to "Add note" and press
// Enter. No clicks, no element.focus(): the page is only read (where the focus is) between key presses. At every
// focus stop on the way the focused element must show a visible focus indicator (WCAG 2.1 SC 2.4.7).
// Expected times are the API's own (GET /api/swings/:id) plus two samples: 2 x 10 ms at 100 Hz (one sample per arrow
// press, components/charts/time-series-chart.tsx). The swing comes from an invented lesson of the project's generator.

const athlete = DEMO_ATHLETES.find((a) => a.id === 1)!; // Ada Fenwick, coach@'s student (db/demo/scenario.ts)
const session = DEMO_SESSIONS.find((s) => s.athleteId === athlete.id)!;
const NOTE = 'Keyboard only: feel the lead heel load before the arms start down.';
const SAMPLE_S = 0.01;

let browser: Browser;
let page: Page;
let baseUrl: string;
let db: Knex;
let coachApi: HttpSession;
let swing: SwingView;
let direction: 1 | -1;
const unseenFocus: string[] = [];
let focusStops = 0;

const getSwing = async (id: number) => swingViewResponseSchema.parse((await coachApi.json(`/api/swings/${id}`)).body).swing;
const eventTime = (s: SwingView, name: string) => s.events.find((e) => e.name === name)!.timeS;

/**
 * Describes the focused element and whether it shows a focus indicator once its transitions have ended: an outline
 * of at least 1 px whose colour has 3:1 contrast with the background behind it (WCAG 2.1 SC 1.4.11, relative
 * luminance as defined in WCAG 2.1), or, for the chart markers (SVG groups), their line drawn 3 px wide.
 */
const focusState = (p: Page) =>
  p.evaluate(async () => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return { none: true, visible: true, what: 'body' };
    await Promise.all(el.getAnimations().map((a) => a.finished.catch(() => undefined)));
    const rgba = (c: string) => (c.match(/[\d.]+/g) ?? []).map(Number);
    const lum = (c: string) => {
      const [r, g, b] = rgba(c).map((v) => v / 255).map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
      return 0.2126 * r + 0.7152 * g + 0.0722 * b;
    };
    let bg = 'rgb(255, 255, 255)';
    for (let a: Element | null = el.parentElement; a; a = a.parentElement) {
      const c = getComputedStyle(a).backgroundColor;
      const parts = rgba(c);
      if (parts.length === 3 || (parts.length === 4 && parts[3] === 1)) {
        bg = c;
        break;
      }
    }
    const cs = getComputedStyle(el);
    const [l1, l2] = [lum(cs.outlineColor), lum(bg)].sort((a, b) => b - a);
    const outline = cs.outlineStyle !== 'none' && parseFloat(cs.outlineWidth) >= 1 && (l1 + 0.05) / (l2 + 0.05) >= 3;
    const line = el.querySelector(':scope > line');
    const marker = line !== null && parseFloat(getComputedStyle(line).strokeWidth) >= 3;
    const name = el.getAttribute('aria-label') ?? el.textContent?.trim().slice(0, 40) ?? '';
    return { none: false, visible: outline || marker, what: `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''} "${name}" outline ${cs.outlineStyle} ${cs.outlineColor} on ${bg}` };
  });

/**
 * Presses Tab (or Shift+Tab when the target comes earlier in the document) until `selector` has the focus,
 * checking the focus indicator at every stop.
 */
async function tabTo(selector: string, max = 120): Promise<void> {
  for (let k = 0; k < max; k++) {
    const where = await page.evaluate((sel) => {
      const target = document.querySelector(sel);
      if (!target) return 'missing';
      const active = document.activeElement;
      if (active === target) return 'here';
      if (!active || active === document.body) return 'after';
      return active.compareDocumentPosition(target) & Node.DOCUMENT_POSITION_FOLLOWING ? 'after' : 'before';
    }, selector);
    if (where === 'here') return;
    if (where === 'missing') throw new Error(`no element matches ${selector}`);
    await page.keyboard.press(where === 'after' ? 'Tab' : 'Shift+Tab');
    const state = await focusState(page);
    if (!state.none) focusStops++;
    if (!state.none && !state.visible) unseenFocus.push(state.what);
  }
  throw new Error(`Tab did not reach ${selector} in ${max} presses`);
}

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  db = serverDb();
  await seedDemo(db);
  coachApi = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  const csv = generateSession({ seed: 52, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm, swings: 2, withMarker: false, distractors: ['walk'] }).csv();
  const res = await upload(coachApi, { athleteId: athlete.id, sessionId: session.id, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm }, [{ name: 'keyboard-lesson.csv', content: csv }]);
  expect(res.status).toBe(202);
  const done = await settled(coachApi, res.body.recordings[0].id);
  expect(done.status).toBe('ready');
  const ids = (done.swings as { id: number; stale: boolean }[]).filter((s) => !s.stale).map((s) => s.id);
  expect(ids.length).toBeGreaterThan(0);
  swing = await getSwing(ids[0]);
  // two samples later when the transition leaves room, else two earlier
  direction = eventTime(swing, 'transition') - eventTime(swing, 'top') > 3 * SAMPLE_S ? 1 : -1;
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('e2e-keyboard-viewer', task.name, [['coach', page]]);
});

afterAll(async () => {
  await browser?.close();
  if (db) {
    await seedDemo(db); // the next test files expect the plain demo scenario
    await db.destroy();
  }
});

describe('the swing viewer from the keyboard alone', () => {
  it('signs in with the keyboard', async () => {
    await page.goto(`${baseUrl}/swings/${swing.id}`);
    await page.waitForURL(/\/sign-in/);
    await tabTo('input[name="email"], #email');
    await page.keyboard.type(DEMO.coach);
    await tabTo('input[type="password"]');
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press('Enter');
    await page.waitForURL(`${baseUrl}/swings/${swing.id}`);
    await page.locator('[data-testid="swing-workbench"][data-can-edit="true"] [data-swing-viewer]').waitFor({ timeout: 30_000 });
  });

  it('moves the top two samples with the arrow keys and saves with Enter', async () => {
    const marker = '[data-chart="swing-lead-share"] [data-event-marker="top"]';
    await tabTo(marker);
    expect(await page.locator(marker).getAttribute('aria-label')).toBe('Top marker');
    expect((await focusState(page)).visible).toBe(true);
    const key = direction === 1 ? 'ArrowRight' : 'ArrowLeft';
    await page.keyboard.press(key);
    await page.keyboard.press(key);
    const expectedTop = Math.round((eventTime(swing, 'top') + direction * 2 * SAMPLE_S) * 1000) / 1000;
    const unsaved = page.getByTestId('unsaved-moves');
    await unsaved.waitFor();
    expect(await unsaved.textContent()).toBe(`Unsaved: Top → ${(expectedTop - eventTime(swing, 'address')).toFixed(2)} s`);

    await tabTo('[data-testid="event-edit-bar"] button:nth-of-type(2)'); // "Save corrections"
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Save corrections');
    await page.keyboard.press('Enter');
    await page.locator('[data-testid="corrected-mark"] [data-corrected-event="top"]').waitFor();

    const after = await getSwing(swing.id);
    const top = after.events.find((e) => e.name === 'top')!;
    expect(top.source).toBe('manual');
    expect(top.timeS).toBeCloseTo(expectedTop, 3);
    expect(top.autoTimeS).toBeCloseTo(eventTime(swing, 'top'), 3);
  });

  it('adds a note with Tab, typing and Enter', async () => {
    await tabTo('#annotation-body');
    await page.keyboard.type(NOTE);
    await tabTo('[data-testid="annotation-form"] button[type="submit"]');
    await page.keyboard.press('Enter');
    await page.locator('[data-testid="annotation-body"]', { hasText: NOTE }).waitFor();
    const after = await getSwing(swing.id);
    expect(after.annotations.map((a) => a.body)).toContain(NOTE);
    await page.screenshot({ path: screenshotPath('e2e-keyboard-viewer'), fullPage: true });
  });

  it('every focus stop on the way showed a visible focus indicator', () => {
    expect(focusStops).toBeGreaterThan(10); // the walk passed header links, viewer controls, buttons and fields
    expect(unseenFocus).toEqual([]);
  });
});
