import 'server-only';
import { db } from '@/lib/db/client';
import type { PracticeSession } from '@/lib/contracts/athletes';
import { toIsoDate } from '@/lib/db/values';

// toIsoDate lives in lib/db/values.ts with the other column conversions; re-exported for existing importers.
export { toIsoDate };

type SessionRow = {
  id: number;
  athlete_id: number;
  session_date: unknown;
  context: PracticeSession['context'];
  location: string | null;
  notes: string | null;
};

function toPracticeSession(row: SessionRow): PracticeSession {
  return {
    id: Number(row.id),
    athleteId: Number(row.athlete_id),
    sessionDate: toIsoDate(row.session_date) ?? '',
    context: row.context,
    location: row.location,
    notes: row.notes,
  };
}

/** Sessions of one athlete in use (not in the bin), newest first. Callers check that the viewer may see the athlete. */
export async function listSessionsForAthlete(athleteId: number): Promise<PracticeSession[]> {
  const rows: SessionRow[] = await db('practice_sessions')
    .select('id', 'athlete_id', 'session_date', 'context', 'location', 'notes')
    .where({ athlete_id: athleteId })
    .whereNull('binned_at')
    .orderBy([
      { column: 'session_date', order: 'desc' },
      { column: 'id', order: 'desc' },
    ]);
  return rows.map(toPracticeSession);
}

/** One session in use (not binned), or null. Callers check that the viewer may see it. */
export async function findSession(id: number): Promise<PracticeSession | null> {
  const row: SessionRow | undefined = await db('practice_sessions').where({ id }).whereNull('binned_at').first('id', 'athlete_id', 'session_date', 'context', 'location', 'notes');
  return row ? toPracticeSession(row) : null;
}
