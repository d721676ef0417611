import { requireRole } from '@/lib/auth/roles';
import { reviewOfferInputSchema } from '@/lib/contracts/reviews';
import { json, readJson, withErrors } from '@/lib/http';
import { offersFor, putOffer } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';

// GET (coach: their own offer; student: their coaches' offers): { offers }.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach', 'student');
  return json({ offers: await offersFor(viewer) });
});

// PUT (coach) { priceCents, currency, turnaroundDays }: 200 { offer }. New requests use it; open ones keep their price.
export const PUT = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = reviewOfferInputSchema.parse(await readJson(request));
  return json({ offer: await putOffer(viewer, input) });
});
