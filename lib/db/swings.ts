import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { jsonColumn, r0, r1, r2, r3, toIsoDate } from '@/lib/db/values';
import { ForbiddenError, NotFoundError } from '@/lib/http';
import { athleteAccess } from '@/lib/auth/access';
import { eventNames, phaseNames, type SwingDetail, type SwingView } from '@/lib/contracts/swings';
import { listAnnotations } from '@/lib/swings/annotations';
import { labelsOf } from '@/lib/swings/labels';
import { correctionsView, siblingsView } from '@/lib/swings/viewer-data';
import { payloadTextOf } from '@/lib/swings/payload';
import type { SwingPayload } from '@/lib/swings/payload-build';

// One swing with its phase table and the values at its events, for the swing page and GET /api/swings/:id; with
// getSwingForViewer also the viewer's data (lib/swings/viewer-data.ts), labels, notes and the correction audit.
// Numbers are rounded the way `npm run analyze` prints them (lib/recordings/views.ts): times to 3 decimals,
// percentages and millimetres to 1, mm/s to whole numbers, the tempo ratio to 2, so the page and the CLI can be compared 1:1.

function jsonObject(value: unknown): Record<string, unknown> {
  return jsonColumn<Record<string, unknown>>(value) ?? {};
}

type ReaderPart = Omit<SwingView, keyof SwingPayload>;

/**
 * The per-reader part of a swing's view, after the access check (getSwingDetail): 404 for an unknown id or a swing
 * of an athlete the viewer does not see (coach: roster; student: own). A student gets only the notes shared with
 * them and no correction audit. With it the stored payload text every reader shares (lib/swings/payload.ts).
 */
async function swingViewParts(viewer: Viewer, swingId: number): Promise<{ reader: ReaderPart; payloadText: string }> {
  const { detail, access } = await getSwingDetail(viewer, swingId);
  const isCoach = access === 'coach';
  const [payloadText, siblings, labelRow, annotations, corrections] = await Promise.all([
    payloadTextOf(swingId),
    siblingsView(swingId, detail.recording.id, detail.index, detail.athlete.id),
    db('swing_labels').where({ swing_id: swingId }).first(),
    listAnnotations(swingId, !isCoach),
    isCoach ? correctionsView(swingId) : Promise.resolve([]),
  ]);
  const reader: ReaderPart = { ...detail, siblings, labels: labelsOf(labelRow, detail.hidden), annotations, corrections, canEdit: isCoach };
  return { reader, payloadText };
}

/** The GET /api/swings/:id body as JSON text: the reader's part with the stored payload spliced in unparsed. */
export async function swingViewText(viewer: Viewer, swingId: number): Promise<string> {
  const { reader, payloadText } = await swingViewParts(viewer, swingId);
  const head = JSON.stringify(reader);
  // both are JSON objects: '{...reader' + ',' + 'payload...}' ; an empty payload object is never stored
  return `{"swing":${head.slice(0, -1)},${payloadText.slice(1)}}`;
}

/** The swing's view as an object (server components; the same parts as the route). */
export async function getSwingForViewer(viewer: Viewer, swingId: number): Promise<SwingView> {
  const { reader, payloadText } = await swingViewParts(viewer, swingId);
  return { ...reader, ...(JSON.parse(payloadText) as SwingPayload) };
}

/** The numbers only (what the swing page's tables show). */
export async function getSwingDetail(viewer: Viewer, swingId: number): Promise<{ detail: SwingDetail; access: 'coach' | 'student' }> {
  const row = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .join('athletes as a', 'a.id', 'r.athlete_id')
    .where('s.id', swingId)
    .whereNull('r.binned_at') // a swing of a deleted session or recording is unknown until it is restored
    .whereNull('p.binned_at')
    .first(
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
    );
  if (!row) throw new NotFoundError('No swing with this id.');
  const access = await athleteAccess(viewer, Number(row.athlete_id));
  if (!access) throw new NotFoundError('No swing with this id.');

  const [events, values, phases] = await Promise.all([
    db('swing_events').where({ swing_id: swingId }).select('name', 'time_s', 'source', 'auto_time_s', 'misfit'),
    db('swing_event_values').where({ swing_id: swingId }).select('event', 'lead_pct', 'lead_heel_pct', 'trail_heel_pct', 'cop_x_mm', 'cop_y_mm'),
    db('swing_phase_metrics').where({ swing_id: swingId }).select('phase', 'duration_s', 'cop_path_mm', 'peak_cop_speed_mm_s', 'mean_lead_pct'),
  ]);

  const detail: SwingDetail = {
    id: Number(row.id),
    index: Number(row.swing_index),
    startS: r3(row.start_s) ?? 0,
    endS: r3(row.end_s) ?? 0,
    impactSource: row.impact_source,
    tempoRatio: r2(row.tempo_ratio),
    hidden: Boolean(row.hidden),
    stale: Boolean(row.stale),
    partial: Boolean(row.partial),
    forwardPress: row.forward_press_s === null ? null : { timeS: r3(row.forward_press_s) ?? 0, sizeMm: r1(row.forward_press_mm) ?? 0 },
    promoted: row.promoted ?? null,
    recording: {
      id: Number(row.recording_id),
      filename: row.filename,
      algorithmVersion: row.algorithm_version ?? null,
      parameters: jsonObject(row.parameters),
    },
    session: { id: Number(row.session_id), sessionDate: toIsoDate(row.session_date) ?? '', context: row.context },
    athlete: { id: Number(row.athlete_id), displayName: row.display_name, dateOfBirth: toIsoDate(row.date_of_birth) },
    // In event order, not row order.
    events: eventNames
      .map((name) => ({ name, e: events.find((x) => x.name === name), v: values.find((x) => x.event === name) }))
      .filter(({ e }) => e !== undefined)
      .map(({ name, e, v }) => ({
        name,
        timeS: r3(e.time_s) ?? 0,
        source: e.source,
        autoTimeS: r3(e.auto_time_s),
        misfit: Boolean(e.misfit),
        leadPct: r1(v?.lead_pct),
        leadHeelPct: r1(v?.lead_heel_pct),
        trailHeelPct: r1(v?.trail_heel_pct),
        copXMm: r1(v?.cop_x_mm),
        copYMm: r1(v?.cop_y_mm),
      })),
    phases: phaseNames
      .map((name) => ({ name, p: phases.find((x) => x.phase === name) }))
      .filter(({ p }) => p !== undefined)
      .map(({ name, p }) => ({
        name,
        durationS: r3(p.duration_s),
        copPathMm: r1(p.cop_path_mm),
        peakCopSpeedMmS: r0(p.peak_cop_speed_mm_s),
        meanLeadPct: r1(p.mean_lead_pct),
      })),
  };
  return { detail, access };
}

/** The GET /api/swings/:id `swing` body for server components (the same function the route uses). */
export const getSwingViewForViewer = getSwingForViewer;
