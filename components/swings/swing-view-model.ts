// Turns GET /api/swings/:id (JSON: null for a missing value) into what the chart components draw (NaN gaps,
// typed arrays, events as a record). Pure: used by the client viewer and the server-rendered lesson summary.
import type { SensorFrames, SwingEvents, TraceSeries } from '@/components/charts';
import type { SensorLayout } from '@/lib/signal/types';
import { eventNames, type RecordingOverview, type SwingDetail, type SwingView, type TimeAxis } from '@/lib/contracts/swings';

const toArray = (a: (number | null)[]) => Float64Array.from(a, (v) => (v === null ? NaN : v));

/** The sample times of a uniform axis, rounded to 0.1 ms. */
export function timeAxis(axis: TimeAxis): Float64Array {
  const out = new Float64Array(axis.count);
  for (let i = 0; i < axis.count; i++) out[i] = Math.round((axis.start + i * axis.step) * 1e4) / 1e4;
  return out;
}

export function traceSeries(s: SwingView['series']): TraceSeries {
  return {
    time: timeAxis(s.time),
    leadPct: toArray(s.leadPct),
    leadHeelPct: toArray(s.leadHeelPct),
    trailHeelPct: toArray(s.trailHeelPct),
    copX: toArray(s.copX),
    copY: toArray(s.copY),
    copSpeed: toArray(s.copSpeed),
  };
}

/**
 * The whole recording for the viewer's "Whole recording" zoom, from the overview (min/max pairs per display bucket).
 * The COP's side-to-side position is not in it (the COP path stays on the swing's own series): NaN, never drawn.
 * null when the overview has fewer than two points.
 */
export function wholeTraceSeries(o: RecordingOverview): TraceSeries | null {
  if (o.time.length < 2) return null;
  return {
    time: Float64Array.from(o.time),
    leadPct: toArray(o.leadPct),
    leadHeelPct: toArray(o.leadHeelPct),
    trailHeelPct: toArray(o.trailHeelPct),
    copX: toArray(o.copX),
    copY: new Float64Array(o.time.length).fill(NaN),
    copSpeed: toArray(o.copSpeed),
  };
}

/** The events as the viewer holds them; null when the swing lacks one (the viewer needs all five). */
export function eventRecord(events: SwingDetail['events'], which: 'timeS' | 'autoTimeS' = 'timeS'): SwingEvents | null {
  const out: Partial<SwingEvents> = {};
  for (const name of eventNames) {
    const e = events.find((x) => x.name === name);
    if (!e) return null;
    // an event never moved by hand has no separate automatic time: its time is the automatic one
    out[name] = which === 'autoTimeS' ? (e.autoTimeS ?? e.timeS) : e.timeS;
  }
  return out as SwingEvents;
}

/** Per-event force snapshots (one object per event) as the stance chart's columns (one array per sensor). */
export function sensorFrames(frames: SwingView['sensorFrames']): SensorFrames | null {
  if (frames.length === 0) return null;
  const sorted = [...frames].sort((a, b) => a.timeS - b.timeS);
  const ids = new Set<string>();
  for (const f of sorted) for (const id of Object.keys(f.forcesN)) ids.add(id);
  const forcesN: Record<string, number[]> = {};
  for (const id of ids) forcesN[id] = sorted.map((f) => f.forcesN[id] ?? NaN);
  return { timeS: sorted.map((f) => f.timeS), forcesN };
}

export function sensorLayout(layout: SwingView['layout']): SensorLayout {
  return layout as SensorLayout;
}

/** Event times that differ from the saved ones by more than the API's rounding (1 ms), as a PATCH body. */
export function movedEvents(saved: SwingEvents, next: SwingEvents): Partial<SwingEvents> {
  const out: Partial<SwingEvents> = {};
  for (const name of eventNames) if (Math.abs(next[name] - saved[name]) > 0.0005) out[name] = Math.round(next[name] * 1000) / 1000;
  return out;
}
