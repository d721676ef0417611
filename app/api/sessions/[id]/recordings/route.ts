import { requireRole } from '@/lib/auth/roles';
import { json, NotFoundError, parseId, withErrors } from '@/lib/http';
import { requireSession } from '@/lib/auth/access';
import { getSessionRecordingsView } from '@/lib/recordings/views';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The recordings of a practice session with their state, and every swing found in them (for the session page).
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'read');
  const view = await getSessionRecordingsView(id);
  if (!view) throw new NotFoundError('No session with this id.');
  return json(view);
});
