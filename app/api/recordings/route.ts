import { requireRole } from '@/lib/auth/roles';
import { json, toErrorResponse, withErrors } from '@/lib/http';
import { discardBody, PayloadTooLargeError } from '@/lib/recordings/multipart';
import { receiveRecordings } from '@/lib/recordings/upload';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

// multipart/form-data: athleteId, sessionId?, layout?, profile? | profileId?, saveProfileAs?, handedness?,
// stanceWidthMm?, cutoffHz?, and one or more `file` parts. 202: stored and queued; processing runs in the worker.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach').catch(async (error: unknown) => {
    await discardBody(request);
    throw error;
  });
  try {
    return json({ recordings: await receiveRecordings(viewer, request) }, 202);
  } catch (error) {
    if (!(error instanceof PayloadTooLargeError)) throw error;
    // the rest of the body was not read: the client must not send another request on this connection
    const response = toErrorResponse(error);
    response.headers.set('Connection', 'close');
    return response;
  }
});
