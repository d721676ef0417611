import { describe, expect, it } from 'vitest';
import { SignalInputError } from '@/lib/signal/errors';
import { parseLayout, parseRecording } from '@/lib/signal/read';
import { DEFAULT_MAX_GAP_S, KPA_MM2_TO_N, medianStep, nominalRate, regularise } from '@/lib/signal/regularise';

// Invented two-sensor layout and recordings.
const layout = parseLayout({
  id: 'pair-1',
  name: 'one per foot',
  foot_length_mm: 260,
  sensors: [
    { id: 'L1', foot: 'left', x_mm: 0, y_mm: 30, area_mm2: 700 },
    { id: 'R1', foot: 'right', x_mm: 0, y_mm: 30, area_mm2: 500 },
  ],
});

const csv = (times: number[], l: (i: number) => string | number, meta: string[] = []) =>
  [...meta, 'time_s,L1,R1', ...times.map((t, i) => `${t},${l(i)},${2 * i}`)].join('\n');
const range = (n: number, step = 0.01, t0 = 0) => Array.from({ length: n }, (_, i) => Number((t0 + i * step).toFixed(6)));

function errorOf(fn: () => unknown): SignalInputError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(SignalInputError);
    return e as SignalInputError;
  }
  throw new Error('expected a SignalInputError');
}

describe('nominalRate', () => {
  it('prefers the option, then metadata within 2 %, else the median step', () => {
    const raw = parseRecording(csv(range(20), (i) => i, ['# sample_rate_hz: 101']));
    expect(medianStep(raw.time)).toBeCloseTo(0.01, 12);
    expect(nominalRate(raw, 250)).toEqual({ hz: 250, source: 'option' });
    expect(nominalRate(raw)).toEqual({ hz: 101, source: 'metadata' }); // 1 % off: metadata kept
    const off = parseRecording(csv(range(20), (i) => i, ['# sample_rate_hz: 120']));
    expect(nominalRate(off)).toEqual({ hz: 100, source: 'time-column' }); // spec: the time column rules
    expect(() => nominalRate(raw, 0)).toThrow(RangeError);
  });
});

describe('regularise(raw, layout, opts)', () => {
  it('keeps an already uniform recording as it is', () => {
    const raw = parseRecording(csv(range(20), (i) => 3 * i));
    const u = regularise(raw, layout);
    expect(u.sampleRateHz).toBe(100);
    expect(u.time.length).toBe(20);
    expect(u.sensorIds).toEqual(['L1', 'R1']);
    u.forces[0].forEach((v, i) => expect(v).toBeCloseTo(3 * i, 9));
    expect(u.gaps).toEqual([]);
  });

  it('resamples jittery time linearly onto t0 + i / fs', () => {
    // steps of 0.0099 and 0.0100 s as in the gaitpdb files (shared/data/gaitpdb README)
    const times = [0];
    for (let i = 1; i < 50; i++) times.push(Number((times[i - 1] + (i % 3 === 0 ? 0.0099 : 0.01)).toFixed(4)));
    const raw = parseRecording(csv(times, (i) => 100 * times[i])); // L1 = 100 t: linear, so resampling is exact
    const u = regularise(raw, layout);
    expect(u.sampleRateHz).toBe(100);
    expect(u.time.length).toBe(Math.floor(times[49] * 100 + 1e-6) + 1);
    u.time.forEach((t, i) => expect(t).toBeCloseTo(i / 100, 12));
    u.forces[0].forEach((v, i) => expect(v).toBeCloseTo(u.time[i] * 100, 9));
    expect(raw.time[10]).toBe(times[10]); // input not mutated
  });

  it('fills missing cells and short time gaps by linear interpolation and reports them', () => {
    const times = range(30).filter((_, i) => i < 10 || i > 13); // 0.09 -> 0.14: 0.05 s without samples
    const raw = parseRecording(csv(times, (i) => (i === 20 || i === 21 ? '' : 10 * times[i] * 100)));
    const u = regularise(raw, layout);
    expect(u.time.length).toBe(30);
    u.forces[0].forEach((v, i) => expect(v).toBeCloseTo(10 * i, 9));
    expect(u.gaps).toEqual([
      { start_s: 0.09, end_s: 0.14, filled: true },
      { start_s: times[19], end_s: times[22], filled: true },
    ]);
    expect(Number.isNaN(raw.channels[0][20])).toBe(true); // input not mutated
  });

  it('refuses a gap longer than maxGapS, naming its time and line', () => {
    expect(DEFAULT_MAX_GAP_S).toBe(0.1);
    const times = [...range(10), ...range(10, 0.01, 0.3)];
    const e = errorOf(() => regularise(parseRecording(csv(times, () => 1)), layout));
    expect(e.code).toBe('gap-too-long');
    expect(e.line).toBe(12); // header is line 1, the 11th sample is on line 12
    expect(e.message).toContain('from 0.09 s to 0.3 s');
    expect(regularise(parseRecording(csv(times, () => 1)), layout, { maxGapS: 0.25 }).time.length).toBe(40);
    const cells = errorOf(() => regularise(parseRecording(csv(range(30), (i) => (i >= 5 && i < 20 ? '' : 1))), layout));
    expect({ code: cells.code, line: cells.line, column: cells.column }).toEqual({ code: 'gap-too-long', line: 7, column: 2 });
  });

  it('turns kPa into newtons through each sensor area', () => {
    const raw = parseRecording(csv(range(12), () => 100, ['# units: kPa']));
    const u = regularise(raw, layout);
    // spec section 1: 1 kPa = 0.001 N/mm^2; 100 kPa x 700 mm^2 = 70 N
    expect(KPA_MM2_TO_N).toBe(0.001);
    expect(u.forces[0][0]).toBeCloseTo(70, 12);
    expect(u.forces[1][5]).toBeCloseTo(2 * 5 * 500 * 0.001, 12);
  });

  it('moves the impact marker to the nearest uniform sample', () => {
    const times = range(20).map((t, i) => (i === 7 ? 0.0740 : t));
    const text = ['time_s,L1,R1,impact', ...times.map((t, i) => `${t},1,1,${i === 7 ? 1 : 0}`)].join('\n');
    const u = regularise(parseRecording(text), layout);
    expect(Array.from(u.impact!).indexOf(1)).toBe(7); // 0.074 s -> sample 7 (0.07 s)
  });

  it('names a column the layout does not know, and layout sensors the file lacks', () => {
    const extra = parseRecording(['time_s,L1,R1,L9', ...range(12).map((t) => `${t},1,1,1`)].join('\n'));
    const e = errorOf(() => regularise(extra, layout));
    expect({ code: e.code, line: e.line, column: e.column }).toEqual({ code: 'sensor-not-in-layout', line: 1, column: 4 });
    const fewer = parseRecording(['time_s,L1', ...range(12).map((t) => `${t},1`)].join('\n'));
    expect(errorOf(() => regularise(fewer, layout)).message).toContain('R1');
  });
});

describe('regularise with reuseChannels (the analyze command: raw is read for one analysis)', () => {
  // The reference is regularise without the option on a fresh read of the same text: the forces must be the same
  // bytes; with the option, raw's channels may hold them instead of copies.
  const hex = (a: Float64Array) => Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('hex');
  const jitter = [0];
  for (let i = 1; i < 60; i++) jitter.push(Number((jitter[i - 1] + (i % 3 === 0 ? 0.0099 : 0.0101)).toFixed(4)));
  const cases: [string, string][] = [
    ['uniform', csv(range(40), (i) => (7.3 * i) % 11)],
    ['jittery time (some grid points read samples behind them)', csv(jitter, (i) => (5.1 * i) % 13)],
    ['a missing cell and a short time gap', csv([...range(10), ...range(10, 0.01, 0.14)], (i) => (i === 4 ? '' : (3.7 * i) % 9))],
    ['kPa', csv(range(30), (i) => 1.1 * i, ['# units: kPa'])],
    ['a denser grid than the samples (an option rate above the file rate)', csv(range(30, 0.02), (i) => (2.9 * i) % 7)],
  ];
  it.each(cases)('%s: the same forces', (_name, text) => {
    const rate = _name.startsWith('a denser') ? 100 : undefined;
    const reference = regularise(parseRecording(text), layout, { sampleRateHz: rate });
    const raw = parseRecording(text);
    const u = regularise(raw, layout, { sampleRateHz: rate, reuseChannels: true });
    expect(u.forces.map(hex)).toEqual(reference.forces.map(hex));
    expect(hex(u.time)).toEqual(hex(reference.time));
    expect(u.gaps).toEqual(reference.gaps);
  });

  it('reuses the channel arrays of a uniform recording', () => {
    const raw = parseRecording(csv(range(40), (i) => i));
    const u = regularise(raw, layout, { reuseChannels: true });
    expect(u.forces[0].buffer).toBe(raw.channels[0].buffer);
  });
});
