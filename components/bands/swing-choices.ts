// Server-side: the swings a coach can pick for a band, grouped by athlete and session (visible, current swings only).
import { listAthletesForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import type { Viewer } from '@/lib/auth/viewer';
import { getSessionRecordingsView } from '@/lib/recordings/views';

export interface SwingChoice {
  id: number;
  index: number;
  leadPctAtImpact: number | null;
  tempoRatio: number | null;
}
export interface SessionChoice {
  id: number;
  date: string;
  context: string;
  swings: SwingChoice[];
}
export interface AthleteChoice {
  id: number;
  displayName: string;
  sessions: SessionChoice[];
}

export async function swingChoicesFor(viewer: Viewer): Promise<AthleteChoice[]> {
  const athletes = await listAthletesForViewer(viewer);
  return Promise.all(
    athletes.map(async (a) => {
      const sessions = await listSessionsForAthlete(a.id);
      const withSwings = await Promise.all(
        sessions.map(async (s) => {
          const view = await getSessionRecordingsView(s.id);
          const swings = (view?.swings ?? [])
            .filter((w) => !w.hidden && !w.stale)
            .map((w) => ({ id: w.id, index: w.index, leadPctAtImpact: w.leadPctAtImpact, tempoRatio: w.tempoRatio }));
          return { id: s.id, date: s.sessionDate, context: s.context, swings };
        }),
      );
      return { id: a.id, displayName: a.displayName, sessions: withSwings.filter((s) => s.swings.length > 0) };
    }),
  );
}
