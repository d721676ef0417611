import { requireRole } from '@/lib/auth/roles';
import { listSharesForAthlete } from '@/lib/accounts/shares';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET (the player's coach): what was sent to this player, newest first; removed shares left out.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ shares: await listSharesForAthlete(viewer, parseId((await params).id)) });
});
