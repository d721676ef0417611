// The per-swing parts of the viewer payload (lib/swings/payload-build.ts), as pure functions of a stored window, so
// the job thread (lib/jobs/prepare-results.ts) and the server build them with the same code; and the one place the
// payload's JSON texts are put together.
import type { EventName } from '@/lib/signal';
import type { SwingView } from '@/lib/contracts/swings';
import { nearestSample, type StoredSwingSeries } from './stored-series';

export type EventTimes = { name: EventName; timeS: number }[];

// Display rounding, at what the charts draw and a reader can tell apart: the time axis as first time + step + count
// (the stored window is on the analysis's uniform grid t0 + i / fs), shares and millimetres to 0.1, COP speed to
// 1 mm/s (whole numbers, as `npm run analyze` prints speeds).
const r6 = (v: number) => Math.round(v * 1e6) / 1e6;
const r1 = (v: number | null) => (v === null ? null : Math.round(v * 10) / 10 || 0);
const r0 = (v: number | null) => (v === null ? null : Math.round(v) || 0);

export function seriesView(stored: StoredSwingSeries | null): SwingView['series'] {
  if (!stored || stored.time.length === 0) {
    return { time: { start: 0, step: 1, count: 0 }, leadPct: [], leadHeelPct: [], trailHeelPct: [], copX: [], copY: [], copSpeed: [] };
  }
  const tr = stored.traces;
  return {
    time: { start: r6(stored.time[0]), step: 1 / stored.sampleRateHz, count: stored.time.length },
    leadPct: tr.leadPct.map(r1),
    leadHeelPct: tr.leadHeelPct.map(r1),
    trailHeelPct: tr.trailHeelPct.map(r1),
    copX: tr.copX.map(r1),
    copY: tr.copY.map(r1),
    copSpeed: tr.copSpeed.map(r0),
  };
}

/** Per-sensor forces at the sample nearest to each event's current time. */
export function sensorFramesView(stored: StoredSwingSeries | null, events: EventTimes): SwingView['sensorFrames'] {
  if (!stored || stored.time.length === 0) return [];
  return events.map((e) => {
    const i = nearestSample(stored.time, e.timeS);
    return { timeS: e.timeS, event: e.name, forcesN: Object.fromEntries(stored.sensorIds.map((id, k) => [id, stored.sensorForces[k]?.[i] ?? 0])) };
  });
}

/** A swing's stored part (swing_payloads.body): exactly JSON.stringify of { series, sensorFrames }. */
export function swingPartText(seriesJson: string, framesJson: string): string {
  return `{"series":${seriesJson},"sensorFrames":${framesJson}}`;
}

/**
 * The GET /api/swings/:id body from the reader's part `head` (a JSON object, made per request) and the two stored
 * payload texts as bytes, spliced without parsing: `{"swing":` + head's fields + the recording's shared fields + the
 * swing's series and sensor frames + `}`.
 */
export function swingBodyBytes(head: string, shared: Uint8Array, swing: Uint8Array): Buffer {
  return Buffer.concat([
    Buffer.from(`{"swing":${head.slice(0, -1)},`, 'utf8'),
    shared.subarray(1, shared.length - 1),
    COMMA,
    swing.subarray(1),
    CLOSE,
  ]);
}

const COMMA = Buffer.from(',');
const CLOSE = Buffer.from('}');
