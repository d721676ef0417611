import { requireRole } from '@/lib/auth/roles';
import { restoreDrill } from '@/lib/drills/store';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// Out of the bin within 30 days (409 after that), its assignments with it: the coach whose library holds it.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ drill: await restoreDrill(viewer, parseId((await params).id)) });
});
