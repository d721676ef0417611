import { requireRecording } from '@/lib/auth/access';
import { requireRole } from '@/lib/auth/roles';
import { videoPatchSchema } from '@/lib/contracts/videos';
import { json, NotFoundError, parseId, readJson, withErrors } from '@/lib/http';
import { binVideo, toVideoView, updateSync, videoRow } from '@/lib/videos/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

async function findVideo(id: number) {
  const row = await videoRow(id);
  if (!row) throw new NotFoundError('No video with this id.');
  return row;
}

// Access exactly like the recording: a video of a binned or unknown recording is a 404.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const row = await findVideo(parseId((await params).id));
  await requireRecording(viewer, row.recording_id, 'read');
  return json(toVideoView(row));
});

// { impact: { swingId, videoTimeS } } | { nudgeFrames } | { offsetS }: the coach's sync (syncSource "manual").
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const row = await findVideo(parseId((await params).id));
  await requireRecording(viewer, row.recording_id, 'write');
  const patch = videoPatchSchema.parse(await readJson(request));
  return json(await updateSync(row, patch));
});

// Into the bin (POST /api/videos/:id/restore within 30 days); GET then answers 404.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const row = await findVideo(parseId((await params).id));
  await requireRecording(viewer, row.recording_id, 'write');
  return json(await binVideo(row));
});
