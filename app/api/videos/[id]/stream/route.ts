import { requireRecording } from '@/lib/auth/access';
import { requireRole } from '@/lib/auth/roles';
import { ConflictError, NotFoundError, parseId, withErrors } from '@/lib/http';
import { serveStored } from '@/lib/videos/stream';
import { videoRow } from '@/lib/videos/store';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// The playable mp4 with HTTP Range (206), ETag and Content-Type video/mp4; access exactly like the recording.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const row = await videoRow(parseId((await params).id));
  if (!row) throw new NotFoundError('No video with this id.');
  await requireRecording(viewer, row.recording_id, 'read');
  if (!row.playable_key || row.playable_bytes === null) throw new ConflictError('The video is not ready to play yet.');
  return serveStored(request, row.playable_key, row.playable_bytes, 'video/mp4', `v${row.id}-${row.playable_key.slice(-24)}`);
});
