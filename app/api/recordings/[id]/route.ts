import { requireRole } from '@/lib/auth/roles';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { requireRecording } from '@/lib/auth/access';
import { getRecordingView } from '@/lib/recordings/views';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'read');
  const recording = await getRecordingView(id);
  if (!recording) throw new NotFoundError('No recording with this id.');
  return json(recording);
});
