import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { cancelReview } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// POST (the student or the coach): an unpaid request is cancelled (its checkout expired at the provider).
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('student', 'coach');
  return json(await cancelReview(viewer, parseId((await params).id)));
});
