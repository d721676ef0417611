import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

// Debian's chromium, never a downloaded browser. The background-networking flags stop it from trying to reach
// update and sync services on this offline machine.
const chromiumArgs = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

export type Browser = { context: BrowserContext; close: () => Promise<void> };

export async function launchBrowser(executablePath: string): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'stanceline-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath,
    headless: true,
    args: chromiumArgs,
    viewport: { width: 1280, height: 860 },
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export const artifactsDir = join(process.cwd(), 'artifacts');

export function screenshotPath(name: string): string {
  mkdirSync(artifactsDir, { recursive: true });
  return join(artifactsDir, `${name}.png`);
}

/** Opens `path` signed out, signs in on the page it redirects to, and waits until it lands back on `path`. */
export async function signInAt(page: Page, baseUrl: string, email: string, password: string, path: string): Promise<void> {
  await page.goto(`${baseUrl}${path}`);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${baseUrl}${path}`);
}

/**
 * A screenshot to look at (artifacts/, never compared): the whole page, or the window when the whole page cannot be
 * taken in 15 s. Chromium's full-page capture of the swing viewer at 1024 px with a table open sometimes never
 * finished (30 s timeouts in two full runs out of five, never when the file ran alone); a picture to look at must
 * not decide a test whose assertions are elsewhere.
 */
export async function lookScreenshot(page: Page, path: string): Promise<void> {
  try {
    await page.screenshot({ path, fullPage: true, timeout: 15_000 });
  } catch (error) {
    if (!(error instanceof Error && error.name === 'TimeoutError')) throw error;
    console.warn(`[e2e] full-page screenshot timed out, taking the window only: ${path}`);
    await page.screenshot({ path, fullPage: false, timeout: 15_000 });
  }
}

/** After a failed test, a full-page screenshot of each named page: artifacts/<prefix>-failed-<who>-<test>.png. */
export async function screenshotFailure(prefix: string, testName: string, pages: readonly (readonly [string, Page | undefined])[]): Promise<void> {
  for (const [who, page] of pages) {
    if (page) await lookScreenshot(page, screenshotPath(`${prefix}-failed-${who}-${testName.replace(/\W+/g, '-').slice(0, 50)}`));
  }
}
