import { ALL_ROLES, requireRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';
import type { MeResponse } from '@/lib/contracts/me';
import { json, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';

// Any signed-in role: who am I, and for a student, their own athlete profile.
export const GET = withErrors(async () => {
  const viewer = await requireRole(...ALL_ROLES);
  const athlete = viewer.role === 'student' ? ((await listAthletesForViewer(viewer))[0] ?? null) : null;
  const body: MeResponse = { user: viewer, athlete };
  return json(body);
});
