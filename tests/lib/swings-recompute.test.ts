import { describe, expect, it } from 'vitest';
import { analyzeRecording, atEvent, DEFAULT_DERIVE, EVENT_NAMES, parseRecording, phaseStats, PHASES, regularise, WINDOW_MARGIN_S, zeroLagLowpass, type EventName } from '@/lib/signal';
import { generateSession } from '@/lib/signal/synthetic';
import { recomputeSwing } from '@/lib/swings/recompute';
import { cutSwingSeries, nearestSample, parseStoredSeries } from '@/lib/swings/stored-series';

// Re-valuing moved events from a swing's stored window (what PATCH /api/swings/:id does) against the analyzer run
// on the whole recording: the same lib/signal functions at the same samples must give the same numbers, so a
// window that went through JSON and the database loses nothing. The generator is the project's invented data.

const session = generateSession({ seed: 21, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings: 3, withMarker: false });
const raw = parseRecording(session.csv());
const out = analyzeRecording(raw, session.layout, {});
const t = out.series.time;
const stored = out.result.swings.map((s, k) => {
  const from = nearestSample(t, s.start_s);
  const to = nearestSample(t, s.end_s);
  const cut = cutSwingSeries(out.series, from, to, { sensorIds: out.sensorWindows.sensorIds, forces: out.sensorWindows.forces[k] });
  return { from, window: parseStoredSeries(JSON.stringify(cut)) }; // as written to and read from swing_series.data
});

describe('recomputeSwing on the stored window', () => {
  it('gives back exactly the automatic values, phases and tempo at the automatic event times', () => {
    expect(out.result.swings.length).toBe(3);
    out.result.swings.forEach((s, k) => {
      const r = recomputeSwing(stored[k].window, s.events);
      expect(r.times).toEqual(s.events);
      expect(r.atEvents).toEqual(s.at_events); // NaN equals NaN here
      expect(r.phases).toEqual(s.phases);
      expect(r.tempoRatio).toBe(s.tempo_ratio);
    });
  });

  it('values a moved top at its nearest sample and recomputes only the two phases next to it', () => {
    const s = out.result.swings[0];
    const moved = { ...s.events, top: s.events.top + 0.053 }; // 53 ms later: snaps to the sample 50 ms later at 100 Hz
    const r = recomputeSwing(stored[0].window, moved);
    const g = nearestSample(t, moved.top); // the same sample on the whole recording
    expect(r.times.top).toBe(t[g]);
    expect(Math.round((r.times.top - s.events.top) * 1000)).toBe(50);
    expect(r.atEvents.top).toEqual(atEvent(out.series, g));
    const idx = Object.fromEntries(EVENT_NAMES.map((n) => [n, nearestSample(t, moved[n])])) as Record<EventName, number>;
    for (const [k, ph] of PHASES.entries()) {
      const { name, from, to } = ph;
      expect(r.phases[k]).toEqual({ name, from, to, ...phaseStats(out.series, idx[from], idx[to]) });
      if (from !== 'top' && to !== 'top') expect(r.phases[k]).toEqual(s.phases[k]);
    }
    expect(r.phases[0].duration_s).toBeCloseTo(s.phases[0].duration_s + 0.05, 9);
    for (const name of ['address', 'transition', 'impact', 'finish'] as const) expect(r.atEvents[name]).toEqual(s.at_events[name]);
    // moved, then reset: the automatic numbers again, exactly
    const back = recomputeSwing(stored[0].window, s.events);
    expect(back.atEvents).toEqual(s.at_events);
    expect(back.phases).toEqual(s.phases);
  });

  it('refuses events that land on one sample', () => {
    const s = out.result.swings[0];
    expect(() => recomputeSwing(stored[0].window, { ...s.events, transition: s.events.top + 0.001 })).toThrow(RangeError);
  });

  it('keeps per-sensor forces that add up to the lead share of the derived series', () => {
    // lead % = lead-foot force / total force x 100 (README definition); lead = left for a right-handed golfer.
    // Each stored sensor force is rounded to 0.1 N, so 8 sensors can be off by up to 0.4 N in sum.
    const { window } = stored[1];
    const left = window.sensorIds.map((id, k) => (id.startsWith('L') ? k : -1)).filter((k) => k >= 0);
    expect(left.length).toBe(8);
    for (const i of [0, Math.floor(window.time.length / 2), window.time.length - 1]) {
      const lead = left.reduce((sum, k) => sum + window.sensorForces[k][i], 0);
      const total = window.traces.totalN[i]!;
      const pct = window.traces.leadPct[i]!;
      expect(Math.abs(lead - (pct / 100) * total)).toBeLessThan(0.41);
    }
  });

  it('filters each sensor over the window (with its margin) as derive() filters the whole recording', () => {
    // derive(): zeroLagLowpass over every sample of the recording, clamped at 0 N. The windowed filter must agree
    // inside the window to far below the 0.1 N the viewer shows (the transient of the padded edges has died out).
    const u = regularise(raw, session.layout, {});
    let worst = 0;
    let cut = 0; // windows whose margin really cuts the recording on both sides (so the check means something)
    out.result.swings.forEach((s, k) => {
      const from = nearestSample(t, s.start_s);
      const margin = WINDOW_MARGIN_S * u.sampleRateHz;
      if (from - margin > 0 && nearestSample(t, s.end_s) + margin < t.length - 1) cut++;
      out.sensorWindows.sensorIds.forEach((id, j) => {
        const whole = zeroLagLowpass(u.forces[u.sensorIds.indexOf(id)], u.sampleRateHz, DEFAULT_DERIVE.cutoffHz, DEFAULT_DERIVE.filterOrder);
        const win = out.sensorWindows.forces[k][j];
        for (let i = 0; i < win.length; i++) worst = Math.max(worst, Math.abs(win[i] - Math.max(0, whole[from + i])));
      });
    });
    expect(cut).toBeGreaterThan(0);
    expect(worst).toBeLessThan(1e-6);
  });
});
