import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { revokeToken } from '@/lib/research/tokens';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('researcher');
  return json(await revokeToken(viewer, parseId((await params).id)));
});
