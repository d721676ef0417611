import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { startReview } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// POST (the review's coach): paid -> in review.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json(await startReview(viewer, parseId((await params).id)));
});
