import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from '../http/support/env';
import { launchBrowser, screenshotFailure, type Browser } from './support/browser';

// In chromium: no open redirect after sign-in, and the nonce-based CSP leaves the app working (it hydrates: the
// sign-in form submits through client JS, the swing viewer draws) with no CSP violation reported.

let browser: Browser;
let page: Page | undefined;
let baseUrl: string;
const violations: string[] = [];

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  browser = await launchBrowser(env.CHROMIUM_PATH);
});

afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await screenshotFailure('hardening', task.name, [['page', page]]);
  await page?.close();
  page = undefined;
});

afterAll(async () => {
  await browser?.close();
});

async function freshPage(): Promise<Page> {
  await browser.context.clearCookies();
  const p = await browser.context.newPage();
  p.on('console', (m) => {
    if (/Content Security Policy|Refused to (execute|load|apply)/i.test(m.text())) violations.push(m.text());
  });
  await p.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => console.error(`Content Security Policy violation: ${e.violatedDirective} ${e.blockedURI}`));
  });
  page = p;
  return p;
}

async function signInFrom(p: Page, url: string): Promise<void> {
  await p.goto(url);
  await p.getByLabel('Email').fill(DEMO.coach);
  await p.getByLabel('Password').fill(DEMO_PASSWORD);
  await p.getByRole('button', { name: 'Sign in' }).click();
  await p.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 30_000 });
}

describe('open redirect after sign-in', () => {
  for (const callback of ['/%5Cevil.example/x', '/%09/evil.example/x', '/\\/evil.example/x', '//evil.example/x']) {
    it(`callbackUrl=${callback} lands on this site`, async () => {
      const p = await freshPage();
      await signInFrom(p, `${baseUrl}/sign-in?callbackUrl=${callback}`);
      expect(new URL(p.url()).origin).toBe(baseUrl);
    });
  }

  it('a same-site callback is still honoured', async () => {
    const p = await freshPage();
    await signInFrom(p, `${baseUrl}/sign-in?callbackUrl=%2Froster`);
    expect(p.url()).toBe(`${baseUrl}/roster`);
  });
});

describe('CSP with nonces', () => {
  it('pages render and hydrate with no CSP violation', async () => {
    const p = await freshPage();
    const response = await p.goto(`${baseUrl}/sign-in`);
    const csp = response?.headers()['content-security-policy'] ?? '';
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
    expect(/script-src[^;]*'unsafe-inline'/.test(csp)).toBe(false);
    await signInFrom(p, `${baseUrl}/sign-in?callbackUrl=%2Froster`);
    await expect(p.getByTestId('viewer-name').textContent()).resolves.toBe('Maren Solberg');
    // client-side navigation works (the router is hydrated)
    await p.goto(`${baseUrl}/athletes/1`);
    await p.waitForLoadState('networkidle');
    expect(violations).toEqual([]);
  });
});
