import { requireRole } from '@/lib/auth/roles';
import { listAssignments } from '@/lib/drills/store';
import { DRILL_CAUTION } from '@/lib/drills/types';
import { json, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';

// GET: coach: assignments of their athletes; student: their own.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach', 'student');
  return json({ assignments: await listAssignments(viewer), caution: DRILL_CAUTION });
});
