import { requireRole } from '@/lib/auth/roles';
import { restoreShare } from '@/lib/accounts/shares';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// Out of the bin within 30 days (409 after that): the player's coach.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ share: await restoreShare(viewer, parseId((await params).id)) });
});
