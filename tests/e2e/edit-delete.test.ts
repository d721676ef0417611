import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { signedIn, type HttpSession } from '../http/support/http-session';
import { launchBrowser, screenshotFailure, screenshotPath, signInAt, type Browser } from './support/browser';

// Edit and delete in chromium, as a coach would: a drill is edited in place, deleted (asked first) and brought back
// with Undo; a player is archived (asked first), leaves the roster, and comes back from the roster's archived list.
// The drill and the player are made for this file, so the demo data stays as seeded.

let browser: Browser;
let page: Page;
let baseUrl: string;
let coachApi: HttpSession;
const stamp = Date.now().toString(36);
const drillName = `Pause at the top ${stamp}`;
const playerName = `Winter Player ${stamp}`;
let playerId: number;

const json = (body: unknown) => ({ method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  coachApi = await signedIn(baseUrl, DEMO.coach, DEMO_PASSWORD);
  const drill = await coachApi.json('/api/drills', json({ name: drillName, steps: ['Swing to the top at half speed.', 'Hold one second, then swing through.'], addressesChecks: [], cautions: 'Stop on any back or neck pain.' }));
  expect(drill.status).toBe(201);
  const player = await coachApi.json('/api/athletes', json({ displayName: playerName, handedness: 'left', stanceWidthMm: 400, dateOfBirth: null, homeClub: null }));
  expect(player.status).toBe(201);
  playerId = (player.body as { athlete: { id: number } }).athlete.id;
  browser = await launchBrowser(env.CHROMIUM_PATH);
  page = await browser.context.newPage();
  await page.setViewportSize({ width: 1280, height: 800 });
  await signInAt(page, baseUrl, DEMO.coach, DEMO_PASSWORD, '/drills');
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('e2e-edit-delete', task.name, [['coach', page]]);
});

afterAll(async () => {
  await browser?.close();
});

describe('edit and delete in the browser', () => {
  it('edits a drill in place, deletes it after a confirmation and undoes the delete', async () => {
    const card = page.locator(`article[data-drill="${drillName}"]`);
    await card.waitFor();
    await page.getByRole('button', { name: `Edit ${drillName}` }).click();
    const editor = page.getByRole('article', { name: `Edit ${drillName}` });
    await editor.getByLabel('Steps').fill('Swing to the top at half speed.\nHold two seconds, then swing through.');
    await editor.getByRole('button', { name: 'Save changes' }).click();
    await card.getByText('Hold two seconds, then swing through.').waitFor();

    await page.getByRole('button', { name: `Delete ${drillName}` }).click();
    const ask = page.getByRole('alertdialog');
    await ask.getByText('It goes to the bin').waitFor();
    await page.screenshot({ path: screenshotPath('e2e-drill-delete-confirm-1280x800') });
    await ask.getByRole('button', { name: 'Move to bin' }).click();
    await page.getByTestId('undo-line').getByText(`“${drillName}” moved to the bin`).waitFor();
    expect(await card.count()).toBe(0);
    await page.getByTestId('undo-line').getByRole('button', { name: 'Undo' }).click();
    await card.waitFor();
    expect(await page.getByTestId('undo-line').count()).toBe(0);
  });

  it('archives a player after a confirmation; they leave the roster and come back from the archived list', async () => {
    await page.goto(`${baseUrl}/athletes/${playerId}`);
    await page.getByRole('button', { name: 'Archive player…' }).click();
    await page.getByRole('alertdialog').getByText('every session, swing, note and drill is kept').waitFor();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Archive', exact: true }).click();
    await page.waitForURL(`${baseUrl}/roster?archived=${playerId}`);
    await page.getByTestId('undo-line').getByText(`${playerName} archived: off the roster, everything kept.`).waitFor();
    expect(await page.getByTestId('athlete-table').getByText(playerName).count()).toBe(0);
    await page.setViewportSize({ width: 1024, height: 768 });
    await page.screenshot({ path: screenshotPath('e2e-roster-archived-1024x768') });
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.getByRole('button', { name: `Bring ${playerName} back to the roster` }).click();
    // back in the roster's table, and gone from the archived list
    await page.getByTestId('athlete-table').getByText(playerName).waitFor();
    expect(await page.getByTestId('archived-players').count()).toBe(0);
    const roster = (await coachApi.json('/api/athletes')).body as { athletes: { id: number }[] };
    expect(roster.athletes.map((a) => a.id)).toContain(playerId);
  });
});
