// The analysis command (README "The analysis command"):
//   npm run -s analyze -- FILE [--layout LAYOUT.json] [--profile PROFILE.json] [--handedness right|left]
//                           [--stance-width-mm N] [--cutoff-hz N] [--series SERIES.csv]
// One JSON document on stdout, exit 0. A file it cannot read: one line on stderr naming line and column, exit 1.
// A usage error (unknown option, bad option value): one line on stderr plus the usage, exit 2.
import { createReadStream, createWriteStream, readFileSync } from 'node:fs';
import { once } from 'node:events';
import { z } from 'zod';
import {
  analyzeRecording,
  builtinLayout,
  createRecordingReader,
  parseLayout,
  parseProfile,
  roundAnalysis,
  seriesCsvChunks,
  SignalInputError,
  type AnalysisOutput,
  type ImportProfile,
  type SensorLayout,
} from '@/lib/signal';
import { dropEarlyWorker, readParallel } from './analyze-parallel';
import { readFileBytes } from './analyze-read';

const USAGE =
  'usage: npm run -s analyze -- FILE [--layout LAYOUT.json] [--profile PROFILE.json] [--handedness right|left] ' +
  '[--stance-width-mm N] [--cutoff-hz N] [--series SERIES.csv]';

class UsageError extends Error {}

const positive = (name: string) =>
  z
    .string()
    .refine((s) => /^\s*[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/.test(s) && Number(s) > 0, `${name} must be a positive number`)
    .transform(Number);

const argsSchema = z.object({
  file: z.string().min(1),
  layout: z.string().min(1).optional(),
  profile: z.string().min(1).optional(),
  handedness: z.enum(['right', 'left'], { error: '--handedness must be right or left' }).optional(),
  stanceWidthMm: positive('--stance-width-mm').optional(),
  cutoffHz: positive('--cutoff-hz').optional(),
  series: z.string().min(1).optional(),
});
type Args = z.infer<typeof argsSchema>;

const OPTIONS: Record<string, keyof Omit<Args, 'file'>> = {
  '--layout': 'layout',
  '--profile': 'profile',
  '--handedness': 'handedness',
  '--stance-width-mm': 'stanceWidthMm',
  '--cutoff-hz': 'cutoffHz',
  '--series': 'series',
};

function parseArgs(argv: string[]): Args {
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
  const r = argsSchema.safeParse({ ...raw, file: files[0] });
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
  const profile: ImportProfile | undefined = args.profile ? parseProfile(readJson(args.profile, 'profile')) : undefined;
  let layout: SensorLayout | undefined = args.layout ? parseLayout(readJson(args.layout, 'layout')) : undefined;

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
    args = parseArgs(process.argv.slice(2));
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
