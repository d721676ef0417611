import { requireRole } from '@/lib/auth/roles';
import { deliverReviewSchema } from '@/lib/contracts/reviews';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { deliverReview } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// POST (the review's coach) { summary, drillId? }: 200 the review, delivered; the student gets a mail with a link.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const input = deliverReviewSchema.parse(await readJson(request));
  return json(await deliverReview(viewer, id, input));
});
