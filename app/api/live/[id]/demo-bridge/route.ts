import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { startDemoBridge } from '@/lib/live/demo-bridge';
import { requireActive, requireLive } from '@/lib/live/session';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// Replays one of the student's demo recordings into this live session at real speed (202 { recordingId, filename }).
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const row = await requireLive(viewer, parseId((await params).id), 'write');
  requireActive(row);
  return json(await startDemoBridge(row), 202);
});
