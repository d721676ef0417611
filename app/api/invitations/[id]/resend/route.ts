import { requireRole } from '@/lib/auth/roles';
import { resendInvitation } from '@/lib/accounts/invitations';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// POST: a new link, valid 72 h from now, in a new mail; the previous link stops working. 200 { invitation }.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('admin', 'coach');
  return json({ invitation: await resendInvitation(viewer, parseId((await params).id)) });
});
