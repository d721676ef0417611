import { requireRole } from '@/lib/auth/roles';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { requireSession } from '@/lib/auth/access';
import { getSessionRecordingsView, SESSION_RECORDINGS_MAX } from '@/lib/recordings/views';
import { pageQueryOf } from '@/lib/pagination';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The recordings of a practice session with their state, and every swing found in them (for the session page).
// ?limit=&offset= page through the recordings (with their swings); `page` says which.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const page = pageQueryOf(new URL(request.url), SESSION_RECORDINGS_MAX);
  await requireSession(viewer, id, 'read');
  const view = await getSessionRecordingsView(id, page);
  if (!view) throw new NotFoundError('No session with this id.');
  return json(view);
});
