// Browser benchmark of the swing page (npm run bench:viewer). Prints figures beside the targets; asserts nothing.
// It starts its own throwaway MariaDB and `next start` (building first when sources changed), uploads a generated
// lesson through POST /api/recordings, then opens one swing in Debian's chromium and reports:
// - LCP: the last 'largest-contentful-paint' entry (PerformanceObserver, buffered) before any input;
// - time to interactive (approximate): from navigation start to the first time the viewer's cursor readout answers
//   an ArrowRight key sent to the viewer;
// - frame time while scrubbing the whole visible swing with the keyboard: one ArrowRight per animation frame, the
//   requestAnimationFrame timestamps' deltas (median, p95), with chromium's frame-rate limit off so a frame lasts as
//   long as its work rather than the display's 16.7 ms; plus the main-thread time of each key's render.
import { chromium } from 'playwright-core';
import { DEMO_ATHLETES } from '../db/demo/scenario';
import { generateSession } from '../lib/signal/synthetic';
import { signedIn } from '../tests/http/support/http-session';
import { startThrowawayApp } from './lib/throwaway-app';

const TARGET = { lcpMs: 1000, p95FrameMs: 16 }; // from the issue
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const RUNS = 3;
const root = process.cwd();

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  if (s.length === 0) return NaN;
  const pos = (s.length - 1) * q; // linear interpolation between order statistics (numpy's default)
  const lo = Math.floor(pos);
  return s[lo] + (s[Math.min(lo + 1, s.length - 1)] - s[lo]) * (pos - lo);
};
const ms = (v: number) => `${v.toFixed(1)} ms`;

// The in-page parts are plain JavaScript strings: functions handed to the browser would carry the TypeScript
// loader's helpers, which do not exist there.

/** From navigation start: every LCP entry, and the first time the cursor readout answers an ArrowRight. React renders
 * a key's update in a microtask after the event, so the answer is seen by a MutationObserver. */
const INIT_SCRIPT = `
  window.__lcp = 0;
  window.__tti = null;
  new PerformanceObserver(function (list) {
    for (const e of list.getEntries()) window.__lcp = e.startTime;
  }).observe({ type: 'largest-contentful-paint', buffered: true });
  function probe() {
    const viewer = document.querySelector('[data-swing-viewer]');
    const readout = viewer && viewer.querySelector('[data-cursor-readout]');
    if (!viewer || !readout) return void setTimeout(probe, 5);
    const observer = new MutationObserver(function () {
      if (window.__tti !== null) return;
      window.__tti = performance.now();
      observer.disconnect();
      viewer.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowLeft', bubbles: true }));
    });
    observer.observe(readout, { subtree: true, childList: true, characterData: true });
    viewer.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    setTimeout(function () {
      if (window.__tti === null) { observer.disconnect(); probe(); }
    }, 20);
  }
  setTimeout(probe, 0);
`;

/** Scrub from the first to the last sample in view, one ArrowRight per animation frame; the rAF timestamps' deltas
 * and each key's render work (queued after React's own render microtask; offsetHeight adds style and layout). */
const SCRUB_SCRIPT = `new Promise(function (resolve) {
  const viewer = document.querySelector('[data-swing-viewer]');
  const scrubber = viewer.querySelector('[data-scrubber]');
  viewer.focus();
  viewer.dispatchEvent(new KeyboardEvent('keydown', { key: 'Home', bubbles: true }));
  const last = Number(scrubber.max);
  const deltas = [];
  const work = [];
  let prev = null;
  let steps = 0;
  function frame(ts) {
    if (prev !== null) deltas.push(ts - prev);
    prev = ts;
    if (Number(scrubber.value) >= last) return resolve({ deltas: deltas, work: work, steps: steps });
    const t0 = performance.now();
    viewer.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    queueMicrotask(function () { void viewer.offsetHeight; work.push(performance.now() - t0); });
    steps++;
    requestAnimationFrame(frame);
  }
  requestAnimationFrame(frame);
})`;

/** BENCH_BASE_URL measures an app already running (migrated and seeded) instead of starting its own. */
async function main(): Promise<void> {
  console.log(`# Stanceline swing viewer benchmark (node ${process.version}, ${new Date().toISOString()})`);
  if (process.env.BENCH_BASE_URL) return measure(process.env.BENCH_BASE_URL.replace(/\/$/, ''));
  const app = await startThrowawayApp(root);
  try {
    await measure(app.server.url);
  } finally {
    await app.stop();
  }
}

async function measure(baseUrl: string): Promise<void> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-frame-rate-limit', '--disable-gpu-vsync'],
  });
  try {
    // An invented 3-minute lesson at 100 Hz for the demo student (athlete 1 of coach@).
    const athlete = DEMO_ATHLETES.find((a) => a.id === 1)!;
    const csv = generateSession({ seed: 5, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm, swings: 6, withMarker: false, distractors: ['walk', 'waggle'] }).csv();
    const coach = await signedIn(baseUrl, 'coach@stanceline.test', 'stanceline-demo');
    const form = new FormData();
    form.append('athleteId', String(athlete.id));
    form.append('file', new Blob([csv], { type: 'text/csv' }), 'bench-viewer.csv');
    const accepted = (await (await coach.fetch('/api/recordings', { method: 'POST', body: form })).json()) as { recordings: { id: number }[] };
    let rec: { status: string; swings: { id: number; stale: boolean }[] };
    for (;;) {
      rec = (await (await coach.fetch(`/api/recordings/${accepted.recordings[0].id}`)).json()) as typeof rec;
      if (rec.status === 'ready' || rec.status === 'failed') break;
      await new Promise((r) => setTimeout(r, 50));
    }
    const swingId = rec.swings.find((s) => !s.stale)?.id;
    if (rec.status !== 'ready' || swingId === undefined) throw new Error(`the generated lesson gave no swing (status ${rec.status})`);
    const url = `${baseUrl}/swings/${swingId}`;
    console.log(`swing page ${url} (${rec.swings.length} swings in the recording)`);

    const cookies = coach.cookieHeader().split('; ').map((pair) => {
      const eq = pair.indexOf('=');
      return { name: pair.slice(0, eq), value: pair.slice(eq + 1), url: baseUrl };
    });

    const lcps: number[] = [];
    const ttis: number[] = [];
    const frames: number[] = [];
    const work: number[] = [];
    let steps = 0;
    for (let run = 0; run < RUNS; run++) {
      // bypassCSP: the app's CSP forbids eval, which the string probes below need; the page itself is unchanged
      const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, bypassCSP: true });
      await context.addCookies(cookies);
      await context.addInitScript(INIT_SCRIPT);
      const page = await context.newPage();
      await page.goto(url, { waitUntil: 'load' });
      await page.waitForFunction('window.__tti !== null', undefined, { timeout: 60_000 });
      const { lcp, tti } = (await page.evaluate('({ lcp: window.__lcp, tti: window.__tti })')) as { lcp: number; tti: number };
      lcps.push(lcp);
      ttis.push(tti);

      // Scrub from the first to the last sample in view, one key per frame.
      const result = (await page.evaluate(SCRUB_SCRIPT)) as { deltas: number[]; work: number[]; steps: number };
      frames.push(...result.deltas);
      work.push(...result.work);
      steps = result.steps;
      await context.close();
    }

    const lcp = quantile(lcps, 0.5);
    const p95 = quantile(frames, 0.95);
    console.log(`\n## Swing page in chromium, 1280x800, ${RUNS} cold loads (median of the runs)`);
    console.log(`LCP:                          ${ms(lcp)}   (target <= ${TARGET.lcpMs} ms on loopback: ${lcp <= TARGET.lcpMs ? 'met' : 'NOT met'})  runs ${lcps.map((v) => v.toFixed(0)).join(', ')}`);
    console.log(`time to interactive (approx): ${ms(quantile(ttis, 0.5))}   runs ${ttis.map((v) => v.toFixed(0)).join(', ')}`);
    console.log(`\n## Keyboard scrub across the swing (${steps} samples per run, ${frames.length} frames in all)`);
    console.log(`frame time median / p95:      ${ms(quantile(frames, 0.5))} / ${ms(p95)}   (target p95 <= ${TARGET.p95FrameMs} ms: ${p95 <= TARGET.p95FrameMs ? 'met' : 'NOT met'})`);
    console.log(`render work per key med/p95:  ${ms(quantile(work, 0.5))} / ${ms(quantile(work, 0.95))}`);
  } finally {
    await browser.close();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
});
