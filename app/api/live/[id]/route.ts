import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { requireLive } from '@/lib/live/session';
import { liveView } from '@/lib/live/view';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json(await liveView(viewer, await requireLive(viewer, parseId((await params).id), 'read')));
});
