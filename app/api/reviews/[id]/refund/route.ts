import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { refundReview } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// POST (the review's coach): a refund through the provider before delivery; after delivery 409 refund_after_delivery.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json(await refundReview(viewer, parseId((await params).id)));
});
