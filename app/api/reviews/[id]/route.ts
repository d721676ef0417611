import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { getReview } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET: { id, status, checkoutSessionId, payments, history, ... } to its student, its coach and the academy's admin.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('student', 'coach', 'admin');
  return json(await getReview(viewer, parseId((await params).id)));
});
