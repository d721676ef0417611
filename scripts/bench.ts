// Benchmark of the signal core (npm run bench). Prints figures beside the targets; asserts nothing.
// Inputs are generated at run time into a temp dir (never committed): a 60-minute lesson at 100 Hz with 8 sensors
// per foot and a 10-minute session at 200 Hz with 16 sensors per foot. Each analysis runs in its own child process,
// so its peak RSS is the analysis alone, not the generator's.
import { spawnSync } from 'node:child_process';
import { createReadStream, createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { once } from 'node:events';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  analyzeRecording,
  builtinLayout,
  createRecordingReader,
  derive,
  findSwings,
  phaseRows,
  regularise,
  sosfilt,
  zeroLagDesign,
  zeroLagLowpass,
  DEFAULT_CUTOFF_HZ,
} from '@/lib/signal';
import { DISTRACTORS, generateSession, type SessionOptions } from '@/lib/signal/synthetic';

const TARGET = { analyzeS: 1.5, rssMb: 400, filterMsps: 50 };
const now = () => performance.now() / 1000;
const mb = (kb: number) => kb / 1024;
const gc = (globalThis as { gc?: () => void }).gc ?? (() => {});

interface ChildFigures {
  samples: number;
  channels: number;
  baseRssMb: number;
  peakRssMb: number;
  parseS: number;
  analyzeS: number;
  regulariseS: number;
  filterS: number;
  deriveS: number;
  detectS: number;
  swings: number;
}

/** Child: analyze one file and print figures as JSON. */
async function child(file: string): Promise<void> {
  const baseRssMb = mb(process.resourceUsage().maxRSS);
  let t = now();
  const reader = createRecordingReader();
  for await (const chunk of createReadStream(file, { encoding: 'utf8', highWaterMark: 1 << 20 })) reader.push(chunk as string);
  const raw = reader.end();
  const parseS = now() - t;
  const layout = builtinLayout(raw.metadata.layout)!;
  t = now();
  const full = analyzeRecording(raw, layout);
  const analyzeS = now() - t;
  const peakRssMb = mb(process.resourceUsage().maxRSS);
  const swings = full.result.swings.length;

  // the same steps one by one (a second pass; peak RSS is taken above)
  gc();
  t = now();
  const u = regularise(raw, layout);
  const regulariseS = now() - t;
  t = now();
  for (const f of u.forces) zeroLagLowpass(f, u.sampleRateHz, DEFAULT_CUTOFF_HZ);
  const filterS = now() - t;
  const opts = { handedness: 'right' as const, stanceWidthMm: Number(raw.metadata.stance_width_mm) };
  t = now();
  const series = derive(u, layout, opts);
  const deriveS = now() - t;
  t = now();
  const found = findSwings(series, { stanceWidthMm: opts.stanceWidthMm, impact: u.impact });
  for (const sw of found.swings) phaseRows(series, sw.events);
  const detectS = now() - t;
  const figures: ChildFigures = {
    samples: u.time.length,
    channels: u.forces.length,
    baseRssMb,
    peakRssMb,
    parseS,
    analyzeS,
    regulariseS,
    filterS,
    deriveS,
    detectS,
    swings,
  };
  process.stdout.write(JSON.stringify(figures));
}

async function writeSession(path: string, opts: SessionOptions): Promise<{ seconds: number; bytes: number; swings: number }> {
  const t = now();
  const s = generateSession(opts);
  const out = createWriteStream(path);
  for (const piece of s.chunks()) if (!out.write(piece)) await once(out, 'drain');
  out.end();
  await once(out, 'finish');
  return { seconds: now() - t, bytes: statSync(path).size, swings: s.truth.swings.length };
}

function runChild(file: string): ChildFigures {
  const self = fileURLToPath(import.meta.url);
  const r = spawnSync(process.execPath, ['--expose-gc', '--import', 'tsx', self, '--child', file], { encoding: 'utf8', maxBuffer: 1 << 20 });
  if (r.status !== 0) throw new Error(`child failed: ${r.stderr}`);
  return JSON.parse(r.stdout) as ChildFigures;
}

const pad = (s: string, n: number) => s.padEnd(n);
const f3 = (v: number) => v.toFixed(3);

function report(name: string, gen: { seconds: number; bytes: number; swings: number }, c: ChildFigures, target: boolean): void {
  const n = c.samples;
  const rate = (s: number, k = 1) => `${((n * k) / s / 1e6).toFixed(1)} M samples/s`;
  console.log(`\n## ${name}`);
  console.log(`generated ${(gen.bytes / 1e6).toFixed(1)} MB in ${gen.seconds.toFixed(2)} s (${gen.swings} swings; generator runs in the parent, not in the measured child)`);
  console.log(`${n} samples x ${c.channels} sensors; swings found: ${c.swings}`);
  console.log(`${pad('parse (stream, reader)', 34)} ${f3(c.parseS)} s   ${rate(c.parseS)} rows, ${(gen.bytes / c.parseS / 1e6).toFixed(1)} MB/s`);
  console.log(`${pad('analyze (regularise..phases)', 34)} ${f3(c.analyzeS)} s   ${rate(c.analyzeS)}`);
  const total = c.parseS + c.analyzeS;
  console.log(`${pad('full = parse + analyze', 34)} ${f3(total)} s${target ? `   target <= ${TARGET.analyzeS} s: ${total <= TARGET.analyzeS ? 'met' : 'MISSED'}` : ''}`);
  console.log(`  steps, measured again one by one:`);
  console.log(`  ${pad('regularise', 32)} ${f3(c.regulariseS)} s   ${rate(c.regulariseS)}`);
  const fr = (n * c.channels) / c.filterS / 1e6;
  console.log(`  ${pad('filter (zero-lag, every sensor)', 32)} ${f3(c.filterS)} s   ${fr.toFixed(1)} M sensor-samples/s (target >= ${TARGET.filterMsps}: ${fr >= TARGET.filterMsps ? 'met' : 'MISSED'})`);
  console.log(`  ${pad('derive (includes the filter)', 32)} ${f3(c.deriveS)} s   ${rate(c.deriveS)}`);
  console.log(`  ${pad('detect (swings, events, phases)', 32)} ${f3(c.detectS)} s   ${rate(c.detectS)}`);
  const rss = `peak RSS of the analysis child ${c.peakRssMb.toFixed(0)} MB (node + tsx at start: ${c.baseRssMb.toFixed(0)} MB)`;
  console.log(target ? `${rss}; target <= ${TARGET.rssMb} MB: ${c.peakRssMb <= TARGET.rssMb ? 'met' : 'MISSED'}` : rss);
}

function filiComparison(): void {
  const require = createRequire(import.meta.url);
  // fili ships no types; its documented API: new Fili.CalcCascades().lowpass({...}), new Fili.IirFilter(c).multiStep(x)
  const Fili = require('fili') as {
    CalcCascades: new () => { lowpass(p: object): unknown };
    IirFilter: new (c: unknown) => { multiStep(x: ArrayLike<number>): number[] };
  };
  const fs = 100;
  const n = 360_000;
  const channels = 16;
  const data = Array.from({ length: channels }, (_, c) => Float64Array.from({ length: n }, (_, i) => 50 + 20 * Math.sin(i / (7 + c)) + ((i * 7919) % 13)));
  const { sos, designHz } = zeroLagDesign(fs, DEFAULT_CUTOFF_HZ);
  const coeffs = new Fili.CalcCascades().lowpass({ order: sos.length, characteristic: 'butterworth', Fs: fs, Fc: designHz });
  const time = (fn: () => void) => {
    gc();
    const t = now();
    fn();
    return now() - t;
  };
  const total = n * channels;
  const ours1 = time(() => data.forEach((x) => sosfilt(sos, x)));
  const ours2 = time(() => data.forEach((x) => zeroLagLowpass(x, fs, DEFAULT_CUTOFF_HZ)));
  const fili1 = time(() => data.forEach((x) => new Fili.IirFilter(coeffs).multiStep(x)));
  const fili2 = time(() =>
    data.forEach((x) => {
      const fwd = new Fili.IirFilter(coeffs).multiStep(x);
      new Fili.IirFilter(coeffs).multiStep(fwd.reverse()).reverse();
    }),
  );
  // both forward passes start from zero state, so they agree sample for sample
  const a = sosfilt(sos, data[0]);
  const b = new Fili.IirFilter(coeffs).multiStep(data[0]);
  let maxDiff = 0;
  for (let i = 0; i < n; i++) maxDiff = Math.max(maxDiff, Math.abs(a[i] - b[i]));
  const row = (name: string, s: number) => console.log(`${pad(name, 52)} ${f3(s)} s   ${(total / s / 1e6).toFixed(1)} M samples/s`);
  console.log(`\n## Filter: our typed-array path vs fili (${channels} x ${n} samples, ${fs} Hz, Butterworth order ${2 * sos.length}, design ${designHz.toFixed(2)} Hz)`);
  row('ours sosfilt (forward only)', ours1);
  row('ours zeroLagLowpass (sosfiltfilt: padded, fwd + back)', ours2);
  row('fili IirFilter.multiStep (forward only)', fili1);
  row('fili multiStep forward + backward (no padding)', fili2);
  console.log(`forward outputs agree to ${maxDiff.toExponential(2)} (max abs difference)`);
}

async function main(): Promise<void> {
  const i = process.argv.indexOf('--child');
  if (i >= 0) return child(process.argv[i + 1]);
  const dir = mkdtempSync(join(tmpdir(), 'stanceline-bench-'));
  try {
    console.log(`# Stanceline signal benchmark (node ${process.version}, ${new Date().toISOString()})`);
    const lesson = join(dir, 'lesson-60min-100hz-8.csv');
    const common = { units: 'N' as const, handedness: 'right' as const, stanceWidthMm: 400, withMarker: true, distractors: DISTRACTORS };
    const g1 = await writeSession(lesson, { ...common, seed: 1, sampleRateHz: 100, sensorsPerFoot: 8, durationS: 3600, swings: 120 });
    console.log(`parent peak RSS after generating (not part of any analysis figure): ${mb(process.resourceUsage().maxRSS).toFixed(0)} MB`);
    report('60-minute lesson, 100 Hz, 8 sensors per foot', g1, runChild(lesson), true);
    rmSync(lesson);
    const short = join(dir, 'session-10min-200hz-16.csv');
    const g2 = await writeSession(short, { ...common, seed: 2, sampleRateHz: 200, sensorsPerFoot: 16, durationS: 600, swings: 25 });
    report('10-minute session, 200 Hz, 16 sensors per foot', g2, runChild(short), false);
    filiComparison();
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
