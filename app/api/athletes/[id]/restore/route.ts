import { requireRole } from '@/lib/auth/roles';
import { setAthleteArchived } from '@/lib/db/athletes';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// Back on the roster: the player's coach (another coach's player is a 404).
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ athlete: await setAthleteArchived(viewer, parseId((await params).id), false) });
});
