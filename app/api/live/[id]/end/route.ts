import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { endLive } from '@/lib/live/end';
import { requireLive } from '@/lib/live/session';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// The coach ends the lesson: the stream becomes a normal recording (200 { recordingId }); ending twice gives the same.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const row = await requireLive(viewer, parseId((await params).id), 'write');
  return json(await endLive(Number(row.id), 'coach'));
});
