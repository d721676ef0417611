// Open real data: PhysioNet gaitpdb walking recordings (ODC-By; citation in tests/fixtures/gaitpdb/README.md).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import layoutJson from '../fixtures/layouts/gaitpdb.json';
import profileJson from '../fixtures/profiles/gaitpdb.json';
import { derive } from '@/lib/signal/derive';
import { createRecordingReader, parseLayout, parseProfile, parseRecording } from '@/lib/signal/read';
import { regularise } from '@/lib/signal/regularise';

const dir = join(__dirname, '../fixtures/gaitpdb');
const files = ['GaCo01_01.txt', 'GaPt03_01.txt', 'JuCo01_01.txt'];
const profile = parseProfile(profileJson);
const layout = parseLayout(layoutJson);
// A second profile reading the file's own per-foot totals, columns 18 and 19 (gaitpdb README).
const totalsProfile = parseProfile({ ...profileJson, sensors: { L1: 18, R1: 19 } });

describe.each(files)('gaitpdb %s', (name) => {
  const text = readFileSync(join(dir, name), 'utf8');
  const raw = parseRecording(text, { profile });
  const totals = parseRecording(text, { profile: totalsProfile });
  const n = raw.time.length;
  const footSum = (foot: 'L' | 'R', i: number) =>
    raw.sensorIds.reduce((acc, id, c) => (id[0] === foot ? acc + raw.channels[c][i] : acc), 0);

  it('reads every row with 16 sensors and the tab/CRLF format', () => {
    expect(raw.sensorIds).toEqual(['L1', 'L2', 'L3', 'L4', 'L5', 'L6', 'L7', 'L8', 'R1', 'R2', 'R3', 'R4', 'R5', 'R6', 'R7', 'R8']);
    expect(n).toBe(text.split('\n').filter((l) => l.trim() !== '').length);
    expect(raw.lines[n - 1]).toBe(n);
    if (name === 'GaCo01_01.txt') {
      // gaitpdb README: 12,119 rows, 0 to 121.1715 s
      expect(n).toBe(12119);
      expect(raw.time[n - 1]).toBeCloseTo(121.1715, 9);
    }
  });

  it('per-foot sums of the sensors equal the file columns 18 and 19 to 0.01 N at every sample', () => {
    // gaitpdb README: column 18 = sum of columns 2-9, column 19 = sum of 10-17, to the two decimals printed
    let worst = 0;
    for (let i = 0; i < n; i++) {
      worst = Math.max(worst, Math.abs(footSum('L', i) - totals.channels[0][i]), Math.abs(footSum('R', i) - totals.channels[1][i]));
    }
    expect(worst).toBeLessThanOrEqual(0.01 + 1e-9);
  });

  it('streams in 64 KiB chunks to the same recording', () => {
    const reader = createRecordingReader({ profile });
    for (let i = 0; i < text.length; i += 65_537) reader.push(text.slice(i, i + 65_537));
    const streamed = reader.end();
    expect(streamed.sensorIds).toEqual(raw.sensorIds);
    expect(Buffer.from(streamed.time.buffer).equals(Buffer.from(raw.time.buffer))).toBe(true);
    expect(Buffer.from(streamed.lines.buffer).equals(Buffer.from(raw.lines.buffer))).toBe(true);
    streamed.channels.forEach((c, k) => expect(Buffer.from(c.buffer).equals(Buffer.from(raw.channels[k].buffer))).toBe(true));
  });

  it('regularises the jittery 0.0099/0.0100 s steps onto a 100 Hz grid', () => {
    const steps = new Set<string>();
    for (let i = 1; i < n; i++) steps.add((raw.time[i] - raw.time[i - 1]).toFixed(4));
    expect(steps.has('0.0099')).toBe(true); // the jitter the README describes is really there
    const u = regularise(raw, layout);
    expect(u.sampleRateHz).toBe(100);
    expect(u.time.length).toBe(Math.floor((raw.time[n - 1] - raw.time[0]) * 100 + 1e-6) + 1);
    // Linear interpolation: every uniform per-foot total lies within the two original totals around it.
    let j = 0;
    let outside = 0;
    for (let i = 0; i < u.time.length; i++) {
      const t = u.time[i];
      while (j < n - 2 && raw.time[j + 1] <= t) j++;
      for (const foot of ['L', 'R'] as const) {
        const v = u.sensorIds.reduce((acc, id, c) => (id[0] === foot ? acc + u.forces[c][i] : acc), 0);
        const a = footSum(foot, j);
        const b = footSum(foot, j + 1);
        if (v < Math.min(a, b) - 1e-9 || v > Math.max(a, b) + 1e-9) outside++;
      }
    }
    expect(outside).toBe(0);
  });

  it('derives shares in 0..100 and each foot COP inside its sensor area', () => {
    const d = derive(regularise(raw, layout), layout, { handedness: 'right', stanceWidthMm: 200 });
    let defined = 0;
    let bad = 0;
    for (let i = 0; i < d.time.length; i++) {
      if (!Number.isNaN(d.leadPct[i])) {
        defined++;
        if (d.leadPct[i] < 0 || d.leadPct[i] > 100) bad++;
      }
      // layouts/gaitpdb.json: sensors span x -26..26 mm, y 26..234 mm
      for (const [x, y] of [[d.leftCopX[i], d.leftCopY[i]], [d.rightCopX[i], d.rightCopY[i]]]) {
        if (!Number.isNaN(x) && (Math.abs(x) > 26 + 1e-9 || y < 26 - 1e-9 || y > 234 + 1e-9)) bad++;
      }
    }
    expect(bad).toBe(0);
    expect(defined).toBeGreaterThan(0.9 * d.time.length); // walking: at least one foot is nearly always loaded
  });
});
