// Compiled entry points that must start without tsx: the analyze command and the job pool's worker thread of the
// app. esbuild bundles each TypeScript entry with its imports (the `@/` paths come from tsconfig.json) into one ES
// module under .build/. Plain JavaScript so it runs from `npm ci`'s prepare step and from the analyze launcher.
//   node scripts/build-bundles.mjs          build the bundles that are missing or older than their sources
//   node scripts/build-bundles.mjs --force  build them all
import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
export const BUILD_DIR = join(ROOT, '.build');

// Every input that can change a bundle (folders walked recursively). Wider than strictly needed, never narrower.
const SHARED_INPUTS = ['lib/signal', 'package.json', 'tsconfig.json', 'scripts/build-bundles.mjs'];

export const BUNDLES = {
  // split: the schema library (zod: --layout, --profile, a bad option value) in a chunk of its own, so that the
  // command's start-up does not read and compile it
  analyze: {
    entry: 'scripts/analyze.ts',
    out: 'analyze.mjs',
    split: true,
    inputs: ['scripts/analyze.ts', 'scripts/analyze-parallel.ts', 'scripts/analyze-read.ts'],
  },
  // the analyze command's second reading thread (scripts/analyze-parallel.ts): the reader only, so it starts fast
  'analyze-worker': {
    entry: 'scripts/analyze-worker.ts',
    out: 'analyze-worker.mjs',
    inputs: ['scripts/analyze-worker.ts', 'scripts/analyze-parallel.ts', 'scripts/analyze-read.ts'],
  },
  // the job pool's worker thread (lib/jobs/pool.ts): every task registered in lib/jobs/tasks. Its npm packages
  // (knex, mysql2, the S3 SDK, zod, ...) stay outside the bundle and load from node_modules like the server's own.
  'job-thread': {
    entry: 'lib/jobs/thread-entry.ts',
    out: 'job-thread.mjs',
    inputs: ['lib/jobs', 'lib/swings', 'lib/storage', 'lib/db', 'lib/env.ts', 'lib/recordings', 'lib/live', 'lib/contracts'],
    packagesExternal: true,
  },
};

// per input, once per process: the analyze launcher checks two bundles with the same shared inputs on every run
const newest = new Map();

function newestMtime(path) {
  let t = newest.get(path);
  if (t === undefined) {
    t = walkMtime(path);
    newest.set(path, t);
  }
  return t;
}

function walkMtime(path) {
  let stat;
  try {
    stat = statSync(path);
  } catch {
    return 0;
  }
  if (!stat.isDirectory()) return stat.mtimeMs;
  let latest = stat.mtimeMs;
  for (const entry of readdirSync(path)) latest = Math.max(latest, walkMtime(join(path, entry)));
  return latest;
}

export function bundlePath(name) {
  return join(BUILD_DIR, BUNDLES[name].out);
}

/** True when the bundle is missing or a source it is made from is newer. */
export function isStale(name) {
  const out = bundlePath(name);
  if (!existsSync(out)) return true;
  const builtAt = statSync(out).mtimeMs;
  return [...SHARED_INPUTS, ...BUNDLES[name].inputs].some((input) => newestMtime(join(ROOT, input)) > builtAt);
}

export async function buildBundle(name) {
  newest.clear(); // a build is a moment to look again
  const { build } = await import('esbuild');
  // split: what the entry only imports dynamically goes to chunk files beside it, read only when imported
  const chunks = join(BUILD_DIR, `${name}-chunks`);
  if (BUNDLES[name].split) rmSync(chunks, { recursive: true, force: true });
  await build({
    absWorkingDir: ROOT,
    entryPoints: [join(ROOT, BUNDLES[name].entry)],
    ...(BUNDLES[name].split
      ? { outdir: BUILD_DIR, splitting: true, entryNames: '[name]', chunkNames: `${name}-chunks/[name]-[hash]`, outExtension: { '.js': '.mjs' } }
      : { outfile: bundlePath(name) }),
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    tsconfig: join(ROOT, 'tsconfig.json'),
    // CommonJS dependencies (papaparse) call require(); give the ES module one.
    banner: { js: "import { createRequire as __stancelineRequire } from 'node:module'; const require = __stancelineRequire(import.meta.url);" },
    logLevel: 'warning',
    legalComments: 'none',
    ...(BUNDLES[name].packagesExternal ? { packages: 'external' } : {}),
  });
  return bundlePath(name);
}

/** Builds what is stale (or everything with force); returns the names built. */
export async function buildBundles({ force = false, names = Object.keys(BUNDLES) } = {}) {
  const built = [];
  for (const name of names) {
    if (force || isStale(name)) {
      await buildBundle(name);
      built.push(name);
    }
  }
  return built;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const built = await buildBundles({ force: process.argv.includes('--force') });
  console.log(built.length ? `built ${built.map((n) => `.build/${BUNDLES[n].out}`).join(', ')}` : 'bundles are up to date');
}
