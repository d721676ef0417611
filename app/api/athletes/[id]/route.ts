import { requireRole } from '@/lib/auth/roles';
import { getAthleteForViewer, setAthleteArchived, updateAthleteForViewer } from '@/lib/db/athletes';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { athletePatchSchema } from '@/lib/contracts/athletes';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// Another coach's athlete answers 404 (not 403): ids outside your roster are not confirmed to exist.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  return json({ athlete: await getAthleteForViewer(viewer, id) });
});

export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const patch = athletePatchSchema.parse(await readJson(request));
  return json({ athlete: await updateAthleteForViewer(viewer, id, patch) });
});

// DELETE archives the player: off the roster and pick lists, every session, swing and note kept; POST .../restore
// puts them back. Nothing is removed, so there is no bin and no time limit.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ athlete: await setAthleteArchived(viewer, parseId((await params).id), true) });
});
