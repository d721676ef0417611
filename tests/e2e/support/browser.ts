import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

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
