import 'server-only';
import { ANALYSIS_FALLBACKS, REJECT_REASONS, type EventName, type RejectReason } from '@/lib/signal';
import { resolveLayout, recordingOptionsSchema } from '@/lib/recordings/options';
import type { SwingView } from '@/lib/contracts/swings';
import { db } from '@/lib/db/client';
import { jsonColumn, toIsoDate } from '@/lib/db/values';
import { overviewOf, type DisplaySeries } from '@/lib/jobs/display-series';
import { sessionSwingNumbers } from '@/lib/recordings/views';
import { nearestSample, parseStoredSeries, type StoredSwingSeries } from './stored-series';
import { coarsenDisplay } from './coarsen-display';

// The viewer's parts of GET /api/swings/:id besides the numbers: the swing's full-rate traces, the recording's
// overview, neighbours for previous/next and the overlay pick-list, the sensor layout and per-sensor forces at events.

// Display rounding: time to 0.1 ms, shares / mm / mm/s to 0.01 (well below what a chart or a reader can tell apart).
const r4 = (v: number) => Math.round(v * 1e4) / 1e4;
const r2 = (v: number | null) => (v === null ? null : Math.round(v * 100) / 100 || 0);

export async function storedSeriesOf(swingId: number): Promise<StoredSwingSeries | null> {
  const row = await db('swing_series').where({ swing_id: swingId }).first('data');
  return row ? parseStoredSeries(row.data) : null;
}

export function seriesView(stored: StoredSwingSeries | null): SwingView['series'] {
  if (!stored) return { time: [], leadPct: [], leadHeelPct: [], trailHeelPct: [], copX: [], copY: [], copSpeed: [] };
  const tr = stored.traces;
  return {
    time: stored.time.map(r4),
    leadPct: tr.leadPct.map(r2),
    leadHeelPct: tr.leadHeelPct.map(r2),
    trailHeelPct: tr.trailHeelPct.map(r2),
    copX: tr.copX.map(r2),
    copY: tr.copY.map(r2),
    copSpeed: tr.copSpeed.map(r2),
  };
}

/** Per-sensor forces at the sample nearest to each event's current time. */
export function sensorFramesView(stored: StoredSwingSeries | null, events: { name: EventName; timeS: number }[]): SwingView['sensorFrames'] {
  if (!stored || stored.time.length === 0) return [];
  return events.map((e) => {
    const i = nearestSample(stored.time, e.timeS);
    return { timeS: e.timeS, event: e.name, forcesN: Object.fromEntries(stored.sensorIds.map((id, k) => [id, stored.sensorForces[k]?.[i] ?? 0])) };
  });
}

export async function overviewView(recordingId: number): Promise<SwingView['overview']> {
  const row = await db('recording_series').where({ recording_id: recordingId }).first('bucket_s', 'data');
  const candidates = (await db('recording_candidates').where({ recording_id: recordingId }).orderBy('time_s').select('time_s', 'reason')).map((c) => ({
    timeS: Math.round(Number(c.time_s) * 1000) / 1000,
    reason: String(c.reason),
    reasonText: REJECT_REASONS[c.reason as RejectReason] ?? String(c.reason),
  }));
  if (!row) return { time: [], leadPct: [], copX: [], leadHeelPct: [], trailHeelPct: [], copSpeed: [], candidates };
  const data = jsonColumn<Pick<DisplaySeries, 't' | 'traces'>>(row.data)!;
  // the whole recording for the overview strip and the viewer's "Whole recording" zoom, coarsened for display
  const names = ['lead_pct', 'cop_x_mm', 'lead_heel_pct', 'trail_heel_pct', 'cop_speed_mm_s'] as const;
  const o = overviewOf(coarsenDisplay({ bucketS: Number(row.bucket_s), t: data.t, traces: data.traces }, names), names);
  const tr = o.traces;
  return { time: o.time, leadPct: tr.lead_pct, copX: tr.cop_x_mm, leadHeelPct: tr.lead_heel_pct, trailHeelPct: tr.trail_heel_pct, copSpeed: tr.cop_speed_mm_s, candidates };
}

export async function siblingsView(swingId: number, recordingId: number, swingIndex: number, athleteId: number): Promise<SwingView['siblings']> {
  const [prev, next, same] = await Promise.all([
    db('swings').where({ recording_id: recordingId }).andWhere('swing_index', '<', swingIndex).orderBy('swing_index', 'desc').first('id'),
    db('swings').where({ recording_id: recordingId }).andWhere('swing_index', '>', swingIndex).orderBy('swing_index', 'asc').first('id'),
    db('swings as s')
      .join('recordings as r', 'r.id', 's.recording_id')
      .join('practice_sessions as p', 'p.id', 'r.session_id')
      .leftJoin('swing_labels as l', 'l.swing_id', 's.id')
      .where('r.athlete_id', athleteId)
      .whereNull('r.binned_at')
      .whereNull('p.binned_at')
      .andWhere('s.hidden', false)
      .andWhere('s.stale', false)
      .andWhereNot('s.id', swingId)
      .orderBy([{ column: 'p.session_date', order: 'desc' }, { column: 'p.id', order: 'desc' }, { column: 'r.id', order: 'desc' }, { column: 's.swing_index', order: 'asc' }])
      .limit(200)
      .select('s.id', 's.swing_index', 'r.filename', 'p.id as session_id', 'p.session_date', 'p.context', 'p.location', 'l.club'),
  ]);
  // Grouped by session (newest first), each session's swings in time order with their session-wide number.
  const numbers = await sessionSwingNumbers([...new Set(same.map((s) => Number(s.session_id)))]);
  const sessionRank = new Map<number, number>();
  for (const s of same) if (!sessionRank.has(Number(s.session_id))) sessionRank.set(Number(s.session_id), sessionRank.size);
  const rows = same
    .map((s) => ({ s, n: numbers.get(Number(s.id)) ?? Number(s.swing_index) }))
    .sort((a, b) => sessionRank.get(Number(a.s.session_id))! - sessionRank.get(Number(b.s.session_id))! || a.n - b.n);
  const contextName: Record<string, string> = { lesson: 'lesson', practice: 'practice', 'on-course': 'on course' };
  return {
    previousId: prev ? Number(prev.id) : null,
    nextId: next ? Number(next.id) : null,
    sameAthlete: rows.map(({ s, n }) => ({
      id: Number(s.id),
      label: `Swing ${n}${s.club ? ` · ${String(s.club).replace(/^iron-(\d)$/, '$1-iron')}` : ''} · ${s.filename}`,
      group: `${toIsoDate(s.session_date)} · ${contextName[s.context] ?? s.context}${s.location ? ` · ${s.location}` : ''}`,
    })),
  };
}

/** The layout the recording was processed with, and the handedness and stance width of its parameters. */
export async function layoutView(recordingId: number): Promise<Pick<SwingView, 'layout' | 'handedness' | 'stanceWidthMm'>> {
  const row = await db('recordings').where({ id: recordingId }).first('options', 'parameters', 'metadata');
  const options = recordingOptionsSchema.parse(jsonColumn(row.options));
  const params = jsonColumn<{ handedness?: 'right' | 'left'; stance_width_mm?: number }>(row.parameters) ?? {};
  const meta = jsonColumn<{ metadata?: Record<string, string> }>(row.metadata)?.metadata ?? {};
  return {
    layout: resolveLayout(options, meta),
    handedness: params.handedness ?? options.handedness ?? options.profileHandedness ?? ANALYSIS_FALLBACKS.handedness,
    stanceWidthMm: Number(params.stance_width_mm ?? options.stanceWidthMm ?? options.profileStanceWidthMm ?? ANALYSIS_FALLBACKS.stanceWidthMm),
  };
}

export async function correctionsView(swingId: number): Promise<SwingView['corrections']> {
  const rows = await db('swing_event_corrections as c')
    .leftJoin('users as u', 'u.id', 'c.user_id')
    .where('c.swing_id', swingId)
    .orderBy([{ column: 'c.at', order: 'desc' }, { column: 'c.id', order: 'desc' }])
    .select('c.event', 'c.from_s', 'c.to_s', 'c.kind', 'u.name', 'c.at');
  return rows.map((r) => ({
    event: r.event,
    fromS: Math.round(Number(r.from_s) * 1000) / 1000,
    toS: Math.round(Number(r.to_s) * 1000) / 1000,
    kind: r.kind,
    byName: r.name ?? 'Former user',
    at: new Date(r.at).toISOString(),
  }));
}
