import { requireRole } from '@/lib/auth/roles';
import { createReviewSchema } from '@/lib/contracts/reviews';
import { json, readJson, withErrors } from '@/lib/http';
import { createReview, listReviews } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';

// GET: a student's requests, a coach's reviews (open ones first by due date, overdue marked), an admin's academy's.
export const GET = withErrors(async () => {
  const viewer = await requireRole('student', 'coach', 'admin');
  return json({ reviews: await listReviews(viewer) });
});

// POST (student) { recordingId, question }: 201 { id, checkoutUrl } (the provider's Checkout page).
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('student');
  const input = createReviewSchema.parse(await readJson(request));
  return json(await createReview(viewer, input), 201);
});
