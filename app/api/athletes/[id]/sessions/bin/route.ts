import { requireRole } from '@/lib/auth/roles';
import { requireAthlete } from '@/lib/auth/access';
import { json, parseId, withErrors } from '@/lib/http';
import { listBinnedSessions } from '@/lib/sessions/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The athlete's deleted sessions that can still be restored (the athlete's coach).
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireAthlete(viewer, id, 'write');
  return json({ sessions: await listBinnedSessions(id) });
});
