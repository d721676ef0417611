import { requireRecording } from '@/lib/auth/access';
import { requireRole } from '@/lib/auth/roles';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { restoreVideo, videoRow } from '@/lib/videos/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// A deleted video back on its recording, within 30 days of the delete.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const row = await videoRow(parseId((await params).id), { binned: true });
  if (!row) throw new NotFoundError('No video with this id in the bin.');
  await requireRecording(viewer, row.recording_id, 'write');
  return json(await restoreVideo(row));
});
