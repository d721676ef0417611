// The analysis command (README "The analysis command"):
//   npm run -s analyze -- FILE [--layout LAYOUT.json] [--profile PROFILE.json] [--handedness right|left]
//                           [--stance-width-mm N] [--cutoff-hz N] [--series SERIES.csv]
// One JSON document on stdout, exit 0. A file it cannot read: one line on stderr naming line and column, exit 1.
// A usage error (unknown option, bad option value): one line on stderr plus the usage, exit 2.
//
// Start-up: the modules are imported one by one, not through lib/signal's index, and the schema library (zod) is
// loaded only when needed: for --layout or --profile, and for the message of a bad option value. The options are
// checked by hand first with exactly the schema's rules (argsSchema), so a valid command line never loads it.
import { createReadStream, createWriteStream, readFileSync } from 'node:fs';
import { once } from 'node:events';
import { analyzeRecording, roundAnalysis, seriesCsvChunks, type AnalysisOutput } from '@/lib/signal/analyze';
import { SignalInputError } from '@/lib/signal/errors';
import { builtinLayout } from '@/lib/signal/layouts';
import { createRecordingReader } from '@/lib/signal/read/reader';
import type { ImportProfile, SensorLayout } from '@/lib/signal/types';
import { dropEarlyWorker, readParallel } from './analyze-parallel';
import { readFileBytes } from './analyze-read';

const USAGE =
  'usage: npm run -s analyze -- FILE [--layout LAYOUT.json] [--profile PROFILE.json] [--handedness right|left] ' +
  '[--stance-width-mm N] [--cutoff-hz N] [--series SERIES.csv]';

class UsageError extends Error {}

const POSITIVE = /^\s*[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/;
const isPositive = (s: string) => POSITIVE.test(s) && Number(s) > 0;

/** The rules of the command line as a schema: its messages are the command's (see validArgs for the fast check). */
async function argsSchema() {
  const { z } = await import('zod');
  const positive = (name: string) => z.string().refine(isPositive, `${name} must be a positive number`).transform(Number);
  return z.object({
    file: z.string().min(1),
    layout: z.string().min(1).optional(),
    profile: z.string().min(1).optional(),
    handedness: z.enum(['right', 'left'], { error: '--handedness must be right or left' }).optional(),
    stanceWidthMm: positive('--stance-width-mm').optional(),
    cutoffHz: positive('--cutoff-hz').optional(),
    series: z.string().min(1).optional(),
  });
}

type Args = {
  file: string;
  layout?: string;
  profile?: string;
  handedness?: 'right' | 'left';
  stanceWidthMm?: number;
  cutoffHz?: number;
  series?: string;
};

/** argsSchema's rules checked by hand: the parsed arguments when they hold, else null (then the schema speaks). */
function validArgs(raw: Record<string, string>): Args | null {
  const { file, layout, profile, handedness, stanceWidthMm, cutoffHz, series } = raw;
  const text = (v: string | undefined) => v === undefined || v.length >= 1;
  if (!(file.length >= 1 && text(layout) && text(profile) && text(series))) return null;
  if (handedness !== undefined && handedness !== 'right' && handedness !== 'left') return null;
  for (const v of [stanceWidthMm, cutoffHz]) if (v !== undefined && !isPositive(v)) return null;
  const args: Args = { file };
  if (layout !== undefined) args.layout = layout;
  if (profile !== undefined) args.profile = profile;
  if (handedness !== undefined) args.handedness = handedness;
  if (stanceWidthMm !== undefined) args.stanceWidthMm = Number(stanceWidthMm);
  if (cutoffHz !== undefined) args.cutoffHz = Number(cutoffHz);
  if (series !== undefined) args.series = series;
  return args;
}

const OPTIONS: Record<string, keyof Omit<Args, 'file'>> = {
  '--layout': 'layout',
  '--profile': 'profile',
  '--handedness': 'handedness',
  '--stance-width-mm': 'stanceWidthMm',
  '--cutoff-hz': 'cutoffHz',
  '--series': 'series',
};

async function parseArgs(argv: string[]): Promise<Args> {
  const raw: Record<string, string> = {};
  const files: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--') continue;
    if (a.startsWith('--')) {
      const eq = a.indexOf('=');
      const name = eq > 0 ? a.slice(0, eq) : a;
      const key = OPTIONS[name];
      if (!key) throw new UsageError(`unknown option ${name}`);
      const value = eq > 0 ? a.slice(eq + 1) : argv[++i];
      if (value === undefined) throw new UsageError(`${name} needs a value`);
      if (key in raw) throw new UsageError(`${name} given twice`);
      raw[key] = value;
    } else files.push(a);
  }
  if (files.length !== 1) throw new UsageError(files.length === 0 ? 'FILE is missing' : `one FILE expected, got ${files.length}`);
  const valid = validArgs({ ...raw, file: files[0] });
  if (valid) return valid;
  const r = (await argsSchema()).safeParse({ ...raw, file: files[0] });
  if (!r.success) throw new UsageError(r.error.issues[0].message);
  return r.data;
}

function readJson(path: string, what: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new SignalInputError('unreadable', `${what} ${path}: ${(e as Error).message}`);
  }
  try {
    return JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (e) {
    throw new SignalInputError('bad-json', `${what} ${path} is not valid JSON: ${(e as Error).message}`);
  }
}

async function run(args: Args): Promise<AnalysisOutput> {
  const schemas = args.profile || args.layout ? await import('@/lib/signal/read/schemas') : null;
  const profile: ImportProfile | undefined = args.profile ? schemas!.parseProfile(readJson(args.profile, 'profile')) : undefined;
  let layout: SensorLayout | undefined = args.layout ? schemas!.parseLayout(readJson(args.layout, 'layout')) : undefined;

  // a large file without a profile is read on two threads when that works out (scripts/analyze-parallel.ts), else as
  // bytes on this thread (scripts/analyze-read.ts); the stream reader for anything else and for every error, so
  // messages stay exactly its own
  if (profile) dropEarlyWorker();
  const raw =
    (!profile && (await readParallel(args.file, new URL(import.meta.url)).catch(() => null))) ||
    readFileBytes(args.file, profile) ||
    (await readOneThread(args.file, profile));

  if (!layout) {
    const id = raw.metadata.layout;
    if (id === undefined) throw new SignalInputError('no-layout', 'the file names no sensor layout; give --layout LAYOUT.json');
    layout = builtinLayout(id);
    if (!layout) throw new SignalInputError('unknown-layout', `layout "${id}" is not built in; give --layout LAYOUT.json`);
  }
  return analyzeRecording(raw, layout, {
    handedness: args.handedness,
    stanceWidthMm: args.stanceWidthMm,
    cutoffHz: args.cutoffHz,
    reuseChannels: true, // raw is read for this analysis only
    sensorWindows: false, // the command prints no per-sensor data
  });
}

async function readOneThread(file: string, profile: ImportProfile | undefined) {
  const reader = createRecordingReader({ profile });
  try {
    for await (const chunk of createReadStream(file, { encoding: 'utf8', highWaterMark: 1 << 20 })) {
      reader.push(chunk as string);
    }
  } catch (e) {
    if (e instanceof SignalInputError) throw e;
    throw new SignalInputError('unreadable', `cannot read ${file}: ${(e as Error).message}`);
  }
  return reader.end();
}

async function writeSeries(path: string, out: AnalysisOutput): Promise<void> {
  const stream = createWriteStream(path, { encoding: 'utf8' });
  const failed = once(stream, 'error').then(([e]) => {
    throw new SignalInputError('unwritable', `cannot write ${path}: ${(e as Error).message}`);
  });
  const write = async () => {
    for (const piece of seriesCsvChunks(out.series)) if (!stream.write(piece)) await once(stream, 'drain');
    stream.end();
    await once(stream, 'finish');
  };
  await Promise.race([write(), failed]);
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ').trim();
}

async function main(): Promise<number> {
  let args: Args;
  try {
    args = await parseArgs(process.argv.slice(2));
  } catch (e) {
    dropEarlyWorker();
    process.stderr.write(`analyze: ${oneLine((e as Error).message)}\n${USAGE}\n`);
    return 2;
  }
  try {
    const out = await run(args);
    if (args.series) await writeSeries(args.series, out);
    const reasons: Record<string, number> = {};
    for (const c of out.candidates) if (c.reason) reasons[c.reason] = (reasons[c.reason] ?? 0) + 1;
    const doc = { ...roundAnalysis(out.result), candidates: { accepted: out.result.swings.length, rejected: reasons } };
    process.stdout.write(`${JSON.stringify(doc, null, 2)}\n`);
    return 0;
  } catch (e) {
    if (e instanceof SignalInputError) {
      process.stderr.write(`analyze: ${args.file}: ${oneLine(e.message)}\n`);
      return 1;
    }
    if (e instanceof RangeError) {
      // a parameter the core refused (e.g. a cutoff too high for the sample rate)
      process.stderr.write(`analyze: ${oneLine(e.message)}\n`);
      return 2;
    }
    process.stderr.write(`analyze: unexpected error: ${oneLine(String((e as Error)?.stack ?? e)).slice(0, 500)}\n`);
    return 1;
  }
}

main().then((code) => {
  process.exitCode = code;
});
