import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { requireAthlete } from '@/lib/auth/access';
import { db } from '@/lib/db/client';
import { METRIC_IDS, type MetricId, type Outcome, type OutcomeSessionsResponse, type OutcomesResponse, type RankingResponse } from '@/lib/contracts/shots';
import { benjaminiHochberg, correlate } from '@/lib/outcomes/stats';
import { swingFacts, type SwingFacts } from '@/lib/targets/swing-facts';

// Which pressure measures go with which results, for one player (and one club): every paired shot of the player's
// counted swings (not hidden, not stale, nothing in the bin), the swing's measure against the shot's outcome.

const OUTCOME_COLUMNS: Record<Outcome, string> = {
  ball_speed: 'ball_speed_m_s',
  carry: 'carry_m',
  total: 'total_m',
  launch_angle: 'launch_angle_deg',
  spin: 'spin_rpm',
  offline: 'offline_m',
};

interface PairedShot {
  swingId: number;
  sessionId: number;
  club: string | null;
  values: Record<Outcome, number | null>;
}

const num = (v: unknown): number | null => (v === null || v === undefined || !Number.isFinite(Number(v)) ? null : Number(v));

/** The club a shot counts under: the shot log's own club, else the swing's label. Compared without case. */
const clubKey = (c: string | null | undefined) => (c ?? '').trim().toLowerCase();

async function pairedShots(athleteId: number, q: { from?: string; to?: string }): Promise<{ shots: PairedShot[]; forwardPress: Map<number, number | null> }> {
  const query = db('shots as sh')
    .join('shot_imports as i', 'i.id', 'sh.import_id')
    .join('swings as s', 's.id', 'sh.swing_id')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .leftJoin('swing_labels as l', 'l.swing_id', 's.id')
    .where('p.athlete_id', athleteId)
    .where({ 'i.status': 'ready', 's.hidden': false, 's.stale': false })
    .whereNull('i.binned_at')
    .whereNull('r.binned_at')
    .whereNull('p.binned_at')
    .select('sh.swing_id', 'p.id as session_id', 'sh.club', 'l.club as label_club', 's.forward_press_mm', ...Object.values(OUTCOME_COLUMNS).map((c) => `sh.${c}`));
  if (q.from) query.where('p.session_date', '>=', q.from);
  if (q.to) query.where('p.session_date', '<=', q.to);
  const rows = await query.orderBy('sh.swing_id');
  const forwardPress = new Map<number, number | null>();
  const shots = rows.map((r) => {
    forwardPress.set(Number(r.swing_id), num(r.forward_press_mm));
    return {
      swingId: Number(r.swing_id),
      sessionId: Number(r.session_id),
      club: r.club ?? r.label_club ?? null,
      values: Object.fromEntries(Object.entries(OUTCOME_COLUMNS).map(([o, c]) => [o, num(r[c])])) as Record<Outcome, number | null>,
    };
  });
  return { shots, forwardPress };
}

/** A measure of a swing by its public metric id (see README "What goes with distance"). */
export function metricOf(f: SwingFacts, metric: MetricId, forwardPressMm: number | null): number | null {
  const ok = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : v);
  const lead = /^lead_pct_at_(address|top|transition|impact|finish)$/.exec(metric);
  if (lead) return ok(f.values[lead[1] as 'address']?.leadPct);
  switch (metric) {
    case 'trail_heel_pct_at_top':
      return ok(f.values.top?.trailHeelPct);
    case 'lead_heel_pct_at_finish':
      return ok(f.values.finish?.leadHeelPct);
    case 'tempo_ratio':
      return ok(f.tempoRatio);
    case 'backswing_s':
      return ok(f.phases.backswing?.durationS);
    case 'downswing_s':
      return ok(f.phases.downswing?.durationS);
    case 'peak_cop_speed': {
      // the swing's fastest centre-of-pressure movement (mm/s): the largest phase peak
      const peaks = Object.values(f.phases).map((p) => p.peakCopSpeedMmS).filter((v): v is number => v !== null && Number.isFinite(v));
      return peaks.length ? Math.max(...peaks) : null;
    }
    case 'forward_press_mm':
      return ok(forwardPressMm);
    default:
      return null;
  }
}

interface Query {
  outcome: Outcome;
  club?: string;
  from?: string;
  to?: string;
}

async function dataFor(viewer: Viewer, athleteId: number, q: Query) {
  await requireAthlete(viewer, athleteId, 'read');
  const { shots, forwardPress } = await pairedShots(athleteId, q);
  const clubs = [...new Set(shots.map((s) => s.club?.trim()).filter((c): c is string => !!c))].sort((a, b) => a.localeCompare(b));
  const mine = q.club ? shots.filter((s) => clubKey(s.club) === clubKey(q.club)) : shots;
  const facts = new Map((await swingFacts({ swingIds: [...new Set(mine.map((s) => s.swingId))] })).map((f) => [f.id, f]));
  const points = (metric: MetricId) =>
    mine.flatMap((s) => {
      const f = facts.get(s.swingId);
      const x = f ? metricOf(f, metric, forwardPress.get(s.swingId) ?? null) : null;
      const y = s.values[q.outcome];
      return x === null || y === null ? [] : [{ swingId: s.swingId, x, y }];
    });
  return { clubs, points };
}

export async function outcomesForViewer(viewer: Viewer, athleteId: number, q: Query & { metric: MetricId }): Promise<OutcomesResponse> {
  const pts = (await dataFor(viewer, athleteId, q)).points(q.metric);
  const c = correlate(pts.map((p) => p.x), pts.map((p) => p.y));
  return { n: c.n, r: c.r, rLow: c.rLow, rHigh: c.rHigh, rho: c.rho, slope: c.slope, intercept: c.intercept, points: pts };
}

/** Every metric against the outcome, ranked by |r| (no r last), with Benjamini-Hochberg across the metrics. */
export async function rankingForViewer(viewer: Viewer, athleteId: number, q: Query): Promise<RankingResponse> {
  const { clubs, points } = await dataFor(viewer, athleteId, q);
  const rows = METRIC_IDS.map((metric) => {
    const pts = points(metric);
    const c = correlate(pts.map((p) => p.x), pts.map((p) => p.y));
    return { metric, n: c.n, r: c.r, rLow: c.rLow, rHigh: c.rHigh, rho: c.rho, p: c.p };
  });
  const adjusted = benjaminiHochberg(rows.map((r) => (r.p === null ? NaN : r.p)));
  const out = rows.map((r, i) => ({ ...r, pAdjusted: Number.isFinite(adjusted[i]) ? adjusted[i] : null }));
  out.sort((a, b) => (b.r === null ? -1 : Math.abs(b.r)) - (a.r === null ? -1 : Math.abs(a.r)));
  return { outcome: q.outcome, club: q.club ?? null, rows: out, clubs };
}

const meanOrNull = (xs: (number | null)[]): number | null => {
  const v = xs.filter((x): x is number => x !== null);
  return v.length ? v.reduce((a, b) => a + b, 0) / v.length : null;
};

/** Session by session: how many paired shots, mean ball speed and carry, next to mean lead % at impact and tempo. */
export async function outcomeSessionsForViewer(viewer: Viewer, athleteId: number, q: { club?: string; from?: string; to?: string }): Promise<OutcomeSessionsResponse> {
  await requireAthlete(viewer, athleteId, 'read');
  const { shots, forwardPress } = await pairedShots(athleteId, q);
  const mine = q.club ? shots.filter((s) => clubKey(s.club) === clubKey(q.club)) : shots;
  const facts = new Map((await swingFacts({ swingIds: [...new Set(mine.map((s) => s.swingId))] })).map((f) => [f.id, f]));
  const bySession = new Map<number, PairedShot[]>();
  for (const s of mine) bySession.set(s.sessionId, [...(bySession.get(s.sessionId) ?? []), s]);
  const sessions = [...bySession.entries()].map(([sessionId, list]) => {
    const f = facts.get(list[0].swingId);
    const fx = (m: MetricId) => list.map((s) => (facts.get(s.swingId) ? metricOf(facts.get(s.swingId)!, m, forwardPress.get(s.swingId) ?? null) : null));
    return {
      sessionId,
      date: f?.sessionDate ?? '',
      context: f?.context ?? '',
      shots: list.length,
      ballSpeed: meanOrNull(list.map((s) => s.values.ball_speed)),
      carry: meanOrNull(list.map((s) => s.values.carry)),
      leadPctAtImpact: meanOrNull(fx('lead_pct_at_impact')),
      tempoRatio: meanOrNull(fx('tempo_ratio')),
    };
  });
  sessions.sort((a, b) => a.date.localeCompare(b.date) || a.sessionId - b.sessionId);
  return { sessions };
}
