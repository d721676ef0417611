import { describe, expect, it } from 'vitest';
import { parseRecording } from '@/lib/signal/read';
import { regularise } from '@/lib/signal/regularise';
import { DISTRACTORS, generateSession } from '@/lib/signal/synthetic';
import { EVENT_NAMES } from '@/lib/signal/types';
import { BASE } from './helpers';

describe('generateSession(opts)', () => {
  it('is deterministic for a seed and differs between seeds', () => {
    const a = generateSession({ ...BASE, seed: 5, distractors: DISTRACTORS }).csv();
    expect(generateSession({ ...BASE, seed: 5, distractors: DISTRACTORS }).csv()).toBe(a);
    expect(generateSession({ ...BASE, seed: 6, distractors: DISTRACTORS }).csv()).not.toBe(a);
  });

  it('writes recording CSV format 1 with the metadata, the layout ids and one marker per swing', () => {
    const s = generateSession({ ...BASE, swings: 4, withMarker: true, sensorsPerFoot: 16, handedness: 'left', metadata: { athlete: 'Demo Student' } });
    const text = s.csv();
    expect(text.split('\n', 1)[0]).toBe('# format: stanceline-insole/1'); // spec section 1
    const raw = parseRecording(text);
    expect(raw.metadata).toMatchObject({ handedness: 'left', units: 'N', layout: 'pair-16', stance_width_mm: '400', athlete: 'Demo Student' });
    expect(raw.sensorIds).toHaveLength(32);
    expect(raw.time.length).toBe(s.samples);
    expect(raw.impact!.reduce((a, b) => a + b, 0)).toBe(4);
    expect(s.chunks().next().value).toMatch(/^# format/);
    expect(Array.from(s.chunks()).join('')).toBe(text);
  });

  it('kPa and N files of one seed give the same forces (1 kPa = 0.001 N/mm2, spec section 1)', () => {
    const n = generateSession({ ...BASE, seed: 9 });
    const k = generateSession({ ...BASE, seed: 9, units: 'kPa' });
    const un = regularise(parseRecording(n.csv()), n.layout);
    const uk = regularise(parseRecording(k.csv()), k.layout);
    for (let c = 0; c < un.forces.length; c++) {
      for (let i = 0; i < un.forces[c].length; i += 13) expect(Math.abs(uk.forces[c][i] - un.forces[c][i])).toBeLessThan(0.01); // 2-decimal rounding
    }
  });

  it('follows the golf pattern: even address, trail at the top, lead at impact and finish, tempo near 3:1', () => {
    const s = generateSession({ ...BASE, swings: 6, distractors: DISTRACTORS });
    for (const sw of s.truth.swings) {
      const t = EVENT_NAMES.map((e) => sw.events[e]);
      for (let i = 1; i < t.length; i++) expect(t[i]).toBeGreaterThan(t[i - 1]);
      expect(sw.backswingS).toBeGreaterThanOrEqual(0.7); // backswing 0.7-1.0 s (Grober & Cholewicki, tempo of the golf swing, Yale)
      expect(sw.backswingS).toBeLessThanOrEqual(1.0);
      expect(sw.downswingS).toBeGreaterThanOrEqual(0.24); // downswing ~0.27 s (Grober & Cholewicki)
      expect(sw.downswingS).toBeLessThanOrEqual(0.3);
      const tempo = (sw.events.top - sw.events.address) / (sw.events.impact - sw.events.top);
      expect(tempo).toBeGreaterThan(2.2); // ~3:1 (Grober & Cholewicki)
      expect(tempo).toBeLessThan(4.2);
    }
  });

  it('fills a long lesson up to durationS', () => {
    const s = generateSession({ ...BASE, swings: 2, durationS: 90 });
    expect(s.durationS).toBeCloseTo(90, 6);
    expect(s.truth.swings).toHaveLength(2);
  });

  it('rejects bad options with RangeError', () => {
    expect(() => generateSession({ ...BASE, seed: 1.5 })).toThrow(RangeError);
    expect(() => generateSession({ ...BASE, sampleRateHz: 0 })).toThrow(RangeError);
    expect(() => generateSession({ ...BASE, stanceWidthMm: 20 })).toThrow(RangeError);
    expect(() => generateSession({ ...BASE, swings: 10, durationS: 20 })).toThrow(RangeError);
    expect(() => generateSession({ ...BASE, distractors: ['dance' as never] })).toThrow(RangeError);
  });
});
