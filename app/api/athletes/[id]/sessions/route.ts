import { requireRole } from '@/lib/auth/roles';
import { getAthleteForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await getAthleteForViewer(viewer, id); // scope check: 404 outside the viewer's athletes
  return json({ sessions: await listSessionsForAthlete(id) });
});
