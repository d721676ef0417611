import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { accountLinkInputSchema } from '@/lib/contracts/account-links';
import { linkAccount, unlinkAccount } from '@/lib/athletes/account-link';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// Link a student account (by e-mail) to this player: an admin for any player of the academy, a coach for a player
// on their roster.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('admin', 'coach');
  const id = parseId((await params).id);
  const input = accountLinkInputSchema.parse(await readJson(request));
  return json(await linkAccount(viewer, id, input.email));
});

export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('admin', 'coach');
  const id = parseId((await params).id);
  return json(await unlinkAccount(viewer, id));
});
