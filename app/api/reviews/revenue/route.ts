import { requireRole } from '@/lib/auth/roles';
import { json, withErrors } from '@/lib/http';
import { revenueByCoachMonth } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';

// GET (admin): review revenue per coach per month and currency, from the stored payment and refund records.
export const GET = withErrors(async () => {
  const viewer = await requireRole('admin');
  return json({ rows: await revenueByCoachMonth(viewer) });
});
