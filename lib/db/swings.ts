import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { compileOnce } from '@/lib/db/compiled';
import { jsonColumn, r1, r2, r3, toIsoDate } from '@/lib/db/values';
import { ForbiddenError, NotFoundError } from '@/lib/http';
import { accessFromRow } from '@/lib/auth/access';
import type { SwingDetail, SwingView } from '@/lib/contracts/swings';
import { listAnnotations } from '@/lib/swings/annotations';
import { labelsOf } from '@/lib/swings/labels';
import { correctionsView } from '@/lib/swings/viewer-data';
import type { Knex } from 'knex';
import { payloadBytesOf } from '@/lib/swings/payload';
import { eventsPhasesView, swingBodyBytes, type EventRow, type PhaseRow, type ValueRow } from '@/lib/swings/payload-view';
import type { SwingPayload } from '@/lib/swings/payload-build';

// One swing with its phase table and the values at its events, for the swing page and GET /api/swings/:id; with
// getSwingForViewer also the viewer's data (lib/swings/viewer-data.ts), labels, notes and the correction audit.
// Numbers are rounded the way `npm run analyze` prints them (lib/recordings/views.ts): times to 3 decimals,
// percentages and millimetres to 1, mm/s to whole numbers, the tempo ratio to 2, so the page and the CLI can be compared 1:1.

function jsonObject(value: unknown): Record<string, unknown> {
  return jsonColumn<Record<string, unknown>>(value) ?? {};
}

type ReaderPart = Omit<SwingView, keyof SwingPayload>;
type Row = Record<string, unknown>;

const DETAIL_COLUMNS = [
  's.id',
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
  'r.id as recording_id',
  'r.filename',
  'r.algorithm_version',
  'r.parameters',
  'r.athlete_id',
  'p.id as session_id',
  'p.session_date',
  'p.context',
  'a.display_name',
  'a.date_of_birth',
  // for the access rule (lib/auth/access.ts accessFromRow)
  'a.academy_id',
  'a.user_id',
  'ca.athlete_id as coach_link',
];

/** The swing view's query (swingRow), its SQL text compiled once per shape (lib/db/compiled.ts). */
function swingQuery(conn: Knex, view: boolean, viewerId: number, swingId: number): Knex.QueryBuilder {
  const q = conn('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .join('athletes as a', 'a.id', 'r.athlete_id')
    .leftJoin('coach_athletes as ca', (j) => j.on('ca.athlete_id', 'a.id').andOnVal('ca.coach_user_id', viewerId))
    .where('s.id', swingId)
    .whereNull('r.binned_at')
    .whereNull('p.binned_at');
  // the swing's events, values at events and phase rows as JSON arrays in the same row (one round trip, not four);
  // the view reads them from the swing's stored part instead (lib/swings/payload-build.ts), made with the same
  // formatter whenever they change
  const columns: (string | Knex.Raw)[] = [...DETAIL_COLUMNS];
  if (!view) columns.push(
    conn.raw(
      "(SELECT JSON_ARRAYAGG(JSON_OBJECT('name', e.name, 'time_s', e.time_s, 'source', e.source, 'auto_time_s', e.auto_time_s, 'misfit', e.misfit)) FROM swing_events e WHERE e.swing_id = s.id) AS events_json",
    ),
    conn.raw(
      "(SELECT JSON_ARRAYAGG(JSON_OBJECT('event', v.event, 'lead_pct', v.lead_pct, 'lead_heel_pct', v.lead_heel_pct, 'trail_heel_pct', v.trail_heel_pct, 'cop_x_mm', v.cop_x_mm, 'cop_y_mm', v.cop_y_mm)) FROM swing_event_values v WHERE v.swing_id = s.id) AS values_json",
    ),
    conn.raw(
      "(SELECT JSON_ARRAYAGG(JSON_OBJECT('phase', m.phase, 'duration_s', m.duration_s, 'cop_path_mm', m.cop_path_mm, 'peak_cop_speed_mm_s', m.peak_cop_speed_mm_s, 'mean_lead_pct', m.mean_lead_pct)) FROM swing_phase_metrics m WHERE m.swing_id = s.id) AS phases_json",
    ),
  );
  if (view) {
    q.leftJoin('swing_labels as l', 'l.swing_id', 's.id')
      .leftJoin('swing_payloads as sp', 'sp.swing_id', 's.id')
      .leftJoin('recording_payloads as rp', 'rp.recording_id', 'r.id');
    columns.push(
      'l.swing_id as label_row',
      'l.club',
      'l.strike',
      'l.flight',
      'l.tags',
      'l.rating',
      conn.raw('CAST(sp.body AS BINARY) AS swing_part'),
      'sp.format as swing_part_format',
      conn.raw('CAST(rp.body AS BINARY) AS shared_part'),
      conn.raw('(SELECT x.id FROM swings x WHERE x.recording_id = s.recording_id AND x.swing_index < s.swing_index ORDER BY x.swing_index DESC LIMIT 1) AS previous_id'),
      conn.raw('(SELECT x.id FROM swings x WHERE x.recording_id = s.recording_id AND x.swing_index > s.swing_index ORDER BY x.swing_index ASC LIMIT 1) AS next_id'),
      // whether the notes and the correction log need a query of their own (most swings have neither)
      conn.raw('EXISTS (SELECT 1 FROM swing_annotations n WHERE n.swing_id = s.id AND n.binned_at IS NULL) AS has_notes'),
      conn.raw('EXISTS (SELECT 1 FROM swing_event_corrections c WHERE c.swing_id = s.id) AS has_corrections'),
    );
  }
  return q.first(columns) as unknown as Knex.QueryBuilder;
}

const SWING_ROW = compileOnce(2, (conn, viewerId: number, swingId: number) => swingQuery(conn, false, viewerId, swingId));
const SWING_VIEW_ROW = compileOnce(2, (conn, viewerId: number, swingId: number) => swingQuery(conn, true, viewerId, swingId));

/**
 * The swing's row with what the access rule needs, in one query; with `view`, also its labels, the two stored
 * payload texts (as bytes: they go out as they are) and its neighbours in the recording. 404 (the same answer as an
 * unknown id) for a swing the viewer may not see, or of a deleted session or recording until it is restored.
 */
async function swingRow(viewer: Viewer, swingId: number, view: boolean): Promise<{ row: Row; access: 'coach' | 'student' }> {
  const row: Row | undefined = (await (view ? SWING_VIEW_ROW : SWING_ROW).rows(db, viewer.id, swingId))[0];
  const access = row ? accessFromRow(viewer, row as { academy_id: unknown; user_id: unknown; coach_link: unknown }) : null;
  if (!row || !access) throw new NotFoundError('No swing with this id.');
  return { row, access };
}

/**
 * The per-reader part of a swing's view, after the access check (swingRow): 404 for an unknown id or a swing of an
 * athlete the viewer does not see (coach: roster; student: own). A student gets only the notes shared with them and
 * no correction audit. With it the stored payload bytes every reader shares (lib/swings/payload.ts); the list of
 * the athlete's other swings for the overlay is its own request (GET /api/swings/:id/overlay-options).
 */
async function swingViewParts(viewer: Viewer, swingId: number): Promise<{ reader: ReaderPart; payload: { shared: Buffer; swing: Buffer } }> {
  const { row, access } = await swingRow(viewer, swingId, true);
  const isCoach = access === 'coach';
  const detail = baseOf(row);
  const [payload, annotations, corrections] = await Promise.all([
    payloadBytesOf(swingId, Number(row.recording_id), row.shared_part as Buffer | null, row.swing_part as Buffer | null, row.swing_part_format === null ? null : Number(row.swing_part_format)),
    Number(row.has_notes) ? listAnnotations(swingId, !isCoach) : Promise.resolve([]),
    isCoach && Number(row.has_corrections) ? correctionsView(swingId) : Promise.resolve([]),
  ]);
  const siblings = { previousId: row.previous_id === null ? null : Number(row.previous_id), nextId: row.next_id === null ? null : Number(row.next_id) };
  const labels = labelsOf(row.label_row === null ? undefined : row, detail.hidden);
  const reader: ReaderPart = { ...detail, siblings, labels, annotations, corrections, canEdit: isCoach };
  return { reader, payload };
}

/** The GET /api/swings/:id body as JSON bytes: the reader's part with the stored payload bytes spliced in as they are. */
export async function swingViewBytes(viewer: Viewer, swingId: number): Promise<Buffer> {
  const { reader, payload } = await swingViewParts(viewer, swingId);
  return swingBodyBytes(JSON.stringify(reader), payload.shared, payload.swing);
}

/** The same as text (tests and server-side callers). */
export async function swingViewText(viewer: Viewer, swingId: number): Promise<string> {
  return (await swingViewBytes(viewer, swingId)).toString('utf8');
}

/** The swing's view as an object (server components; the same parts as the route). */
export async function getSwingForViewer(viewer: Viewer, swingId: number): Promise<SwingView> {
  const { reader, payload } = await swingViewParts(viewer, swingId);
  return { ...reader, ...(JSON.parse(payload.shared.toString('utf8')) as Partial<SwingPayload>), ...(JSON.parse(payload.swing.toString('utf8')) as Partial<SwingPayload>) } as SwingView;
}

/** The numbers only (what the swing page's tables show). */
export async function getSwingDetail(viewer: Viewer, swingId: number): Promise<{ detail: SwingDetail; access: 'coach' | 'student' }> {
  const { row, access } = await swingRow(viewer, swingId, false);
  return { detail: detailOf(row), access };
}

/** The rows of a JSON_ARRAYAGG column (null when the subquery found none). */
function jsonRows<T>(value: unknown): T[] {
  return jsonColumn<T[]>(value) ?? [];
}

/** The swing's own numbers and where it belongs, without its events and phases (the view has those stored). */
function baseOf(row: Row): Omit<SwingDetail, 'events' | 'phases'> {
  return {
    id: Number(row.id),
    index: Number(row.swing_index),
    startS: r3(row.start_s) ?? 0,
    endS: r3(row.end_s) ?? 0,
    impactSource: row.impact_source as SwingDetail['impactSource'],
    tempoRatio: r2(row.tempo_ratio),
    hidden: Boolean(row.hidden),
    stale: Boolean(row.stale),
    partial: Boolean(row.partial),
    forwardPress: row.forward_press_s === null ? null : { timeS: r3(row.forward_press_s) ?? 0, sizeMm: r1(row.forward_press_mm) ?? 0 },
    promoted: (row.promoted as SwingDetail['promoted']) ?? null,
    recording: {
      id: Number(row.recording_id),
      filename: row.filename as string,
      algorithmVersion: (row.algorithm_version as string | null) ?? null,
      parameters: jsonObject(row.parameters),
    },
    session: { id: Number(row.session_id), sessionDate: toIsoDate(row.session_date) ?? '', context: row.context as SwingDetail['session']['context'] },
    athlete: { id: Number(row.athlete_id), displayName: row.display_name as string, dateOfBirth: toIsoDate(row.date_of_birth) },
  };
}

function detailOf(row: Row): SwingDetail {
  return { ...baseOf(row), ...eventsPhasesView(jsonRows<EventRow>(row.events_json), jsonRows<ValueRow>(row.values_json), jsonRows<PhaseRow>(row.phases_json)) };
}

/** The GET /api/swings/:id `swing` body for server components (the same function the route uses). */
export const getSwingViewForViewer = getSwingForViewer;
