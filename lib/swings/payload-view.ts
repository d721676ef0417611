// The per-swing parts of the viewer payload (lib/swings/payload-build.ts), as pure functions of a stored window, so
// the job thread (lib/jobs/prepare-results.ts) and the server build them with the same code; and the one place the
// payload's JSON texts are put together.
import type { EventName } from '@/lib/signal';
import { eventNames, phaseNames, type SwingDetail, type SwingView } from '@/lib/contracts/swings';
import { r0 as round0, r1 as round1, r3 as round3 } from '@/lib/db/values';
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

/** A swing's stored part (swing_payloads.body): exactly JSON.stringify of { series, sensorFrames, events, phases }. */
export function swingPartText(seriesJson: string, framesJson: string, eventsPhases: { events: SwingDetail['events']; phases: SwingDetail['phases'] }): string {
  return `{"series":${seriesJson},"sensorFrames":${framesJson},"events":${JSON.stringify(eventsPhases.events)},"phases":${JSON.stringify(eventsPhases.phases)}}`;
}

/** A swing's swing_events, swing_event_values and swing_phase_metrics rows, as read (numbers may be strings). */
export type EventRow = { name: string; time_s: unknown; source: 'auto' | 'manual'; auto_time_s: unknown; misfit: unknown };
export type ValueRow = { event: string; lead_pct: unknown; lead_heel_pct: unknown; trail_heel_pct: unknown; cop_x_mm: unknown; cop_y_mm: unknown };
export type PhaseRow = { phase: string; duration_s: unknown; cop_path_mm: unknown; peak_cop_speed_mm_s: unknown; mean_lead_pct: unknown };

/**
 * The swing's events with the values at them, and its phase table, as the API sends them: in event and phase order
 * (not row order), rounded the way `npm run analyze` prints them (times to 3 decimals, shares and millimetres to 1,
 * mm/s to whole numbers). The one formatter of both the stored swing part and the swing page's tables.
 */
export function eventsPhasesView(events: EventRow[], values: ValueRow[], phases: PhaseRow[]): Pick<SwingDetail, 'events' | 'phases'> {
  return {
    events: eventNames
      .flatMap((name) => {
        const e = events.find((x) => x.name === name);
        return e ? [{ name, e, v: values.find((x) => x.event === name) }] : [];
      })
      .map(({ name, e, v }) => ({
        name,
        timeS: round3(e.time_s) ?? 0,
        source: e.source,
        autoTimeS: round3(e.auto_time_s),
        misfit: Boolean(Number(e.misfit)),
        leadPct: round1(v?.lead_pct),
        leadHeelPct: round1(v?.lead_heel_pct),
        trailHeelPct: round1(v?.trail_heel_pct),
        copXMm: round1(v?.cop_x_mm),
        copYMm: round1(v?.cop_y_mm),
      })),
    phases: phaseNames
      .flatMap((name) => {
        const p = phases.find((x) => x.phase === name);
        return p ? [{ name, p }] : [];
      })
      .map(({ name, p }) => ({
        name,
        durationS: round3(p.duration_s),
        copPathMm: round1(p.cop_path_mm),
        peakCopSpeedMmS: round0(p.peak_cop_speed_mm_s),
        meanLeadPct: round1(p.mean_lead_pct),
      })),
  };
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
