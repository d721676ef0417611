// The analyze command against pandas + scipy (second half of npm run bench:signal). Prints figures beside the
// issue's targets; asserts nothing. A generated 60-minute lesson (100 Hz, 8 sensors per foot, the same as
// scripts/bench.ts) is analysed alternately by `npm run -s analyze -- FILE` (the public command, npm's own start-up
// included) and by scripts/bench/pandas_scipy_analysis.py under Debian's /usr/bin/python3 (python3-pandas and
// python3-scipy), ROUNDS times each; wall time and peak RSS of each run come from /usr/bin/time.
import { spawnSync } from 'node:child_process';
import { createWriteStream, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { once } from 'node:events';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildBundles } from './build-bundles.mjs';
import { DISTRACTORS, generateSession } from '../lib/signal/synthetic';

const TARGET = { ratio: 0.5, rssMb: 400 }; // from the issue
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const PYTHON = process.env.BENCH_PYTHON ?? '/usr/bin/python3';
const TIME = '/usr/bin/time';
const root = process.cwd();

type Run = { wallS: number; cpuS: number; rssMb: number; stdout: string };

function timed(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): Run {
  const stats = join(tmpdir(), `stanceline-bench-time-${process.pid}`);
  const r = spawnSync(TIME, ['-f', '%e %M %U %S', '-o', stats, cmd, ...args], { cwd: root, encoding: 'utf8', maxBuffer: 64 << 20, env });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed (${r.status}): ${r.stderr}`);
  const [wall, rssKb, user, sys] = readFileSync(stats, 'utf8').trim().split('\n').at(-1)!.split(' ').map(Number);
  rmSync(stats, { force: true });
  return { wallS: wall, cpuS: user + sys, rssMb: rssKb / 1024, stdout: r.stdout };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

async function main(): Promise<void> {
  console.log(`# analyze command vs pandas + scipy (node ${process.version}, ${new Date().toISOString()})`);
  console.log('# the machine may be shared with other work: the runs alternate so both sides see the same load');
  for (const [what, path] of [['/usr/bin/time', TIME], [PYTHON, PYTHON]]) if (!existsSync(path)) return void console.log(`skipped: ${what} is missing`);
  const versions = spawnSync(PYTHON, ['-c', 'import pandas, scipy, numpy; print(pandas.__version__, scipy.__version__, numpy.__version__)'], { encoding: 'utf8' });
  if (versions.status !== 0) return void console.log(`skipped: ${PYTHON} has no pandas/scipy (apt-get install python3-pandas python3-scipy)`);
  const [pandasV, scipyV, numpyV] = versions.stdout.trim().split(' ');
  console.log(`python: ${PYTHON}, pandas ${pandasV}, scipy ${scipyV}, numpy ${numpyV}`);
  await buildBundles({ names: ['analyze', 'analyze-worker'] }); // the first run must not pay for a build

  const dir = mkdtempSync(join(tmpdir(), 'stanceline-bench-cli-'));
  try {
    const file = join(dir, 'lesson-60min-100hz-8.csv');
    const session = generateSession({ seed: 1, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, withMarker: true, distractors: DISTRACTORS, durationS: 3600, swings: 120 });
    const out = createWriteStream(file);
    for (const piece of session.chunks()) if (!out.write(piece)) await once(out, 'drain');
    out.end();
    await once(out, 'finish');
    const layout = join(root, 'lib', 'signal', 'layouts', 'pair-8.json');

    const ours: Run[] = [];
    const twoThreads: Run[] = [];
    const theirs: Run[] = [];
    // the command as shipped (one thread) and with its two-thread reader on for files from 16 MB (off by default: it
    // has not paid on the 2-core machine, see scripts/analyze-parallel.ts)
    const two = { ...process.env, STANCELINE_PARALLEL_PARSE_MIN_BYTES: String(16 * 1024 * 1024) };
    for (let i = 0; i < ROUNDS; i++) {
      ours.push(timed('npm', ['run', '-s', 'analyze', '--', file]));
      theirs.push(timed(PYTHON, ['scripts/bench/pandas_scipy_analysis.py', file, layout]));
      twoThreads.push(timed('npm', ['run', '-s', 'analyze', '--', file], two));
    }
    const swings = (JSON.parse(ours[0].stdout) as { swings: unknown[] }).swings.length;
    const py = JSON.parse(theirs[0].stdout) as { samples: number };
    const a = median(ours.map((r) => r.wallS));
    const b = median(theirs.map((r) => r.wallS));
    const rss = Math.max(...ours.map((r) => r.rssMb));
    console.log(`\n## 60-minute lesson, ${py.samples} samples x 16 sensors, ${ROUNDS} alternating rounds (median wall time)`);
    console.log(`npm run -s analyze:     ${a.toFixed(2)} s   runs ${ours.map((r) => r.wallS.toFixed(2)).join(', ')}   (${swings} swings)`);
    console.log(`pandas + scipy script:  ${b.toFixed(2)} s   runs ${theirs.map((r) => r.wallS.toFixed(2)).join(', ')}`);
    const par = median(twoThreads.map((r) => r.wallS));
    console.log(`analyze, two threads:   ${par.toFixed(2)} s   runs ${twoThreads.map((r) => r.wallS.toFixed(2)).join(', ')}   (ratio ${(par / b).toFixed(2)}; STANCELINE_PARALLEL_PARSE_MIN_BYTES=16 MiB, used while no other task is runnable)`);
    const cpu = (runs: Run[]) => median(runs.map((r) => r.cpuS)).toFixed(2);
    console.log(`CPU time (user + sys, median): analyze ${cpu(ours)} s, two threads ${cpu(twoThreads)} s, python ${cpu(theirs)} s`);
    console.log(`load average at the end: ${loadavg().map((l) => l.toFixed(1)).join(' ')} on ${availableParallelism()} cores`);
    console.log(`ratio analyze / python: ${(a / b).toFixed(2)}   (target <= ${TARGET.ratio}: ${a / b <= TARGET.ratio ? 'met' : 'NOT met'})`);
    console.log(`analyze peak RSS:       ${rss.toFixed(0)} MB   (target <= ${TARGET.rssMb} MB: ${rss <= TARGET.rssMb ? 'met' : 'NOT met'}); python ${Math.max(...theirs.map((r) => r.rssMb)).toFixed(0)} MB`);

    const tiny = join(dir, 'one-swing.csv');
    await new Promise<void>((resolve, reject) => {
      const w = createWriteStream(tiny);
      w.end(generateSession({ seed: 4, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, withMarker: true, swings: 1 }).csv(), () => resolve());
      w.on('error', reject);
    });
    const start = [0, 1, 2].map(() => timed('npm', ['run', '-s', 'analyze', '--', tiny]).wallS);
    const direct = [0, 1, 2].map(() => timed(process.execPath, [join(root, 'scripts', 'analyze.mjs'), tiny]).wallS);
    console.log(`\n## Start-up: a one-swing file`);
    console.log(`npm run -s analyze:     ${median(start).toFixed(2)} s (median of 3)`);
    console.log(`node scripts/analyze.mjs: ${median(direct).toFixed(2)} s (median of 3; the rest is npm's own start-up)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
