import { requireRole } from '@/lib/auth/roles';
import { restoreBand } from '@/lib/bands/store';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// Out of the bin within 30 days (409 after that): the coach who built it.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ band: await restoreBand(viewer, parseId((await params).id)) });
});
