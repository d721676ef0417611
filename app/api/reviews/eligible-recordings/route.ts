import { requireRole } from '@/lib/auth/roles';
import { json, withErrors } from '@/lib/http';
import { eligibleRecordings } from '@/lib/reviews/reviews';

export const dynamic = 'force-dynamic';

// GET (student): their recordings that are ready (processed, not in the bin), newest session first.
export const GET = withErrors(async () => {
  const viewer = await requireRole('student');
  return json({ recordings: await eligibleRecordings(viewer) });
});
