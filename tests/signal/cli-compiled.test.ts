import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { BASE } from './helpers';

// `npm run analyze` runs the esbuild bundle (.build/analyze.mjs through scripts/analyze.mjs); the source version is
// scripts/analyze.ts under tsx. Both must print the same bytes, exit the same way and write the same series file.
const ROOT = join(__dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'stanceline-cli-compiled-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

beforeAll(() => {
  const r = spawnSync(process.execPath, ['scripts/build-bundles.mjs', '--force'], { cwd: ROOT, encoding: 'utf8' });
  expect(r.status, r.stderr).toBe(0);
});

function run(kind: 'source' | 'compiled', args: string[]) {
  const entry = kind === 'source' ? ['--import', 'tsx', 'scripts/analyze.ts'] : ['scripts/analyze.mjs'];
  const r = spawnSync(process.execPath, [...entry, ...args], { cwd: ROOT, encoding: 'utf8', maxBuffer: 64 << 20 });
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

  it('writes a byte-identical --series file', () => {
    const a = join(dir, 'a.csv');
    const b = join(dir, 'b.csv');
    expect(run('source', [golf, '--series', a]).code).toBe(0);
    expect(run('compiled', [golf, '--series', b]).code).toBe(0);
    expect(readFileSync(b).equals(readFileSync(a))).toBe(true);
  });
});
