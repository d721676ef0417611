// The viewer's heavy, per-swing part of GET /api/swings/:id, the same for every reader of a swing: the columnar
// full-rate traces, the recording's overview with the candidates the finder passed over, the sensor layout with
// handedness and stance width, and the per-sensor forces at the current events. Built ONCE per swing by
// `buildSwingPayload` when the recording is processed (lib/jobs/write-results.ts) and after each event correction
// (lib/swings/corrections.ts), kept as JSON text in swing_payloads, and spliced into the response as is
// (lib/swings/payload.ts). Free of the app's DB client and of server-only (every function takes the connection),
// because the processing worker also runs outside Next (demo seed, scripts, tests).
import type { Knex } from 'knex';
import { ANALYSIS_FALLBACKS, EVENT_NAMES, REJECT_REASONS, type EventName, type RejectReason } from '@/lib/signal';
import { resolveLayout, recordingOptionsSchema } from '@/lib/recordings/options';
import type { SwingView } from '@/lib/contracts/swings';
import { jsonColumn } from '@/lib/db/values';
import { overviewOf, type DisplaySeries } from '@/lib/jobs/display-series';
import { coarsenDisplay } from './coarsen-display';
import { nearestSample, parseStoredSeries, type StoredSwingSeries } from './stored-series';

export type SwingPayload = Pick<SwingView, 'series' | 'overview' | 'layout' | 'handedness' | 'stanceWidthMm' | 'sensorFrames'>;
type RecordingPart = Omit<SwingPayload, 'series' | 'sensorFrames'>;
type EventTimes = { name: EventName; timeS: number }[];

// Display rounding, at what the charts draw and a reader can tell apart: the time axis as first time + step + count
// (the stored window is on the analysis's uniform grid t0 + i / fs), shares and millimetres to 0.1, COP speed to
// 1 mm/s (whole numbers, as `npm run analyze` prints speeds).
const r6 = (v: number) => Math.round(v * 1e6) / 1e6;
const r3 = (v: unknown) => Math.round(Number(v) * 1000) / 1000 || 0;
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

async function storedSeriesOf(conn: Knex, swingId: number): Promise<StoredSwingSeries | null> {
  const row = await conn('swing_series').where({ swing_id: swingId }).first('data');
  return row ? parseStoredSeries(row.data) : null;
}

async function overviewView(conn: Knex, recordingId: number): Promise<SwingView['overview']> {
  const row = await conn('recording_series').where({ recording_id: recordingId }).first('bucket_s', 'data');
  const candidates = (await conn('recording_candidates').where({ recording_id: recordingId }).orderBy('time_s').select('time_s', 'reason')).map((c) => ({
    timeS: r3(c.time_s),
    reason: String(c.reason),
    reasonText: REJECT_REASONS[c.reason as RejectReason] ?? String(c.reason),
  }));
  if (!row) return { time: [], leadPct: [], copX: [], leadHeelPct: [], trailHeelPct: [], copSpeed: [], candidates };
  const data = jsonColumn<Pick<DisplaySeries, 't' | 'traces'>>(row.data)!;
  // the whole recording for the overview strip and the viewer's "Whole recording" zoom, coarsened for display
  const names = ['lead_pct', 'cop_x_mm', 'lead_heel_pct', 'trail_heel_pct', 'cop_speed_mm_s'] as const;
  const o = overviewOf(coarsenDisplay({ bucketS: Number(row.bucket_s), t: data.t, traces: data.traces }, names), names);
  const tr = o.traces;
  return {
    time: o.time,
    leadPct: tr.lead_pct.map(r1),
    copX: tr.cop_x_mm.map(r1),
    leadHeelPct: tr.lead_heel_pct.map(r1),
    trailHeelPct: tr.trail_heel_pct.map(r1),
    copSpeed: tr.cop_speed_mm_s.map(r1),
    candidates,
  };
}

/** The layout the recording was processed with, and the handedness and stance width of its parameters. */
async function layoutView(conn: Knex, recordingId: number): Promise<Pick<SwingView, 'layout' | 'handedness' | 'stanceWidthMm'>> {
  const row = await conn('recordings').where({ id: recordingId }).first('options', 'parameters', 'metadata');
  const options = recordingOptionsSchema.parse(jsonColumn(row.options));
  const params = jsonColumn<{ handedness?: 'right' | 'left'; stance_width_mm?: number }>(row.parameters) ?? {};
  const meta = jsonColumn<{ metadata?: Record<string, string> }>(row.metadata)?.metadata ?? {};
  return {
    layout: resolveLayout(options, meta),
    handedness: params.handedness ?? options.handedness ?? options.profileHandedness ?? ANALYSIS_FALLBACKS.handedness,
    stanceWidthMm: Number(params.stance_width_mm ?? options.stanceWidthMm ?? options.profileStanceWidthMm ?? ANALYSIS_FALLBACKS.stanceWidthMm),
  };
}

/** What every swing of one recording shares. */
async function recordingPart(conn: Knex, recordingId: number): Promise<RecordingPart> {
  const [overview, layout] = await Promise.all([overviewView(conn, recordingId), layoutView(conn, recordingId)]);
  return { overview, ...layout };
}

async function currentEvents(conn: Knex, swingIds: number[]): Promise<Map<number, EventTimes>> {
  const rows = swingIds.length ? await conn('swing_events').whereIn('swing_id', swingIds).select('swing_id', 'name', 'time_s') : [];
  const out = new Map<number, EventTimes>();
  for (const id of swingIds) out.set(id, []);
  for (const r of rows) out.get(Number(r.swing_id))!.push({ name: r.name, timeS: r3(r.time_s) });
  for (const list of out.values()) list.sort((a, b) => EVENT_NAMES.indexOf(a.name) - EVENT_NAMES.indexOf(b.name));
  return out;
}

/**
 * THE payload builder: one swing's viewer payload from what the builders read. Every part of the stored payload is
 * made here (a new part of the viewer payload is added here and in SwingPayload).
 */
export function buildSwingPayload(shared: RecordingPart, stored: StoredSwingSeries | null, events: EventTimes): SwingPayload {
  return { series: seriesView(stored), ...shared, sensorFrames: sensorFramesView(stored, events) };
}

/**
 * (Re)builds the payloads of every swing of a recording inside the caller's transaction. `known` holds windows the
 * caller has in memory (the analysis just made them); the others are read from swing_series.
 */
export async function storeRecordingPayloads(conn: Knex, recordingId: number, known?: Map<number, StoredSwingSeries>): Promise<void> {
  const swingIds = (await conn('swings').where({ recording_id: recordingId }).select('id')).map((r) => Number(r.id));
  if (swingIds.length === 0) return;
  const [shared, events] = await Promise.all([recordingPart(conn, recordingId), currentEvents(conn, swingIds)]);
  const rows = [];
  for (const id of swingIds) {
    const stored = known?.get(id) ?? (await storedSeriesOf(conn, id));
    rows.push({ swing_id: id, body: JSON.stringify(buildSwingPayload(shared, stored, events.get(id)!)) });
  }
  await conn('swing_payloads').whereIn('swing_id', swingIds).delete();
  for (let i = 0; i < rows.length; i += 8) await conn('swing_payloads').insert(rows.slice(i, i + 8));
}

/** (Re)builds one swing's payload (after its events moved, or for a swing processed before payloads were stored). */
export async function storeSwingPayload(conn: Knex, swingId: number): Promise<string> {
  const swing = await conn('swings').where({ id: swingId }).first('recording_id');
  const [shared, events, stored] = await Promise.all([recordingPart(conn, Number(swing.recording_id)), currentEvents(conn, [swingId]), storedSeriesOf(conn, swingId)]);
  const body = JSON.stringify(buildSwingPayload(shared, stored, events.get(swingId)!));
  await conn.raw('INSERT INTO swing_payloads (swing_id, body) VALUES (?, ?) ON DUPLICATE KEY UPDATE body = VALUES(body), built_at = CURRENT_TIMESTAMP(3)', [swingId, body]);
  return body;
}
