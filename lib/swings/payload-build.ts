// The viewer's heavy part of GET /api/swings/:id, the same for every reader of a swing, kept as JSON text: the
// recording's part, shared by all its swings (recording_payloads.body: the sensor layout with handedness and stance
// width; recording_payloads.overview: GET /api/recordings/:id/overview, the whole recording with the candidates the
// finder passed over), and the swing's own part (swing_payloads: the columnar full-rate traces, the per-sensor
// forces at the current events, and the events with the values at them and the phase table). Built when the
// recording is processed (lib/jobs/write-results.ts, with the swing parts made in the job thread) and, for the
// swing's part, after each event correction (lib/swings/corrections.ts); spliced into the response as is
// (lib/swings/payload.ts). Free of the app's DB client and of server-only (every function takes the connection),
// because the processing worker also runs outside Next (demo seed, scripts, tests).
import type { Knex } from 'knex';
import { ANALYSIS_FALLBACKS, REJECT_REASONS, type RejectReason } from '@/lib/signal';
import { resolveLayout, recordingOptionsSchema } from '@/lib/recordings/options';
import type { RecordingOverview, SwingView } from '@/lib/contracts/swings';
import { jsonColumn } from '@/lib/db/values';
import { insertInBatches } from '@/lib/db/batch';
import { overviewOf, type DisplaySeries } from '@/lib/jobs/display-series';
import { coarsenDisplay } from './coarsen-display';
import { parseStoredSeries, type StoredSwingSeries } from './stored-series';
import { eventsPhasesView, sensorFramesView, seriesView, swingPartText, type EventRow, type EventTimes, type PhaseRow, type ValueRow } from './payload-view';

export { seriesView, sensorFramesView } from './payload-view';

/**
 * The form of the swing part this code writes (swing_payloads.format). Raise it whenever the part's content changes:
 * rows of another form are rebuilt on their next read (lib/swings/payload.ts payloadBytesOf).
 * 1: series and sensorFrames; 2: also events and phases.
 */
export const SWING_PART_FORMAT = 2;

export type SwingPayload = Pick<SwingView, 'series' | 'layout' | 'handedness' | 'stanceWidthMm' | 'sensorFrames' | 'events' | 'phases'>;

const r3 = (v: unknown) => Math.round(Number(v) * 1000) / 1000 || 0;
const r1 = (v: number | null) => (v === null ? null : Math.round(v * 10) / 10 || 0);

async function storedSeriesOf(conn: Knex, swingId: number): Promise<StoredSwingSeries | null> {
  const row = await conn('swing_series').where({ swing_id: swingId }).first('data');
  return row ? parseStoredSeries(row.data) : null;
}

async function overviewView(conn: Knex, recordingId: number): Promise<RecordingOverview> {
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

/** The swings' events with the values at them and their phase tables, as the API sends them (eventsPhasesView). */
async function currentEventsPhases(conn: Knex, swingIds: number[]): Promise<Map<number, ReturnType<typeof eventsPhasesView>>> {
  const [events, values, phases] = swingIds.length
    ? await Promise.all([
        conn('swing_events').whereIn('swing_id', swingIds).select('swing_id', 'name', 'time_s', 'source', 'auto_time_s', 'misfit'),
        conn('swing_event_values').whereIn('swing_id', swingIds).select('swing_id', 'event', 'lead_pct', 'lead_heel_pct', 'trail_heel_pct', 'cop_x_mm', 'cop_y_mm'),
        conn('swing_phase_metrics').whereIn('swing_id', swingIds).select('swing_id', 'phase', 'duration_s', 'cop_path_mm', 'peak_cop_speed_mm_s', 'mean_lead_pct'),
      ])
    : [[], [], []];
  const bySwing = <T extends { swing_id: unknown }>(rows: T[]) => {
    const out = new Map<number, T[]>(swingIds.map((id) => [id, []]));
    for (const r of rows) out.get(Number(r.swing_id))?.push(r);
    return out;
  };
  const [e, v, p] = [bySwing(events), bySwing(values), bySwing(phases)];
  return new Map(swingIds.map((id) => [id, eventsPhasesView(e.get(id) as EventRow[], v.get(id) as ValueRow[], p.get(id) as PhaseRow[])]));
}

/** The event times the sensor frames are taken at, from the swing's formatted events (eventsPhasesView). */
const eventTimesOf = (detail: ReturnType<typeof eventsPhasesView>): EventTimes => detail.events.map((e) => ({ name: e.name, timeS: e.timeS }));

/**
 * The swing's own parts as JSON text: the columnar traces and the sensor forces at the current events. Every part of
 * the stored payload is made here, in recordingPart or in lib/swings/payload-view.ts (a new part is added there and
 * in SwingPayload).
 */
export function swingPartTexts(stored: StoredSwingSeries | null, events: EventTimes): { seriesJson: string; framesJson: string } {
  return { seriesJson: JSON.stringify(seriesView(stored)), framesJson: JSON.stringify(sensorFramesView(stored, events)) };
}

/** Builds and stores what every swing of the recording shares: its part of the swing view, and the overview. */
async function storeRecordingPart(conn: Knex, recordingId: number): Promise<{ body: string; overview: string }> {
  const [overview, layout] = await Promise.all([overviewView(conn, recordingId), layoutView(conn, recordingId)]);
  const texts = { body: JSON.stringify(layout), overview: JSON.stringify(overview) };
  await conn.raw(
    'INSERT INTO recording_payloads (recording_id, body, overview) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE body = VALUES(body), overview = VALUES(overview), built_at = CURRENT_TIMESTAMP(3)',
    [recordingId, texts.body, texts.overview],
  );
  return texts;
}

/**
 * (Re)builds the recording's shared part and the part of every one of its swings, inside the caller's transaction.
 * `prepared` holds the swing parts the job thread already made (lib/jobs/prepare-results.ts) for swings whose events
 * are the automatic ones; the others are built here from swing_series and swing_events.
 */
export async function storeRecordingPayloads(
  conn: Knex,
  recordingId: number,
  prepared?: Map<number, { seriesJson: string; framesJson: string }>,
): Promise<void> {
  await storeRecordingPart(conn, recordingId);
  const swingIds = (await conn('swings').where({ recording_id: recordingId }).select('id')).map((r) => Number(r.id));
  if (swingIds.length === 0) return;
  const detail = await currentEventsPhases(conn, swingIds);
  const rows = [];
  for (const id of swingIds) {
    const parts = prepared?.get(id) ?? swingPartTexts(await storedSeriesOf(conn, id), eventTimesOf(detail.get(id)!));
    rows.push({ swing_id: id, body: swingPartText(parts.seriesJson, parts.framesJson, detail.get(id)!), format: SWING_PART_FORMAT });
  }
  await conn('swing_payloads').whereIn('swing_id', swingIds).delete();
  await insertInBatches(conn, 'swing_payloads', rows);
}

/**
 * (Re)builds one swing's own part (after its events moved, or for a swing processed before payloads were stored).
 * Everything that changes a swing's events, values or phases calls this or storeRecordingPayloads in the same
 * transaction (lib/swings/corrections.ts, lib/jobs/write-results.ts): the view reads them from here.
 */
export async function storeSwingPayload(conn: Knex, swingId: number): Promise<string> {
  const [detail, stored] = await Promise.all([currentEventsPhases(conn, [swingId]), storedSeriesOf(conn, swingId)]);
  const parts = swingPartTexts(stored, eventTimesOf(detail.get(swingId)!));
  const body = swingPartText(parts.seriesJson, parts.framesJson, detail.get(swingId)!);
  await conn.raw(
    'INSERT INTO swing_payloads (swing_id, body, format) VALUES (?, ?, ?) ON DUPLICATE KEY UPDATE body = VALUES(body), format = VALUES(format), built_at = CURRENT_TIMESTAMP(3)',
    [swingId, body, SWING_PART_FORMAT],
  );
  return body;
}

/** The recording's part of the swing view (layout, handedness, stance width), built and stored when missing. */
export async function recordingPartText(conn: Knex, recordingId: number): Promise<string> {
  const row = await conn('recording_payloads').where({ recording_id: recordingId }).first('body');
  return row ? String(row.body) : (await storeRecordingPart(conn, recordingId)).body;
}

/** The recording's overview as JSON text (GET /api/recordings/:id/overview), built and stored when missing. */
export async function recordingOverviewText(conn: Knex, recordingId: number): Promise<string> {
  const row = await conn('recording_payloads').where({ recording_id: recordingId }).first('overview');
  return row ? String(row.overview) : (await storeRecordingPart(conn, recordingId)).overview;
}
