import { requireRole } from '@/lib/auth/roles';
import { requireSession } from '@/lib/auth/access';
import { json, parseId, withErrors } from '@/lib/http';
import { restoreSession } from '@/lib/sessions/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// Out of the bin, recordings included: within 30 days of the delete (409 after that, until the sweep removes it).
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write', { binned: true });
  return json(await restoreSession(id));
});
