import { requireRole } from '@/lib/auth/roles';
import { compareForViewer } from '@/lib/compare/service';
import { compareQuerySchema } from '@/lib/compare/sets';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET ?a=<set>&b=<set>&metrics=m1,m2: two sets of one athlete's swings, mean differences (B - A) with Welch's t 95 %
// intervals, and a note instead of an interval when a set has fewer than 3 swings. The athlete's coach or the student.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const q = compareQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return json(await compareForViewer(viewer, id, q));
});
