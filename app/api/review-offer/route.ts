import { requireRole } from '@/lib/auth/roles';
import { reviewOfferInputSchema } from '@/lib/contracts/reviews';
import { json, readJson, withErrors } from '@/lib/http';
import { offersFor, putOffer, withdrawOffer } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';

// GET (coach: their own offer, withdrawn or not; student: their coaches' open offers): { offers }.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach', 'student');
  return json({ offers: await offersFor(viewer) });
});

// PUT (coach) { priceCents, currency, turnaroundDays }: 200 { offer }. New requests use it; open ones keep their price.
// It also offers again after a withdrawal (withdrawnAt back to null).
export const PUT = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = reviewOfferInputSchema.parse(await readJson(request));
  return json({ offer: await putOffer(viewer, input) });
});

// DELETE (coach): 200 { offer } with withdrawnAt set; 404 without an offer. Students no longer see it and new requests
// get 409; requests already made, paid or in review go on at their own price.
export const DELETE = withErrors(async () => {
  const viewer = await requireRole('coach');
  return json({ offer: await withdrawOffer(viewer) });
});
