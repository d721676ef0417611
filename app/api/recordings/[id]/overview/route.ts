import { requireRole } from '@/lib/auth/roles';
import { requireRecording } from '@/lib/auth/access';
import { parseId, withErrors } from '@/lib/http';
import { overviewBodyOf, sendCacheableJson } from '@/lib/swings/payload';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The whole recording for the overview strip and the viewer's "Whole recording" zoom (RecordingOverviewResponse in
// lib/contracts/swings.ts): the same for every swing of the recording, stored when it is processed, served with a
// weak ETag (304 on a matching If-None-Match) after the role and access checks. The athlete's coach and the student
// whose recording it is may read it; everyone else gets 404.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'read');
  return sendCacheableJson(request, await overviewBodyOf(id));
});
