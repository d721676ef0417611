import 'server-only';
import type { Knex } from 'knex';
import { db } from '@/lib/db/client';
import { jsonColumn, toIsoDate } from '@/lib/db/values';
import { getEnv } from '@/lib/env';
import { HttpError } from '@/lib/http';
import type { CohortFilter } from '@/lib/contracts/research';
import { EVENT_NAMES, PHASE_NAMES, type EventName, type PhaseName } from '@/lib/signal/types';
import { scoreSwing, type EventValues } from '@/lib/targets/score';
import { targetForSwing } from '@/lib/targets/store';
import { copSide } from '@/lib/targets/swing-facts';
import { clubGroupOf, type Target } from '@/lib/targets/types';
import { ageBand, ageOn, sessionConsented } from './age';
import { currentConsents } from './consent';
import { isoWeek } from './iso-week';
import type { ExportSwing } from './phase-table';
import { playerCode } from './player-code';

// The swings of a cohort, read in batches by swing id (keyset), so an export of any size holds one batch in memory.
// Whose swings:
// - a researcher: players of their academy whose newest consent says yes, each session only if the player was an
//   adult at its date or a guardian consented too (lib/research/age.ts). Consent is read again for every batch, so a
//   revocation takes effect at once, even inside an export that is running.
// - a coach: the players on their roster, identified (name and date), for their own use.
// Always left out: swings marked "not a swing", stale swings, the bin, recordings not (yet) processed.

export interface CohortScope {
  kind: 'researcher' | 'coach';
  academyId: number;
  userId: number;
}

export const BATCH_SWINGS = 200;

export function researchSecret(): string {
  const secret = getEnv().RESEARCH_CODE_SECRET;
  if (!secret) throw new HttpError(503, 'research_unavailable', 'Research exports are not set up on this server: RESEARCH_CODE_SECRET is not set (npm start generates one).');
  return secret;
}

const num = (v: unknown): number | null => (v === null || v === undefined || !Number.isFinite(Number(v)) ? null : Number(v));

function baseQuery(conn: Knex, scope: CohortScope, filter: CohortFilter) {
  const q = conn('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .join('athletes as a', 'a.id', 'r.athlete_id')
    .leftJoin('swing_labels as l', 'l.swing_id', 's.id')
    .where('a.academy_id', scope.academyId)
    .where('r.status', 'ready')
    .whereNull('r.binned_at')
    .whereNull('p.binned_at')
    .where('s.hidden', false)
    .where('s.stale', false);
  if (scope.kind === 'coach') q.whereIn('a.id', conn('coach_athletes').where('coach_user_id', scope.userId).select('athlete_id'));
  else {
    // the newest consent row of each player says yes (checked again per session in JS for minors)
    const newest = conn('consent_records').groupBy('athlete_id').max('id');
    q.whereIn('a.id', conn('consent_records').whereIn('id', newest).where('research', true).select('athlete_id'));
  }
  if (filter.context) q.where('p.context', filter.context);
  if (filter.from) q.where('p.session_date', '>=', filter.from);
  if (filter.to) q.where('p.session_date', '<=', filter.to);
  if (filter.algorithmVersion) q.where('r.algorithm_version', filter.algorithmVersion);
  if (filter.partial === 'exclude') q.where('s.partial', false);
  if (filter.partial === 'only') q.where('s.partial', true);
  if (filter.handedness) q.whereRaw(`JSON_VALUE(r.parameters, '$.handedness') = ?`, [filter.handedness]);
  return q;
}

/** Batches of the cohort's swings with their numbers, in swing-id order. */
export async function* cohortBatches(scope: CohortScope, filter: CohortFilter, opts: { batchSwings?: number; conn?: Knex } = {}): AsyncGenerator<ExportSwing[]> {
  const conn = opts.conn ?? db;
  const secret = researchSecret();
  const adultAge = getEnv().RESEARCH_ADULT_AGE;
  const targets = new Map<string, Target | null>();
  let after = 0;
  for (;;) {
    const rows = await baseQuery(conn, scope, filter)
      .where('s.id', '>', after)
      .orderBy('s.id')
      .limit(opts.batchSwings ?? BATCH_SWINGS)
      .select('s.id', 's.partial', 's.tempo_ratio', 'r.athlete_id', 'r.parameters', 'r.algorithm_version', 'p.session_date', 'p.context', 'a.date_of_birth', 'a.display_name', 'a.stance_width_mm', 'l.club');
    if (rows.length === 0) return;
    after = Number(rows[rows.length - 1].id);
    const consents = scope.kind === 'researcher' ? await currentConsents([...new Set(rows.map((r) => Number(r.athlete_id)))], conn) : null;
    const kept = rows.filter((r) => {
      if (filter.clubGroup && clubGroupOf(r.club) !== filter.clubGroup) return false;
      if (!consents) return true;
      const c = consents.get(Number(r.athlete_id));
      return c !== undefined && sessionConsented(c, toIsoDate(r.date_of_birth), toIsoDate(r.session_date)!, adultAge);
    });
    if (kept.length === 0) continue;
    const ids = kept.map((r) => Number(r.id));
    const [events, values, phases] = await Promise.all([
      conn('swing_events').whereIn('swing_id', ids).select('swing_id', 'name', 'time_s'),
      conn('swing_event_values').whereIn('swing_id', ids).select('*'),
      conn('swing_phase_metrics').whereIn('swing_id', ids).select('*'),
    ]);
    const byId = new Map<number, ExportSwing>();
    const scoring = new Map<number, EventValues>();
    for (const r of kept) {
      const params = jsonColumn<Record<string, unknown>>(r.parameters) ?? {};
      const date = toIsoDate(r.session_date)!;
      const dob = toIsoDate(r.date_of_birth);
      const s: ExportSwing = {
        swingId: Number(r.id),
        playerCode: playerCode(secret, Number(r.athlete_id)),
        ...(scope.kind === 'coach' ? { playerName: r.display_name, sessionDate: date } : {}),
        ageBand: ageBand(dob === null ? null : ageOn(dob, date), adultAge),
        sessionWeek: isoWeek(date),
        context: r.context,
        club: r.club ?? 'unlabelled',
        clubGroup: clubGroupOf(r.club),
        handedness: String(params.handedness ?? ''),
        partial: Boolean(r.partial),
        algorithmVersion: r.algorithm_version ?? null,
        processing: {
          cutoff_hz: num(params.cutoff_hz),
          filter_order: num(params.filter_order),
          sample_rate_hz: num(params.sample_rate_hz),
          derivative_window: num(params.derivative_window),
          derivative_poly_order: num(params.derivative_poly_order),
          max_gap_s: num(params.max_gap_s),
          stance_width_mm: num(params.stance_width_mm),
        },
        events: {},
        atEvents: {},
        phases: {},
        tempoRatio: num(r.tempo_ratio),
        targetScorePct: null,
      };
      byId.set(s.swingId, s);
      scoring.set(s.swingId, {});
    }
    for (const e of events) {
      const s = byId.get(Number(e.swing_id));
      if (s && (EVENT_NAMES as readonly string[]).includes(e.name)) s.events[e.name as EventName] = num(e.time_s);
    }
    for (const v of values) {
      const s = byId.get(Number(v.swing_id));
      if (!s) continue;
      const event = v.event as EventName;
      s.atEvents[event] = { lead_pct: num(v.lead_pct), lead_heel_pct: num(v.lead_heel_pct), trail_heel_pct: num(v.trail_heel_pct), cop_x_mm: num(v.cop_x_mm), cop_y_mm: num(v.cop_y_mm) };
      const stance = s.processing.stance_width_mm ?? 0;
      scoring.get(s.swingId)![event as keyof EventValues] = {
        leadPct: num(v.lead_pct),
        leadHeelPct: num(v.lead_heel_pct),
        trailHeelPct: num(v.trail_heel_pct),
        copSide: copSide(num(v.cop_x_mm), stance),
      };
    }
    for (const p of phases) {
      const s = byId.get(Number(p.swing_id));
      if (s && (PHASE_NAMES as readonly string[]).includes(p.phase))
        s.phases[p.phase as PhaseName] = { duration_s: num(p.duration_s), cop_path_mm: num(p.cop_path_mm), peak_cop_speed_mm_s: num(p.peak_cop_speed_mm_s), mean_lead_pct: num(p.mean_lead_pct) };
    }
    const out: ExportSwing[] = [];
    const athleteOf = new Map(kept.map((r) => [Number(r.id), Number(r.athlete_id)]));
    for (const s of byId.values()) {
      const key = `${athleteOf.get(s.swingId)}:${s.clubGroup}`;
      if (!targets.has(key)) targets.set(key, await targetForSwing(athleteOf.get(s.swingId)!, scope.academyId, s.clubGroup as Target['clubGroup']));
      const target = targets.get(key);
      if (target) {
        const scored = scoreSwing(target, scoring.get(s.swingId)!, s.tempoRatio);
        s.targetScorePct = scored.summary.total > 0 ? (scored.summary.passed / scored.summary.total) * 100 : null;
      }
      if (filter.scoreMin !== undefined && !(s.targetScorePct !== null && s.targetScorePct >= filter.scoreMin)) continue;
      if (filter.scoreMax !== undefined && !(s.targetScorePct !== null && s.targetScorePct <= filter.scoreMax)) continue;
      out.push(s);
    }
    if (out.length > 0) yield out;
  }
}
