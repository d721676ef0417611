import { requireRole } from '@/lib/auth/roles';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { requireRecording } from '@/lib/auth/access';
import { getRecordingView, RECORDING_SWINGS_MAX } from '@/lib/recordings/views';
import { pageQueryOf } from '@/lib/pagination';
import { binRecording } from '@/lib/sessions/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// ?limit=&offset= page through the swings (swingsPage says which; limit at most RECORDING_SWINGS_MAX; without it, all).
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const page = pageQueryOf(new URL(request.url), RECORDING_SWINGS_MAX);
  await requireRecording(viewer, id, 'read');
  const recording = await getRecordingView(id, page);
  if (!recording) throw new NotFoundError('No recording with this id.');
  return json(recording);
});

// Into the bin (the session's page offers undo; POST /api/recordings/:id/restore within 30 days); GET then answers 404.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'write');
  return json(await binRecording(id));
});
