import { requireRole } from '@/lib/auth/roles';
import { outcomeSessionsQuerySchema } from '@/lib/contracts/shots';
import { json, parseId, withErrors } from '@/lib/http';
import { outcomeSessionsForViewer } from '@/lib/shots/outcomes';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET ?club=C&from=&to=: session by session, the mean results of the paired shots next to mean lead % at impact and
// tempo (progress of the results beside the pressure measures). The athlete's coach or the student.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const q = outcomeSessionsQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return json(await outcomeSessionsForViewer(viewer, id, q));
});
