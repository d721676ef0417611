import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findSwings, promoteSwing } from '@/lib/signal/swings';
import { EVENT_NAMES, type RawRecording } from '@/lib/signal/types';
import { analyze, session, withRaw } from './helpers';

// Invariance properties of the whole chain (read -> regularise -> derive -> swings -> events), checked with
// fast-check on generated sessions. Each follows from the definitions: lead % and COP X are defined relative to
// the lead foot (mirror), events are read off the recording's own time axis (shift), and every threshold is a
// percentage, a length or a speed, never a force (scale).
const config = fc.record({
  seed: fc.integer({ min: 1, max: 10_000 }),
  sampleRateHz: fc.constantFrom(100, 200),
  sensorsPerFoot: fc.constantFrom(8 as const, 16 as const),
  units: fc.constantFrom('N' as const, 'kPa' as const),
  handedness: fc.constantFrom('right' as const, 'left' as const),
  stanceWidthMm: fc.integer({ min: 280, max: 520 }),
  withMarker: fc.boolean(),
});
const RUNS = { numRuns: 5, seed: 20261201 }; // fixed fast-check seed: the same cases on every run

function mirrored(raw: RawRecording): RawRecording {
  // swap the data of L<n> and R<n> and flip the handedness: the same swing by a golfer of the other hand
  const index = new Map(raw.sensorIds.map((id, i) => [id, i]));
  const channels = raw.sensorIds.map((id) => raw.channels[index.get((id[0] === 'L' ? 'R' : 'L') + id.slice(1))!]);
  const r = withRaw(raw, { channels });
  r.metadata.handedness = raw.metadata.handedness === 'right' ? 'left' : 'right';
  return r;
}

describe('swing detection properties', () => {
  it('mirroring the feet and the handedness gives the same lead % and the same events', () => {
    fc.assert(
      fc.property(config, (c) => {
        const { s, raw } = session({ ...c, swings: 2, distractors: ['step'] });
        const a = analyze(raw, s);
        const b = analyze(mirrored(raw), s);
        expect(b.result.processing.handedness).not.toBe(a.result.processing.handedness);
        for (let i = 0; i < a.series.leadPct.length; i += 7) expect(b.series.leadPct[i]).toBeCloseTo(a.series.leadPct[i], 9);
        expect(b.result.swings.map((w) => w.events)).toEqual(a.result.swings.map((w) => w.events));
        expect(a.result.swings).toHaveLength(2);
      }),
      RUNS,
    );
  });

  it('shifting the time axis shifts every event by the same amount', () => {
    fc.assert(
      fc.property(config, fc.double({ min: 0.5, max: 5000, noNaN: true }), (c, shift) => {
        const { s, raw } = session({ ...c, swings: 2, distractors: ['walk'] });
        const a = analyze(raw, s).result.swings;
        const b = analyze(withRaw(raw, { time: raw.time.map((t) => t + shift) }), s).result.swings;
        expect(b).toHaveLength(a.length);
        a.forEach((sw, i) => {
          for (const e of EVENT_NAMES) expect(b[i].events[e] - shift).toBeCloseTo(sw.events[e], 6);
        });
      }),
      RUNS,
    );
  });

  it('scaling every force leaves the percentages and the events unchanged', () => {
    fc.assert(
      fc.property(config, fc.double({ min: 0.5, max: 4, noNaN: true }), (c, k) => {
        const { s, raw } = session({ ...c, swings: 2, distractors: ['lift'] });
        const a = analyze(raw, s);
        const b = analyze(withRaw(raw, { channels: raw.channels.map((ch) => ch.map((v) => v * k)) }), s);
        for (let i = 0; i < a.series.leadPct.length; i += 7) expect(b.series.leadPct[i]).toBeCloseTo(a.series.leadPct[i], 6);
        expect(b.result.swings.map((w) => w.events)).toEqual(a.result.swings.map((w) => w.events));
        b.result.swings.forEach((sw, i) => expect(sw.at_events.top.lead_heel_pct).toBeCloseTo(a.result.swings[i].at_events.top.lead_heel_pct, 6));
      }),
      RUNS,
    );
  });

  it('events are always strictly ordered address < top < transition < impact < finish', () => {
    fc.assert(
      fc.property(config, fc.subarray(['walk', 'step', 'waggle', 'retee', 'lift'] as const), (c, distractors) => {
        const { s, raw } = session({ ...c, swings: 3, distractors });
        for (const sw of analyze(raw, s).result.swings) {
          const t = EVENT_NAMES.map((e) => sw.events[e]);
          for (let i = 1; i < t.length; i++) expect(t[i]).toBeGreaterThan(t[i - 1]);
          expect(sw.start_s).toBeLessThan(t[0]);
          expect(sw.end_s).toBeGreaterThan(t[4]);
        }
      }),
      RUNS,
    );
  });
});

describe('findSwings(series, opts)', () => {
  it('lists every candidate with a window and a reason when rejected', () => {
    const { s, raw } = session({ seed: 11, swings: 2, distractors: ['walk', 'retee'] });
    const { series } = analyze(raw, s);
    const { swings, candidates } = findSwings(series, { stanceWidthMm: 400 });
    expect(swings).toHaveLength(2);
    expect(candidates.filter((c) => c.accepted)).toHaveLength(2);
    for (const c of candidates) {
      expect(c.start).toBeLessThanOrEqual(c.peak);
      expect(c.end).toBeGreaterThanOrEqual(c.peak);
      expect(c.accepted ? c.reason === null : typeof c.reason === 'string').toBe(true);
    }
  });
  it('a much higher downswing speed threshold finds nothing', () => {
    const { s, raw } = session({ seed: 12, swings: 2 });
    const { series } = analyze(raw, s);
    expect(findSwings(series, { stanceWidthMm: 400, params: { downswingPeakSpeedMmS: 1e6 } }).swings).toHaveLength(0);
  });
  it('throws RangeError on a marker of the wrong length or a bad stance width', () => {
    const { s, raw } = session({ seed: 13, swings: 1 });
    const { series } = analyze(raw, s);
    expect(() => findSwings(series, { stanceWidthMm: 400, impact: new Uint8Array(3) })).toThrow(RangeError);
    expect(() => findSwings(series, { stanceWidthMm: -1 })).toThrow(RangeError);
  });
});

describe('promoteSwing(series, at, opts)', () => {
  it('detects a swing the strict checks reject (relaxed checks), with events near the generator truth', () => {
    const { s, raw } = session({ seed: 14, swings: 2 });
    const { series } = analyze(raw, s);
    // an impossible still address (10 s) makes the finder reject both swings
    const strict = findSwings(series, { stanceWidthMm: 400, params: { quietMinS: 10 } });
    expect(strict.swings).toHaveLength(0);
    const rejected = strict.candidates.filter((c) => c.reason === 'no-quiet-address');
    expect(rejected).toHaveLength(2);
    rejected.forEach((c, i) => {
      const p = promoteSwing(series, c.peak, { stanceWidthMm: 400, params: { quietMinS: 10 } });
      expect(p.placed).toBe(false);
      const truth = s.truth.swings[i].events;
      // issue targets: address within 100 ms, top within 20 ms, finish within 250 ms (generator truth)
      expect(Math.abs(series.time[p.events.address] - truth.address)).toBeLessThanOrEqual(0.1);
      expect(Math.abs(series.time[p.events.top] - truth.top)).toBeLessThanOrEqual(0.02);
      expect(Math.abs(series.time[p.events.finish] - truth.finish)).toBeLessThanOrEqual(0.25);
    });
  });

  it('places ordered events for the coach to adjust where even relaxed detection fails (walking)', () => {
    const { s, raw } = session({ seed: 15, swings: 0, distractors: ['walk'], durationS: 20 });
    const { series, candidates } = analyze(raw, s);
    const walk = candidates.find((c) => !c.accepted)!;
    expect(walk).toBeDefined();
    const p = promoteSwing(series, walk.peak, { stanceWidthMm: 400 });
    expect(p.placed).toBe(true);
    const e = p.events;
    expect(e.address < e.top && e.top < e.transition && e.transition < e.impact && e.impact < e.finish).toBe(true);
    expect(() => promoteSwing(series, -1, { stanceWidthMm: 400 })).toThrow(RangeError);
  });

  it('a promoted time in analyzeRecording adds the swing and marks it promoted', () => {
    const { s, raw } = session({ seed: 15, swings: 1, distractors: ['walk'] });
    const base = analyze(raw, s);
    const walk = base.candidates.find((c) => !c.accepted)!;
    const out = analyze(raw, s, { promote: [base.series.time[walk.peak]] });
    expect(out.result.swings).toHaveLength(base.result.swings.length + 1);
    expect(out.result.swings.filter((w) => w.promoted)).toHaveLength(1);
    expect(out.result.swings.map((w) => w.index)).toEqual(out.result.swings.map((_, i) => i + 1));
    expect(analyze(raw, s, { promote: [base.result.swings[0].events.top] }).result.swings).toHaveLength(base.result.swings.length); // already a swing
  });
});
