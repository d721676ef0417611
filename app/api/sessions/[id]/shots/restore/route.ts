import { requireRole } from '@/lib/auth/roles';
import { requireSession } from '@/lib/auth/access';
import { db } from '@/lib/db/client';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { shotUnitsOf } from '@/lib/shots/units-preference';
import { restoreImport, sessionShotsView } from '@/lib/shots/session-shots';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// Brings the session's last binned shot log back (the one in use, if any, goes to the bin in its place). The coach.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write');
  if (!(await restoreImport(db, id))) throw new NotFoundError('This session has no shot log in the bin.');
  return json(await sessionShotsView(db, id, await shotUnitsOf(viewer)));
});
