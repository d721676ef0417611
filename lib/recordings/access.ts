import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { ForbiddenError, NotFoundError } from '@/lib/http';

// Who may do what with an athlete's recordings: the athlete's coach (coach_athletes, same academy) uploads,
// reads and reprocesses; the student whose account is the athlete reads; everyone else is refused (403).
export type AthleteAccess = 'coach' | 'student';

export async function athleteAccess(viewer: Viewer, athleteId: number): Promise<AthleteAccess | null> {
  const athlete = await db('athletes').where({ id: athleteId, academy_id: viewer.academyId }).first('id', 'user_id');
  if (!athlete) return null;
  if (viewer.role === 'coach') {
    const link = await db('coach_athletes').where({ coach_user_id: viewer.id, athlete_id: athleteId }).first('athlete_id');
    return link ? 'coach' : null;
  }
  if (viewer.role === 'student' && Number(athlete.user_id) === viewer.id) return 'student';
  return null;
}

/** 403 unless the viewer coaches this athlete. */
export async function requireCoachOf(viewer: Viewer, athleteId: number): Promise<void> {
  if ((await athleteAccess(viewer, athleteId)) !== 'coach') {
    throw new ForbiddenError('This athlete is not on your roster, so you cannot add or change their recordings.');
  }
}

/** The athlete of a recording, after checking the viewer may read it (404 unknown id, 403 not yours). */
export async function requireRecordingAccess(viewer: Viewer, recordingId: number, need: 'read' | 'write'): Promise<{ athleteId: number }> {
  const row = await db('recordings').where({ id: recordingId }).first('athlete_id');
  if (!row) throw new NotFoundError('No recording with this id.');
  const access = await athleteAccess(viewer, Number(row.athlete_id));
  if (!access || (need === 'write' && access !== 'coach')) {
    throw new ForbiddenError(need === 'write' ? 'Only the athlete’s coach can reprocess this recording.' : 'This recording belongs to an athlete you do not see.');
  }
  return { athleteId: Number(row.athlete_id) };
}

/** The athlete of a practice session, after the same check. */
export async function requireSessionAccess(viewer: Viewer, sessionId: number): Promise<{ athleteId: number }> {
  const row = await db('practice_sessions').where({ id: sessionId }).first('athlete_id');
  if (!row) throw new NotFoundError('No session with this id.');
  if (!(await athleteAccess(viewer, Number(row.athlete_id)))) throw new ForbiddenError('This session belongs to an athlete you do not see.');
  return { athleteId: Number(row.athlete_id) };
}
