import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { toIsoDate } from '@/lib/db/values';
import { requireAthlete } from '@/lib/auth/access';
import type { CompareResponse, ProgressResponse } from '@/lib/contracts/compare';
import { buildBand, BAND_CURVES, type BandData } from '@/lib/bands/build';
import { loadSwingCurves } from '@/lib/bands/store';
import { scoreSwing } from '@/lib/targets/score';
import { targetForSwing } from '@/lib/targets/store';
import { swingFacts } from '@/lib/targets/swing-facts';
import type { ClubGroup, Target } from '@/lib/targets/types';
import { compareSets } from './compare';
import { progressBySession } from './progress';

// The athlete's coach or the student themself; for everyone else the athlete does not exist (404).
const requireAthleteRead = (viewer: Viewer, athleteId: number) => requireAthlete(viewer, athleteId, 'read');

function curvesJson(b: BandData) {
  const out = (a: number[]) => a.map((v) => (Number.isFinite(v) ? v : null));
  return {
    axis: b.axis,
    landmarks: b.landmarks,
    curves: Object.fromEntries(BAND_CURVES.map((c) => [c, { mean: out(b.curves[c].mean), sd: out(b.curves[c].sd), lower: out(b.curves[c].lower), upper: out(b.curves[c].upper) }])),
  };
}

/** Mean curve +- 1 SD of a set (null below 2 usable swings). */
async function meanCurve(swingIds: number[]) {
  if (swingIds.length < 2) return null;
  const { usable } = await loadSwingCurves(swingIds);
  return usable.length < 2 ? null : curvesJson(buildBand(usable, 1));
}

export async function compareForViewer(viewer: Viewer, athleteId: number, q: { a: string; b: string; metrics: string[] }): Promise<CompareResponse> {
  await requireAthleteRead(viewer, athleteId);
  const facts = await swingFacts({ athleteId });
  const result = compareSets(facts, q.a, q.b, q.metrics);
  const idsOf = (set: string) => facts.filter((s) => !s.hidden && !s.partial && (set.startsWith('context:') ? s.context === set.slice(8) : s.sessionDate.startsWith(`${set.slice(6)}-`))).map((s) => s.id);
  const [ca, cb] = await Promise.all([meanCurve(idsOf(q.a)), meanCurve(idsOf(q.b))]);
  return { a: { ...result.a, meanCurve: ca }, b: { ...result.b, meanCurve: cb }, differences: result.differences };
}

export async function progressForViewer(viewer: Viewer, athleteId: number, metrics: string[]): Promise<ProgressResponse> {
  await requireAthleteRead(viewer, athleteId);
  const [sessions, facts] = await Promise.all([db('practice_sessions').where({ athlete_id: athleteId }).whereNull('binned_at').select('id', 'session_date', 'context'), swingFacts({ athleteId })]);
  const targets = new Map<ClubGroup, Target | null>();
  for (const g of new Set(facts.map((f) => f.clubGroup))) targets.set(g, await targetForSwing(athleteId, viewer.academyId, g));
  const rows = progressBySession(
    sessions.map((s) => ({ id: Number(s.id), date: toIsoDate(s.session_date) ?? '', context: s.context })),
    facts,
    metrics,
    (s) => {
      const t = targets.get(s.clubGroup);
      return t ? scoreSwing(t, s.values, s.tempoRatio).summary : null;
    },
  );
  return { sessions: rows };
}

/**
 * The sets of an athlete that hold swings (counted swings: not hidden, not stale, sessions and recordings not in
 * the bin): the session contexts and the months (YYYY-MM, newest first). The compare page offers only these.
 */
export async function setsWithSwings(athleteId: number): Promise<{ contexts: string[]; months: string[] }> {
  const rows = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .where('p.athlete_id', athleteId)
    .whereNull('p.binned_at')
    .whereNull('r.binned_at')
    .andWhere({ 's.hidden': false, 's.stale': false })
    .distinct('p.context', 'p.session_date');
  const contexts = [...new Set(rows.map((r) => String(r.context)))];
  const months = [...new Set(rows.map((r) => (toIsoDate(r.session_date) ?? '').slice(0, 7)).filter(Boolean))].sort().reverse();
  return { contexts, months };
}
