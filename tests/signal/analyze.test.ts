import { describe, expect, it } from 'vitest';
import { ALGORITHM_VERSION, ANALYSIS_FALLBACKS, roundAnalysis, SERIES_COLUMNS, seriesToCsv } from '@/lib/signal/analyze';
import { DEFAULT_CUTOFF_HZ } from '@/lib/signal/filter';
import { EVENT_NAMES, PHASES } from '@/lib/signal/types';
import { analyze, session, withRaw } from './helpers';

describe('analyzeRecording(raw, layout, opts)', () => {
  const { s, raw } = session({ seed: 21, swings: 3, withMarker: true, distractors: ['waggle', 'walk'] });
  const out = analyze(raw, s);

  it('reports the recording, the processing parameters and every swing', () => {
    const r = out.result;
    expect(r.recording).toMatchObject({ samples: s.samples, sample_rate_hz: 100, sensors: 16 });
    expect(r.recording.duration_s).toBeCloseTo(s.durationS, 9);
    expect(r.processing).toMatchObject({
      handedness: 'right',
      stance_width_mm: 400,
      cutoff_hz: DEFAULT_CUTOFF_HZ,
      sample_rate_hz: 100,
      algorithm_version: ALGORITHM_VERSION,
    });
    expect(r.swings.map((w) => w.index)).toEqual([1, 2, 3]);
    for (const w of r.swings) {
      expect(w.impact_source).toBe('marker');
      expect(Object.keys(w.at_events)).toEqual([...EVENT_NAMES]);
      expect(w.phases.map((p) => p.name)).toEqual(PHASES.map((p) => p.name));
      const backswing = w.phases[0];
      expect(backswing.duration_s).toBeCloseTo(w.events.top - w.events.address, 9);
      expect(w.tempo_ratio).toBeCloseTo((w.events.top - w.events.address) / (w.events.impact - w.events.top), 9);
      // the golf pattern of the generator: trail side at the top, lead side at impact and finish (Ball & Best 2007, J Sports Sci 25(7):757-770 [citation from memory])
      expect(w.at_events.top.lead_pct).toBeLessThan(45);
      expect(w.at_events.impact.lead_pct).toBeGreaterThan(60);
      expect(w.at_events.finish.lead_pct).toBeGreaterThan(85);
      expect(w.at_events.top.cop_x_mm).toBeLessThan(w.at_events.address.cop_x_mm);
    }
  });

  it('options override the metadata: the other handedness mirrors lead %', () => {
    const o = analyze(raw, s, { handedness: 'left', stanceWidthMm: 500, cutoffHz: 12 });
    expect(o.result.processing).toMatchObject({ handedness: 'left', stance_width_mm: 500, cutoff_hz: 12 });
    const right = analyze(raw, s, { cutoffHz: 12 }).series.leadPct;
    for (let i = 0; i < right.length; i += 11) expect(o.series.leadPct[i]).toBeCloseTo(100 - right[i], 9); // lead + trail = 100 %
    expect(o.result.swings).toHaveLength(0); // seen from the other side the swings go the wrong way
  });

  it('falls back to right-handed, 400 mm when neither options nor file say', () => {
    const bare = withRaw(raw, {});
    delete bare.metadata.handedness;
    delete bare.metadata.stance_width_mm;
    const o = analyze(bare, s);
    expect(o.result.processing.handedness).toBe(ANALYSIS_FALLBACKS.handedness);
    expect(o.result.processing.stance_width_mm).toBe(ANALYSIS_FALLBACKS.stanceWidthMm);
  });

  it('does not mutate its input', () => {
    const before = Float64Array.from(raw.channels[0]);
    analyze(raw, s);
    expect(raw.channels[0]).toEqual(before);
  });

  it('roundAnalysis rounds at the JSON edge and never writes NaN', () => {
    const json = JSON.stringify(roundAnalysis(out.result));
    expect(json).not.toMatch(/NaN|Infinity/);
    const back = JSON.parse(json);
    const ev = back.swings[0].events.top;
    expect(Math.round(ev * 1000) / 1000).toBe(ev);
    expect(back.swings[0].phases[0].duration_s).toBeCloseTo(out.result.swings[0].phases[0].duration_s, 3);
  });

  it('seriesToCsv writes the README columns and one row per sample', () => {
    const csv = seriesToCsv(out.series);
    const lines = csv.trimEnd().split('\n');
    expect(lines[0].split(',').slice(0, 7)).toEqual(['time_s', 'left_n', 'right_n', 'lead_pct', 'cop_x_mm', 'cop_y_mm', 'cop_speed_mm_s']); // spec section 4
    expect(lines[0].split(',')).toEqual([...SERIES_COLUMNS]);
    expect(lines).toHaveLength(s.samples + 1);
    const row = lines[1 + 500].split(',').map(Number);
    expect(row[0]).toBeCloseTo(out.series.time[500], 4);
    expect(row[3]).toBeCloseTo(out.series.leadPct[500], 2);
  });
});
