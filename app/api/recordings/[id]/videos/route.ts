import { requireRecording } from '@/lib/auth/access';
import { requireRole } from '@/lib/auth/roles';
import { json, parseId, toErrorResponse, withErrors } from '@/lib/http';
import { discardBody, PayloadTooLargeError } from '@/lib/recordings/multipart';
import { listVideos } from '@/lib/videos/store';
import { receiveVideos } from '@/lib/videos/upload';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string }> };

// The recording's videos for the viewer (students see their own).
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'read');
  return json(await listVideos(id));
});

// multipart/form-data: one or more `file` parts (mp4, mov, webm; up to 1 GB each). 202: stored and queued.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  let athleteId: number;
  let recordingId: number;
  try {
    const viewer = await requireRole('coach');
    recordingId = parseId((await params).id);
    athleteId = (await requireRecording(viewer, recordingId, 'write')).athleteId;
    try {
      return json(await receiveVideos(viewer, recordingId, athleteId, request), 202);
    } catch (error) {
      if (!(error instanceof PayloadTooLargeError)) throw error;
      const response = toErrorResponse(error);
      response.headers.set('Connection', 'close');
      return response;
    }
  } catch (error) {
    if (!request.bodyUsed) await discardBody(request);
    throw error;
  }
});
