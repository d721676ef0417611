import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db/client';
import { jsonColumn, r1, r2, r3, toIsoDate } from '@/lib/db/values';
import { EVENT_NAMES, REJECT_REASONS, type EventName, type RejectReason } from '@/lib/signal';
import type { CandidateView, PromotionView, RecordingStatus, RecordingView, SessionRecordings, SessionSwing, SwingSummary } from '@/lib/contracts/recordings';
import { labelsOf } from '@/lib/swings/labels';
import { paged, pageOf, sliceOf, WHOLE_LIST, type PageQuery } from '@/lib/pagination';
import type { RecordingOptions } from './options';

// Read models of recordings for the API. Times are seconds on the recording's time axis rounded to 3 decimals and
// percentages to 1, exactly as `npm run analyze` prints them (roundAnalysis), so the two can be compared 1:1.

export type { RecordingStatus, RecordingView };
type SwingView = SwingSummary;
type SessionRecordingsView = SessionRecordings;


type SwingRow = {
  id: number;
  recording_id: number;
  swing_index: number;
  start_s: number;
  end_s: number;
  impact_source: 'marker' | 'detected';
  tempo_ratio: number | null;
  hidden: boolean;
  stale: boolean;
  partial: boolean;
  forward_press_s: number | null;
  forward_press_mm: number | null;
  promoted: 'detected' | 'placed' | null;
};

async function swingViews(query: Knex.QueryBuilder): Promise<SwingView[]> {
  const swings: SwingRow[] = await query.select(
    's.id',
    's.recording_id',
    's.swing_index',
    's.start_s',
    's.end_s',
    's.impact_source',
    's.tempo_ratio',
    's.hidden',
    's.stale',
    's.partial',
    's.forward_press_s',
    's.forward_press_mm',
    's.promoted',
  );
  if (swings.length === 0) return [];
  const ids = swings.map((s) => s.id);
  const events = await db('swing_events').whereIn('swing_id', ids).select('swing_id', 'name', 'time_s', 'source', 'auto_time_s', 'misfit');
  const impacts = await db('swing_event_values').whereIn('swing_id', ids).andWhere({ event: 'impact' }).select('swing_id', 'lead_pct');
  const eventsBySwing = new Map<number, { name: EventName; time_s: number; source: 'auto' | 'manual'; auto_time_s: number | null; misfit: boolean }[]>();
  for (const e of events) {
    if (!eventsBySwing.has(e.swing_id)) eventsBySwing.set(e.swing_id, []);
    eventsBySwing.get(e.swing_id)!.push(e);
  }
  const leadAtImpact = new Map<number, number | null>(impacts.map((v) => [v.swing_id as number, v.lead_pct as number | null]));
  return swings.map((s) => {
    const mine = eventsBySwing.get(s.id) ?? [];
    const times = {} as SwingView['events'];
    const sources = {} as SwingView['eventSources'];
    for (const name of EVENT_NAMES) {
      const e = mine.find((row) => row.name === name);
      times[name] = r3(e?.time_s);
      sources[name] = { source: e?.source ?? 'auto', autoTimeS: r3(e?.auto_time_s), misfit: Boolean(e?.misfit) };
    }
    return {
      id: Number(s.id),
      recordingId: Number(s.recording_id),
      index: Number(s.swing_index),
      startS: r3(s.start_s) as number,
      endS: r3(s.end_s) as number,
      events: times,
      eventSources: sources,
      impactSource: s.impact_source,
      tempoRatio: r2(s.tempo_ratio),
      leadPctAtImpact: r1(leadAtImpact.get(s.id)),
      hidden: Boolean(s.hidden),
      stale: Boolean(s.stale),
      partial: Boolean(s.partial),
      forwardPress: s.forward_press_s === null ? null : { timeS: r3(s.forward_press_s) as number, sizeMm: r1(s.forward_press_mm) as number },
      promoted: s.promoted ?? null,
    };
  });
}

/** The candidates the last analysis rejected, in time order. */
export async function candidateViews(recordingId: number): Promise<CandidateView[]> {
  const rows = await db('recording_candidates').where({ recording_id: recordingId }).orderBy('time_s').select('time_s', 'reason');
  return rows.map((c) => ({ timeS: r3(c.time_s) as number, reason: String(c.reason), reasonText: REJECT_REASONS[c.reason as RejectReason] ?? String(c.reason) }));
}

type RecordingRow = {
  id: number;
  athlete_id: number;
  session_id: number;
  filename: string;
  byte_size: number;
  sha256: string;
  status: RecordingStatus;
  error_message: string | null;
  error_line: number | null;
  error_column: number | null;
  options: unknown;
  parameters: unknown;
  algorithm_version: string | null;
  metadata: unknown;
  created_at: Date;
  processed_at: Date | null;
};

function requested(options: RecordingOptions): Record<string, unknown> {
  return {
    handedness: options.handedness,
    stance_width_mm: options.stanceWidthMm,
    cutoff_hz: options.cutoffHz,
    layout: options.layout ? ('preset' in options.layout ? options.layout.preset : options.layout.custom.id) : null,
  };
}

function toView(row: RecordingRow, swings: SwingView[], candidates: CandidateView[] = [], promotions: PromotionView[] = []): Omit<RecordingView, 'swingsPage'> {
  const options = jsonColumn<RecordingOptions>(row.options)!;
  return {
    id: Number(row.id),
    athleteId: Number(row.athlete_id),
    sessionId: Number(row.session_id),
    filename: row.filename,
    byteSize: Number(row.byte_size),
    sha256: row.sha256,
    status: row.status,
    error: row.status === 'failed' ? { message: row.error_message ?? 'processing failed', line: row.error_line, column: row.error_column } : null,
    parameters: jsonColumn<Record<string, unknown>>(row.parameters) ?? requested(options),
    parameterSources: (jsonColumn<Record<string, unknown>>(row.metadata)?.parameter_sources as Record<string, unknown> | undefined) ?? null,
    options,
    algorithmVersion: row.algorithm_version,
    recording: jsonColumn<Record<string, unknown>>(row.metadata),
    createdAt: new Date(row.created_at).toISOString(),
    processedAt: row.processed_at ? new Date(row.processed_at).toISOString() : null,
    swings,
    candidates,
    promotions,
  };
}

const RECORDING_COLUMNS = [
  'id',
  'athlete_id',
  'session_id',
  'filename',
  'byte_size',
  'sha256',
  'status',
  'error_message',
  'error_line',
  'error_column',
  'options',
  'parameters',
  'algorithm_version',
  'metadata',
  'created_at',
  'processed_at',
];

/** Largest `limit` of GET /api/recordings/:id (a 60-minute lesson has about 120 swings). */
export const RECORDING_SWINGS_MAX = 500;

export async function getRecordingView(id: number, page: PageQuery = WHOLE_LIST): Promise<RecordingView | null> {
  const row: RecordingRow | undefined = await db('recordings').where({ id }).whereNull('binned_at').first(RECORDING_COLUMNS);
  if (!row) return null;
  const [swings, count] = await Promise.all([
    swingViews(paged(db('swings as s').where('s.recording_id', id).orderBy('s.swing_index'), page)),
    db('swings').where({ recording_id: id }).count<{ n: number | string }[]>({ n: '*' }).first(),
  ]);
  const promotions = (await db('candidate_promotions').where({ recording_id: id }).orderBy('id').select('id', 'time_s', 'reason', 'user_id', 'at')).map((p) => ({
    id: Number(p.id),
    timeS: r3(p.time_s) as number,
    reason: String(p.reason),
    userId: p.user_id === null ? null : Number(p.user_id),
    at: new Date(p.at).toISOString(),
  }));
  return { ...toView(row, swings, await candidateViews(id), promotions), swingsPage: pageOf(page, Number(count?.n ?? 0)) };
}

/**
 * The swings of a session in time order with their labels and a `number` 1..N over the whole session: recordings in
 * the order they were recorded (the file's own start time when its metadata has one, else the upload order), swings
 * by start time within each. Every swing is numbered, hidden ones too, so marking one "not a swing" renumbers nothing.
 */
async function sessionSwings(sessionId: number, recordings: RecordingRow[]): Promise<SessionSwing[]> {
  const filenames = new Map(recordings.map((r) => [Number(r.id), r.filename]));
  const swings = await swingViews(
    db('swings as s').join('recordings as r', 'r.id', 's.recording_id').where('r.session_id', sessionId).whereNull('r.binned_at').orderBy(['s.recording_id', 's.swing_index']),
  );
  inSessionOrder(swings, recordings);
  const labelRows = swings.length > 0 ? await db('swing_labels').whereIn('swing_id', swings.map((s) => s.id)).select('swing_id', 'club', 'strike', 'flight', 'tags', 'rating') : [];
  const labelsBySwing = new Map(labelRows.map((row) => [Number(row.swing_id), row as Record<string, unknown>]));
  return swings.map((s, i) => {
    const { notASwing: _hidden, ...labels } = labelsOf(labelsBySwing.get(s.id), s.hidden);
    return { ...s, number: i + 1, filename: filenames.get(s.recordingId) ?? '', labels };
  });
}

/** Sorts a session's swings in time order: recordings by when they were recorded, swings by start within each. */
function inSessionOrder<T extends { recordingId: number; startS: number; index: number }>(swings: T[], recordings: Pick<RecordingRow, 'id' | 'metadata' | 'created_at'>[]): T[] {
  const order = [...recordings].sort((a, b) => recordedAt(a) - recordedAt(b) || Number(a.id) - Number(b.id));
  const rank = new Map(order.map((r, i) => [Number(r.id), i]));
  return swings.sort((a, b) => (rank.get(a.recordingId) ?? 0) - (rank.get(b.recordingId) ?? 0) || a.startS - b.startS || a.index - b.index);
}

/** Each swing's number in its session (the same 1..N as GET /api/sessions/:id/recordings), for the given sessions. */
export async function sessionSwingNumbers(sessionIds: number[]): Promise<Map<number, number>> {
  const out = new Map<number, number>();
  if (sessionIds.length === 0) return out;
  const recordings = await db('recordings').whereIn('session_id', sessionIds).whereNull('binned_at').select('id', 'session_id', 'metadata', 'created_at');
  const swings = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .whereIn('r.session_id', sessionIds)
    .whereNull('r.binned_at')
    .select('s.id', 's.recording_id', 's.start_s', 's.swing_index', 'r.session_id');
  for (const sessionId of sessionIds) {
    const mine = swings
      .filter((s) => Number(s.session_id) === sessionId)
      .map((s) => ({ id: Number(s.id), recordingId: Number(s.recording_id), startS: Number(s.start_s), index: Number(s.swing_index) }));
    inSessionOrder(mine, recordings.filter((r) => Number(r.session_id) === sessionId)).forEach((s, i) => out.set(s.id, i + 1));
  }
  return out;
}

/** When a recording began: the file's `# recorded_at:` metadata line (ISO 8601, spec/insole-csv.md) if it parses, else its upload time. */
function recordedAt(row: Pick<RecordingRow, 'metadata' | 'created_at'>): number {
  // metadata = the reader's summary; its `metadata` holds the file's own `# key: value` lines
  const lines = jsonColumn<{ metadata?: Record<string, unknown> }>(row.metadata)?.metadata;
  const value = lines?.recorded_at;
  const t = typeof value === 'string' ? Date.parse(value) : NaN;
  return Number.isFinite(t) ? t : new Date(row.created_at).getTime();
}

/** Largest `limit` of GET /api/sessions/:id/recordings. */
export const SESSION_RECORDINGS_MAX = 100;

/**
 * A session's recordings with their swings; `page` picks recordings in upload order and the swings of those. Swing
 * numbers still run over the whole session (they are computed over every recording, then the page is cut).
 */
export async function getSessionRecordingsView(sessionId: number, page: PageQuery = WHOLE_LIST): Promise<SessionRecordingsView | null> {
  const session = await db('practice_sessions').where({ id: sessionId }).whereNull('binned_at').first('id', 'athlete_id', 'session_date', 'context', 'location');
  if (!session) return null;
  const rows: RecordingRow[] = await db('recordings').where({ session_id: sessionId }).whereNull('binned_at').orderBy('id').select(RECORDING_COLUMNS);
  const allSwings = await sessionSwings(sessionId, rows);
  const pageRows = sliceOf(rows, page);
  const onPage = new Set(pageRows.map((r) => Number(r.id)));
  const swings = allSwings.filter((s) => onPage.has(s.recordingId));
  return {
    session: {
      id: Number(session.id),
      athleteId: Number(session.athlete_id),
      sessionDate: toIsoDate(session.session_date) ?? '',
      context: session.context,
      location: session.location,
    },
    recordings: pageRows.map((row) => {
      const { swings: _unused, candidates: _none, promotions: _nor, ...rest } = toView(row, []);
      return { ...rest, swingCount: swings.filter((s) => s.recordingId === Number(row.id) && !s.stale).length };
    }),
    swings,
    page: pageOf(page, rows.length),
  };
}
