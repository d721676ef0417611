import 'server-only';
import { db } from '@/lib/db/client';
import { jsonColumn, toIsoDate } from '@/lib/db/values';
import { clubGroupOf, type ClubGroup, type Measure, type TargetEvent } from './types';
import type { EventValues } from './score';

// What scoring, compare and progress need about a set of swings, in a few queries: the athlete, session (date,
// context), club group from the label, tempo, stance width and the values at each event (copSide derived).

export interface SwingFacts {
  id: number;
  athleteId: number;
  sessionId: number;
  sessionDate: string;
  context: string;
  hidden: boolean;
  /** a partial swing (pitch, half swing): compare, bands and progress leave these out by default */
  partial: boolean;
  clubGroup: ClubGroup;
  club: string | null;
  tempoRatio: number | null;
  stanceWidthMm: number;
  values: EventValues;
  /** phase name -> duration_s etc. */
  phases: Record<string, { durationS: number | null; copPathMm: number | null; peakCopSpeedMmS: number | null; meanLeadPct: number | null }>;
}

const num = (v: unknown): number | null => (v === null || v === undefined || !Number.isFinite(Number(v)) ? null : Number(v));

function jsonObject(v: unknown): Record<string, unknown> {
  return jsonColumn<Record<string, unknown>>(v) ?? {};
}

/** copSide (%) = COP x (mm, + lead) / (stance width / 2) * 100. */
export const copSide = (copXMm: number | null, stanceWidthMm: number): number | null => (copXMm === null || !(stanceWidthMm > 0) ? null : (copXMm / (stanceWidthMm / 2)) * 100);

export async function swingFacts(where: { swingIds?: number[]; athleteId?: number }): Promise<SwingFacts[]> {
  const q = db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .join('athletes as a', 'a.id', 'r.athlete_id')
    .leftJoin('swing_labels as l', 'l.swing_id', 's.id')
    .whereNull('r.binned_at') // the bin: deleted sessions and recordings count nowhere
    .whereNull('p.binned_at')
    .select('s.id', 's.hidden', 's.partial', 's.tempo_ratio', 'r.athlete_id', 'r.parameters', 'r.options', 'a.stance_width_mm', 'p.id as session_id', 'p.session_date', 'p.context', 'l.club')
    .orderBy('s.id');
  if (where.swingIds) q.whereIn('s.id', where.swingIds);
  if (where.athleteId !== undefined) q.where('r.athlete_id', where.athleteId);
  const rows = await q;
  if (rows.length === 0) return [];
  const ids = rows.map((r) => Number(r.id));
  const [values, phases] = await Promise.all([
    db('swing_event_values').whereIn('swing_id', ids).select('swing_id', 'event', 'lead_pct', 'lead_heel_pct', 'trail_heel_pct', 'cop_x_mm'),
    db('swing_phase_metrics').whereIn('swing_id', ids).select('swing_id', 'phase', 'duration_s', 'cop_path_mm', 'peak_cop_speed_mm_s', 'mean_lead_pct'),
  ]);
  const byId = new Map<number, SwingFacts>();
  for (const r of rows) {
    const stance = num(jsonObject(r.parameters).stance_width_mm) ?? num(jsonObject(r.options).stanceWidthMm) ?? Number(r.stance_width_mm);
    byId.set(Number(r.id), {
      id: Number(r.id),
      athleteId: Number(r.athlete_id),
      sessionId: Number(r.session_id),
      sessionDate: toIsoDate(r.session_date) ?? '',
      context: r.context,
      hidden: Boolean(r.hidden),
      partial: Boolean(r.partial),
      club: r.club ?? null,
      clubGroup: clubGroupOf(r.club),
      tempoRatio: num(r.tempo_ratio),
      stanceWidthMm: stance,
      values: {},
      phases: {},
    });
  }
  for (const v of values) {
    const f = byId.get(Number(v.swing_id))!;
    const m: Partial<Record<Measure, number | null>> = {
      leadPct: num(v.lead_pct),
      leadHeelPct: num(v.lead_heel_pct),
      trailHeelPct: num(v.trail_heel_pct),
      copSide: copSide(num(v.cop_x_mm), f.stanceWidthMm),
    };
    f.values[v.event as TargetEvent] = m;
  }
  for (const p of phases) {
    byId.get(Number(p.swing_id))!.phases[p.phase] = { durationS: num(p.duration_s), copPathMm: num(p.cop_path_mm), peakCopSpeedMmS: num(p.peak_cop_speed_mm_s), meanLeadPct: num(p.mean_lead_pct) };
  }
  return [...byId.values()];
}
