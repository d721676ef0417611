import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import type { AthleteChoice } from '@/lib/contracts/bands';
import { listAthletesForViewer } from '@/lib/db/athletes';
import { db } from '@/lib/db/client';
import { r1, r2, toIsoDate } from '@/lib/db/values';

// The swings a coach can pick for a band, grouped by athlete and session (visible, current swings only): the viewer's
// roster, then one joined query for the swings of all of it (sessions newest first, swings in recording order).

type ChoiceRow = {
  athlete_id: number;
  session_id: number;
  session_date: unknown;
  context: string;
  swing_id: number;
  swing_index: number;
  tempo_ratio: unknown;
  lead_pct: unknown;
};

export async function swingChoicesFor(viewer: Viewer): Promise<AthleteChoice[]> {
  const athletes = await listAthletesForViewer(viewer);
  if (athletes.length === 0) return [];
  const rows: ChoiceRow[] = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .leftJoin('swing_event_values as v', (j) => j.on('v.swing_id', 's.id').andOnVal('v.event', 'impact'))
    .whereIn('p.athlete_id', athletes.map((a) => a.id))
    .whereNull('p.binned_at')
    .whereNull('r.binned_at')
    .andWhere({ 's.hidden': false, 's.stale': false })
    .orderBy([
      { column: 'p.session_date', order: 'desc' },
      { column: 'p.id', order: 'desc' },
      { column: 's.recording_id', order: 'asc' },
      { column: 's.swing_index', order: 'asc' },
    ])
    .select('p.athlete_id', 'p.id as session_id', 'p.session_date', 'p.context', 's.id as swing_id', 's.swing_index', 's.tempo_ratio', 'v.lead_pct');
  const sessionsOf = new Map<number, AthleteChoice['sessions']>();
  for (const row of rows) {
    const sessions = sessionsOf.get(row.athlete_id) ?? [];
    sessionsOf.set(row.athlete_id, sessions);
    let session = sessions.at(-1);
    if (session?.id !== row.session_id) {
      session = { id: row.session_id, date: toIsoDate(row.session_date) ?? '', context: row.context, swings: [] };
      sessions.push(session);
    }
    session.swings.push({ id: row.swing_id, index: row.swing_index, leadPctAtImpact: r1(row.lead_pct), tempoRatio: r2(row.tempo_ratio) });
  }
  return athletes.map((a) => ({ id: a.id, displayName: a.displayName, sessions: sessionsOf.get(a.id) ?? [] }));
}
