// The phase table of a cohort as rows: long (tidy: one row per swing x event-or-phase x measure; Wickham 2014,
// Tidy Data, J Stat Softw 59(10)) or wide (one row per swing), with the codebook that explains every column.
// Pure: a swing's stored numbers in, plain rows out. Numbers are rounded exactly as `npm run analyze` prints them
// (lib/signal/format.ts): seconds 3 decimals, % and mm 1, mm/s 0, tempo 2, so an export and the command agree.
import { EVENT_NAMES, PHASE_NAMES, type EventName, type PhaseName } from '@/lib/signal/types';

export type Shape = 'long' | 'wide';
type Num = number | null;

export interface ExportSwing {
  swingId: number;
  playerCode: string;
  /** identified exports only (a coach's own athletes) */
  playerName?: string;
  sessionDate?: string;
  ageBand: string;
  sessionWeek: string;
  context: string;
  club: string | null;
  clubGroup: string;
  handedness: string;
  partial: boolean;
  algorithmVersion: string | null;
  processing: { cutoff_hz: Num; filter_order: Num; sample_rate_hz: Num; derivative_window: Num; derivative_poly_order: Num; max_gap_s: Num; stance_width_mm: Num };
  events: Partial<Record<EventName, Num>>;
  atEvents: Partial<Record<EventName, Partial<Record<EventMeasure, Num>>>>;
  phases: Partial<Record<PhaseName, Partial<Record<PhaseMeasure, Num>>>>;
  tempoRatio: Num;
  targetScorePct: Num;
}

export const EVENT_MEASURES = ['time_s', 'lead_pct', 'lead_heel_pct', 'trail_heel_pct', 'cop_x_mm', 'cop_y_mm'] as const;
export const PHASE_MEASURES = ['duration_s', 'cop_path_mm', 'peak_cop_speed_mm_s', 'mean_lead_pct'] as const;
export type EventMeasure = (typeof EVENT_MEASURES)[number];
export type PhaseMeasure = (typeof PHASE_MEASURES)[number];

/** Unit and decimals of each measure: the analyze command's rounding. */
export const MEASURES: Record<EventMeasure | PhaseMeasure | 'tempo_ratio', { unit: string; decimals: number; meaning: string }> = {
  time_s: { unit: 's', decimals: 3, meaning: 'time of the event on the recording’s own time axis' },
  lead_pct: { unit: '%', decimals: 1, meaning: 'share of the total vertical force under the lead foot' },
  lead_heel_pct: { unit: '%', decimals: 1, meaning: 'share of the lead foot’s force under its heel sensors' },
  trail_heel_pct: { unit: '%', decimals: 1, meaning: 'share of the trail foot’s force under its heel sensors' },
  cop_x_mm: { unit: 'mm', decimals: 1, meaning: 'stance centre of pressure, across the stance (+ toward the lead foot) from the stance centre' },
  cop_y_mm: { unit: 'mm', decimals: 1, meaning: 'stance centre of pressure, heel to toe (+ toward the toes) from the stance centre' },
  duration_s: { unit: 's', decimals: 3, meaning: 'duration of the phase' },
  cop_path_mm: { unit: 'mm', decimals: 1, meaning: 'length of the stance COP path during the phase' },
  peak_cop_speed_mm_s: { unit: 'mm/s', decimals: 0, meaning: 'highest stance COP speed during the phase' },
  mean_lead_pct: { unit: '%', decimals: 1, meaning: 'mean lead-foot share of force during the phase' },
  tempo_ratio: { unit: 'ratio', decimals: 2, meaning: 'backswing time divided by downswing time' },
};

export function roundTo(v: Num | undefined, decimals: number): Num {
  if (v === null || v === undefined || !Number.isFinite(v)) return null;
  const p = 10 ** decimals;
  const r = Math.round(v * p) / p;
  return r === 0 ? 0 : r; // the same rounding as lib/signal/format.ts, -0 included
}

const PROCESSING_COLUMNS = ['cutoff_hz', 'filter_order', 'sample_rate_hz', 'derivative_window', 'derivative_poly_order', 'max_gap_s', 'stance_width_mm'] as const;
const IDENTIFIED_COLUMNS = ['player_name', 'session_date'] as const;
const LEAD = ['player_code', 'session_week', 'context', 'club', 'swing_id'] as const;
const AFTER = ['algorithm_version', 'age_band', 'club_group', 'handedness', 'partial', 'target_score_pct', ...PROCESSING_COLUMNS] as const;

/** Column name of a phase in the wide table: R and pandas friendly (follow-through -> follow_through). */
const slug = (name: string) => name.replace(/-/g, '_');

export function wideMeasureColumns(): string[] {
  return [
    ...EVENT_NAMES.flatMap((e) => EVENT_MEASURES.map((m) => `${e}_${m}`)),
    ...PHASE_NAMES.flatMap((p) => PHASE_MEASURES.map((m) => `${slug(p)}_${m}`)),
    'tempo_ratio',
  ];
}

export function columnsOf(shape: Shape, identified: boolean): string[] {
  const tail = identified ? [...IDENTIFIED_COLUMNS] : [];
  if (shape === 'long') return [...LEAD, 'event_or_phase', 'measure', 'value', 'unit', ...AFTER, ...tail];
  return [...LEAD, ...AFTER, ...wideMeasureColumns(), ...tail];
}

export type Row = Record<string, string | number | null>;

function common(s: ExportSwing, identified: boolean): Row {
  const row: Row = {
    player_code: s.playerCode,
    session_week: s.sessionWeek,
    context: s.context,
    club: s.club,
    swing_id: s.swingId,
    algorithm_version: s.algorithmVersion,
    age_band: s.ageBand,
    club_group: s.clubGroup,
    handedness: s.handedness,
    partial: s.partial ? 1 : 0,
    target_score_pct: roundTo(s.targetScorePct, 1),
  };
  for (const c of PROCESSING_COLUMNS) row[c] = s.processing[c] ?? null;
  if (identified) {
    row.player_name = s.playerName ?? null;
    row.session_date = s.sessionDate ?? null;
  }
  return row;
}

/** The measures of one swing as (event_or_phase, measure, rounded value, unit), in a fixed order. */
export function measuresOf(s: ExportSwing): { eventOrPhase: string; measure: string; value: Num; unit: string }[] {
  const out: { eventOrPhase: string; measure: string; value: Num; unit: string }[] = [];
  for (const e of EVENT_NAMES) {
    for (const m of EVENT_MEASURES) {
      const raw = m === 'time_s' ? s.events[e] : s.atEvents[e]?.[m];
      out.push({ eventOrPhase: e, measure: m, value: roundTo(raw, MEASURES[m].decimals), unit: MEASURES[m].unit });
    }
  }
  for (const p of PHASE_NAMES) {
    for (const m of PHASE_MEASURES) out.push({ eventOrPhase: p, measure: m, value: roundTo(s.phases[p]?.[m], MEASURES[m].decimals), unit: MEASURES[m].unit });
  }
  out.push({ eventOrPhase: 'swing', measure: 'tempo_ratio', value: roundTo(s.tempoRatio, MEASURES.tempo_ratio.decimals), unit: MEASURES.tempo_ratio.unit });
  return out;
}

export const ROWS_PER_SWING_LONG = EVENT_NAMES.length * EVENT_MEASURES.length + PHASE_NAMES.length * PHASE_MEASURES.length + 1;

export function longRows(s: ExportSwing, identified: boolean): Row[] {
  const base = common(s, identified);
  return measuresOf(s).map((m) => ({ ...base, event_or_phase: m.eventOrPhase, measure: m.measure, value: m.value, unit: m.unit }));
}

export function wideRow(s: ExportSwing, identified: boolean): Row {
  const row = common(s, identified);
  for (const m of measuresOf(s)) row[m.eventOrPhase === 'swing' ? m.measure : `${slug(m.eventOrPhase)}_${m.measure}`] = m.value;
  return row;
}

export function rowsOf(s: ExportSwing, shape: Shape, identified: boolean): Row[] {
  return shape === 'long' ? longRows(s, identified) : [wideRow(s, identified)];
}

export interface CodebookEntry {
  column: string;
  type: 'string' | 'integer' | 'number';
  unit: string | null;
  meaning: string;
  computed: string;
}

const PARAMETER_NOTES: Record<(typeof PROCESSING_COLUMNS)[number], [string, string | null, string]> = {
  cutoff_hz: ['cutoff of the zero-lag low-pass Butterworth filter (after the two-pass correction)', 'Hz', 'recording parameters of the analysis that made the numbers'],
  filter_order: ['order of the single-pass Butterworth; the zero-lag filter has twice this order', null, 'recording parameters'],
  sample_rate_hz: ['rate of the uniform time grid the recording was resampled onto', 'Hz', 'median step of the time column'],
  derivative_window: ['Savitzky-Golay window for the COP velocity', 'samples', 'recording parameters'],
  derivative_poly_order: ['Savitzky-Golay polynomial order for the COP velocity', null, 'recording parameters'],
  max_gap_s: ['longest gap filled by interpolation', 's', 'recording parameters'],
  stance_width_mm: ['heel-to-heel stance width used to place the two feet', 'mm', 'upload form, file metadata or the player’s profile'],
};

/** One entry per column of the export (same order), with meaning, unit and how it was computed. */
export function codebook(shape: Shape, identified: boolean): CodebookEntry[] {
  const fixed: Record<string, Omit<CodebookEntry, 'column'>> = {
    player_code: identified
      ? { type: 'string', unit: null, meaning: 'pseudonymous player code (the same code a researcher sees)', computed: 'HMAC-SHA256 of the player id under the server secret, first 12 hex digits, prefixed P' }
      : { type: 'string', unit: null, meaning: 'pseudonymous player code, stable across exports', computed: 'HMAC-SHA256 of the player id under the server secret, first 12 hex digits, prefixed P' },
    session_week: { type: 'string', unit: null, meaning: 'ISO 8601 week of the session (YYYY-Www)', computed: 'the session date coarsened to its ISO week' },
    context: { type: 'string', unit: null, meaning: 'where the session took place: lesson, practice or on-course', computed: 'entered by the coach' },
    club: { type: 'string', unit: null, meaning: 'club used for the swing (empty when not labelled)', computed: 'the coach’s label of the swing' },
    swing_id: { type: 'integer', unit: null, meaning: 'opaque swing number, unique in this installation', computed: 'database id' },
    event_or_phase: { type: 'string', unit: null, meaning: 'swing event (address, top, transition, impact, finish), phase (backswing, transition, downswing, follow-through) or swing', computed: 'events from the COP velocity; a phase runs from one event to the next' },
    measure: { type: 'string', unit: null, meaning: 'name of the measure; see the measure rows of this codebook', computed: '' },
    value: { type: 'number', unit: null, meaning: 'the value of the measure (empty when undefined, e.g. no load on a foot)', computed: 'stored analysis, rounded as the analyze command prints it' },
    unit: { type: 'string', unit: null, meaning: 'unit of value', computed: '' },
    algorithm_version: { type: 'string', unit: null, meaning: 'version of the analysis that produced the numbers', computed: 'stored with each processed recording' },
    age_band: { type: 'string', unit: 'years', meaning: 'age band at the session date (five-year bands split at the adult age, 65+ top-coded; unknown without a date of birth)', computed: 'from the date of birth, which is never exported' },
    club_group: { type: 'string', unit: null, meaning: 'driver, woods-hybrids, irons or wedges (unlabelled swings count as irons)', computed: 'from the club label' },
    handedness: { type: 'string', unit: null, meaning: 'right or left; lead foot is the left for a right-handed golfer', computed: 'recording parameters' },
    partial: { type: 'integer', unit: null, meaning: '1 for a partial swing (pitch, half swing), else 0', computed: 'swing finder' },
    target_score_pct: { type: 'number', unit: '%', meaning: 'share of the target’s checks within tolerance (empty without a target)', computed: 'the target that applies to the swing: the player’s, else their coach’s, else the academy default' },
    player_name: { type: 'string', unit: null, meaning: 'the player’s name (identified exports for the coach only)', computed: '' },
    session_date: { type: 'string', unit: null, meaning: 'session date YYYY-MM-DD (identified exports for the coach only)', computed: '' },
  };
  for (const c of PROCESSING_COLUMNS) {
    const [meaning, unit, computed] = PARAMETER_NOTES[c];
    fixed[c] = { type: 'number', unit, meaning, computed };
  }
  const measureEntry = (column: string, where: string, m: keyof typeof MEASURES): CodebookEntry => ({
    column,
    type: 'number',
    unit: MEASURES[m].unit,
    meaning: `${MEASURES[m].meaning}${where ? ` (${where})` : ''}`,
    computed: `stored analysis, rounded to ${MEASURES[m].decimals} decimals`,
  });
  const entries: CodebookEntry[] = [];
  for (const column of columnsOf(shape, identified)) {
    if (fixed[column]) {
      entries.push({ column, ...fixed[column] });
      continue;
    }
    if (column === 'tempo_ratio') {
      entries.push(measureEntry(column, '', 'tempo_ratio'));
      continue;
    }
    const event = EVENT_NAMES.find((e) => column.startsWith(`${e}_`));
    const phase = PHASE_NAMES.find((p) => column.startsWith(`${slug(p)}_`) && (PHASE_MEASURES as readonly string[]).includes(column.slice(slug(p).length + 1)));
    if (phase) entries.push(measureEntry(column, `${phase} phase`, column.slice(slug(phase).length + 1) as PhaseMeasure));
    else if (event) entries.push(measureEntry(column, `at ${event}`, column.slice(event.length + 1) as EventMeasure));
  }
  if (shape === 'long') {
    for (const [m, d] of Object.entries(MEASURES)) entries.push({ column: `measure=${m}`, type: 'number', unit: d.unit, meaning: d.meaning, computed: `stored analysis, rounded to ${d.decimals} decimals` });
  }
  return entries;
}
