import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { BASE } from './helpers';

const ROOT = join(__dirname, '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'stanceline-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function cli(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', ...args], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const golf = join(dir, 'golf.csv');
const s = generateSession({ ...BASE, seed: 31, swings: 2, withMarker: true, distractors: ['step', 'waggle'] });
writeFileSync(golf, s.csv());

describe('scripts/analyze.ts (README "The analysis command")', () => {
  it('prints one JSON document in the documented shape and exits 0', () => {
    const series = join(dir, 'series.csv');
    const r = cli(golf, '--series', series);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.stdout); // one JSON document
    expect(doc.recording).toMatchObject({ samples: s.samples, sample_rate_hz: 100, sensors: 16 }); // spec section 4
    expect(doc.swings).toHaveLength(2);
    const sw = doc.swings[0];
    expect(sw).toMatchObject({ index: 1, impact_source: 'marker' });
    expect(typeof sw.start_s).toBe('number');
    expect(Object.keys(sw.events)).toEqual(['address', 'top', 'transition', 'impact', 'finish']);
    expect(Object.keys(sw.at_events.address).sort()).toEqual(['cop_x_mm', 'cop_y_mm', 'lead_heel_pct', 'lead_pct', 'trail_heel_pct']);
    expect(sw.phases[0]).toMatchObject({ name: 'backswing', from: 'address', to: 'top' });
    expect(sw.phases[0].duration_s).toBeCloseTo(sw.events.top - sw.events.address, 3);
    expect(sw.events.impact).toBeCloseTo(s.truth.swings[0].events.impact, 3);
    expect(readFileSync(series, 'utf8').split('\n', 1)[0]).toMatch(/^time_s,left_n,right_n,lead_pct,cop_x_mm,cop_y_mm,cop_speed_mm_s/);
  });

  it('command-line options override the metadata', () => {
    const r = cli(golf, '--handedness', 'left', '--stance-width-mm=450', '--cutoff-hz', '15');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).processing).toMatchObject({ handedness: 'left', stance_width_mm: 450, cutoff_hz: 15 });
  });

  it.each(['GaCo01_01.txt', 'GaPt03_01.txt', 'JuCo01_01.txt'])('reads the open walking file %s and finds no swing', (name) => {
    // PhysioNet gaitpdb (../shared/data/gaitpdb): people walking, so zero swings is the right answer
    const r = cli(`tests/fixtures/gaitpdb/${name}`, '--profile', 'tests/fixtures/profiles/gaitpdb.json', '--layout', 'tests/fixtures/layouts/gaitpdb.json');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.recording.sample_rate_hz).toBe(100); // gaitpdb insoles sample at 100 Hz (its README)
    expect(doc.recording.sensors).toBe(16);
    expect(doc.recording.samples).toBeGreaterThan(5000);
    expect(doc.swings).toEqual([]);
  });

  it('a malformed file: one line on stderr naming line and column, non-zero exit', () => {
    const lines = s.csv().split('\n');
    const bad = join(dir, 'bad.csv');
    const cells = lines[20].split(',');
    cells[3] = 'abc';
    lines[20] = cells.join(',');
    writeFileSync(bad, lines.join('\n'));
    const r = cli(bad);
    expect(r.code).not.toBe(0);
    expect(r.stdout).toBe('');
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/line 21, column 4/);
  });

  it('a file without a layout id asks for --layout', () => {
    const noLayout = join(dir, 'nolayout.csv');
    writeFileSync(noLayout, s.csv().replace('# layout: pair-8\n', ''));
    const r = cli(noLayout);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/--layout/);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
  });

  it('usage errors exit 2', () => {
    expect(cli().code).toBe(2);
    expect(cli(golf, '--bogus', '1').code).toBe(2);
    expect(cli(golf, '--handedness', 'both').code).toBe(2);
    expect(cli(golf, '--stance-width-mm', '-3').code).toBe(2);
  });

  it('a missing file is a one-line error', () => {
    const r = cli(join(dir, 'nope.csv'));
    expect(r.code).toBe(1);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
  });
});
