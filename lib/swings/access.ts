import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { ForbiddenError, NotFoundError } from '@/lib/http';
import { athleteAccess, type AthleteAccess } from '@/lib/recordings/access';

// Who may do what with a swing: the athlete's coach reads and edits (events, labels, annotations); the student whose
// account is the athlete reads; everyone else is refused. 404 for an unknown id.
export async function requireSwingAccess(viewer: Viewer, swingId: number, need: 'read' | 'write'): Promise<{ athleteId: number; access: AthleteAccess }> {
  const row = await db('swings as s').join('recordings as r', 'r.id', 's.recording_id').where('s.id', swingId).first('r.athlete_id');
  if (!row) throw new NotFoundError('No swing with this id.');
  const access = await athleteAccess(viewer, Number(row.athlete_id));
  if (!access) throw new ForbiddenError('This swing belongs to an athlete you do not see.');
  if (need === 'write' && access !== 'coach') throw new ForbiddenError('Only the athlete’s coach can change this swing; it is read-only for you.');
  return { athleteId: Number(row.athlete_id), access };
}
