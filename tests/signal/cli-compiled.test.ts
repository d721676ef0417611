import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { BASE } from './helpers';

// `npm run analyze` runs the esbuild bundle (.build/analyze.mjs through scripts/analyze.mjs); the source version is
// scripts/analyze.ts under tsx. Both must print the same bytes, exit the same way and write the same series file;
// so must the compiled command with its two-thread reader (scripts/analyze-parallel.ts) forced on.
const ROOT = join(__dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'stanceline-cli-compiled-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

beforeAll(() => {
  const r = spawnSync(process.execPath, ['scripts/build-bundles.mjs', '--force'], { cwd: ROOT, encoding: 'utf8' });
  expect(r.status, r.stderr).toBe(0);
});

function run(kind: 'source' | 'compiled' | 'two-threads' | 'many-blocks', args: string[]) {
  const entry = kind === 'source' ? ['--import', 'tsx', 'scripts/analyze.ts'] : ['scripts/analyze.mjs'];
  // two-threads: the compiled command with its two-thread reader forced on for small files (two blocks), and a
  // trace line; many-blocks: the same with blocks of 16 KB (dozens of blocks, both threads taking turns)
  const forced = { ...process.env, STANCELINE_PARALLEL_PARSE_MIN_BYTES: '0', STANCELINE_PARALLEL_PARSE_TRACE: '1' };
  const env = kind === 'two-threads' ? forced : kind === 'many-blocks' ? { ...forced, STANCELINE_PARALLEL_PARSE_BLOCK_BYTES: '16384' } : process.env;
  const r = spawnSync(process.execPath, [...entry, ...args], { cwd: ROOT, encoding: 'utf8', maxBuffer: 64 << 20, env });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const golf = join(dir, 'golf.csv');
const session = generateSession({ ...BASE, seed: 31, swings: 3, withMarker: true, distractors: ['step', 'waggle'] });
writeFileSync(golf, session.csv());
const unmarked = join(dir, 'unmarked.csv');
writeFileSync(unmarked, generateSession({ ...BASE, seed: 7, swings: 2, withMarker: false, distractors: ['walk'] }).csv());
const bad = join(dir, 'bad.csv');
{
  const lines = session.csv().split('\n');
  const cells = lines[30].split(',');
  cells[2] = '1.2.3';
  lines[30] = cells.join(',');
  writeFileSync(bad, lines.join('\n'));
}
const TRACE = /^analyze: read on two threads, \d+ blocks cut at bytes \d+(, \d+)*\n/m;
// the row just after the middle byte (where the two-thread reader cuts a small file in two blocks) goes back in time,
// and a bad cell near the end
const backAtCut = join(dir, 'back-at-cut.csv');
const badLate = join(dir, 'bad-late.csv');
{
  const text = session.csv();
  const mid = text.indexOf('\n', text.length >> 1) + 1;
  const lines = text.split('\n');
  const k = text.slice(0, mid).split('\n').length - 1; // index of the first line after the cut
  const copy = [...lines];
  const cells = copy[k].split(',');
  cells[0] = copy[k - 1].split(',')[0];
  copy[k] = cells.join(',');
  writeFileSync(backAtCut, copy.join('\n'));
  const late = [...lines];
  const c2 = late[late.length - 5].split(',');
  c2[4] = '--';
  late[late.length - 5] = c2.join(',');
  writeFileSync(badLate, late.join('\n'));
}
const gait = (name: string) => [
  `tests/fixtures/gaitpdb/${name}`,
  '--profile',
  'tests/fixtures/profiles/gaitpdb.json',
  '--layout',
  'tests/fixtures/layouts/gaitpdb.json',
];

const cases: [string, string[]][] = [
  ['generated golf session', [golf]],
  ['generated session without a marker, left-handed, other cutoff', [unmarked, '--handedness', 'left', '--cutoff-hz=12', '--stance-width-mm', '450']],
  // PhysioNet gaitpdb open walking files (tests/fixtures/gaitpdb/README.md)
  ['gaitpdb GaCo01_01', gait('GaCo01_01.txt')],
  ['gaitpdb GaPt03_01', gait('GaPt03_01.txt')],
  ['gaitpdb JuCo01_01', gait('JuCo01_01.txt')],
  ['a malformed file', [bad]],
  ['a missing file', [join(dir, 'nope.csv')]],
  ['a usage error', [golf, '--handedness', 'both']],
  ['no FILE', []],
];

describe('the compiled analyze command', () => {
  it.each(cases)('%s: same stdout, stderr and exit code as the source version', (_label, args) => {
    const source = run('source', args);
    const compiled = run('compiled', args);
    expect(compiled.code).toBe(source.code);
    expect(compiled.stderr).toBe(source.stderr);
    expect(compiled.stdout).toBe(source.stdout);
  });

  it.each([
    ['generated golf session', [golf], true],
    ['left-handed, other cutoff', [unmarked, '--handedness', 'left', '--cutoff-hz=12'], true],
    ['a row going back in time just after the cut', [backAtCut], false],
    ['a bad cell near the end', [badLate], false],
    ['a malformed file', [bad], false],
  ] as [string, string[], boolean][])('read on two threads, %s: the same output as the source version', (_label, args, joined) => {
    const source = run('source', args);
    const two = run('two-threads', args);
    expect(TRACE.test(two.stderr)).toBe(joined); // joined halves, or the one-thread reader after a problem
    expect(two.code).toBe(source.code);
    expect(two.stderr.replace(TRACE, '')).toBe(source.stderr);
    expect(two.stdout).toBe(source.stdout);
    if (!joined) expect(source.code).toBe(1);
  });

  it.each([
    ['generated golf session', [golf], true],
    ['left-handed, other cutoff', [unmarked, '--handedness', 'left', '--cutoff-hz=12'], true],
    ['a bad cell near the end', [badLate], false],
    ['a malformed file', [bad], false],
  ] as [string, string[], boolean][])('read in many blocks on two threads, %s: the same output as the source version', (_label, args, joined) => {
    const source = run('source', args);
    const blocks = run('many-blocks', args);
    const trace = /^analyze: read on two threads, (\d+) blocks cut at bytes [\d, ]+\n/m.exec(blocks.stderr);
    expect(trace !== null).toBe(joined);
    if (trace) expect(Number(trace[1])).toBeGreaterThan(10);
    expect(blocks.code).toBe(source.code);
    expect(blocks.stderr.replace(TRACE, '')).toBe(source.stderr);
    expect(blocks.stdout).toBe(source.stdout);
  });

  it('writes a byte-identical --series file', () => {
    const a = join(dir, 'a.csv');
    const b = join(dir, 'b.csv');
    expect(run('source', [golf, '--series', a]).code).toBe(0);
    expect(run('compiled', [golf, '--series', b]).code).toBe(0);
    expect(readFileSync(b).equals(readFileSync(a))).toBe(true);
    const c = join(dir, 'c.csv');
    expect(run('two-threads', [golf, '--series', c]).code).toBe(0);
    expect(readFileSync(c).equals(readFileSync(a))).toBe(true);
  });
});
