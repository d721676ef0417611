import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

// axe-core (the npm package) run inside the page, WCAG 2.0 and 2.1 level A and AA rules only.
//
// How it gets into the page: `page.evaluate(source)` runs the library through the DevTools protocol
// (Runtime.evaluate), which the page's Content-Security-Policy does not govern, so it works with the static
// 'unsafe-inline' policy of next.config.ts and with per-request nonces alike. No <script> tag is added and the
// browser context needs no `bypassCSP`, so the page under test keeps its real headers.

const require = createRequire(import.meta.url);
const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

export const WCAG_AA_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] as const;

export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string; summary: string }[];
}

/** Runs axe on the whole document as it is now and returns the violations (empty when clean). */
export async function axeViolations(page: Page): Promise<AxeViolation[]> {
  const loaded = await page.evaluate(() => typeof (window as unknown as { axe?: unknown }).axe === 'object');
  if (!loaded) await page.evaluate(axeSource);
  return page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<any> } }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    return (result.violations as any[]).map((v) => ({
      id: v.id as string,
      impact: (v.impact ?? null) as string | null,
      help: v.help as string,
      nodes: (v.nodes as any[]).map((n) => ({ target: (n.target as unknown[]).join(' '), summary: String(n.failureSummary ?? '').replace(/\s+/g, ' ').slice(0, 300) })),
    }));
  }, [...WCAG_AA_TAGS]);
}

/** One line per violated node, for a readable assertion message. */
export function describeViolations(violations: AxeViolation[]): string {
  return violations.flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}): ${n.target} — ${n.summary}`)).join('\n');
}
