import { requireRole } from '@/lib/auth/roles';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { deleteShotProfileOfCoach } from '@/lib/shots/profiles';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// DELETE: removes one of the coach's saved shot profiles (imports made with it keep their own copy of it).
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  if (!(await deleteShotProfileOfCoach(viewer, id))) throw new NotFoundError('No shot profile with this id.');
  return json({ deleted: id });
});
