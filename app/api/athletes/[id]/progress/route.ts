import { requireRole } from '@/lib/auth/roles';
import { progressForViewer } from '@/lib/compare/service';
import { progressQuerySchema } from '@/lib/compare/sets';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET ?metrics=m1,m2: per session (date order) the mean, SD and n of each metric and the target score.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const q = progressQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return json(await progressForViewer(viewer, id, q.metrics));
});
