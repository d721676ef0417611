import { requireRole } from '@/lib/auth/roles';
import { revokeInvitation } from '@/lib/accounts/invitations';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// DELETE: revokes a pending invitation (its link stops working). 200 { revoked: id }.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('admin', 'coach');
  const id = parseId((await params).id);
  await revokeInvitation(viewer, id);
  return json({ revoked: id });
});
