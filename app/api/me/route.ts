import { ALL_ROLES, requireRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';
import { json, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';

// Any signed-in role: who am I, and for a student, their own athlete profile.
export const GET = withErrors(async () => {
  const viewer = await requireRole(...ALL_ROLES);
  const athlete = viewer.role === 'student' ? ((await listAthletesForViewer(viewer))[0] ?? null) : null;
  return json({ user: viewer, athlete });
});
