import { requireRole } from '@/lib/auth/roles';
import { drillReport } from '@/lib/drills/store';
import { DRILL_CAUTION } from '@/lib/drills/types';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET: drills given on or before this session and whether the checks they address moved (mean before the assignment
// date vs after it, up to this session). The athlete's coach or the student.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const report = await drillReport(viewer, parseId((await params).id));
  return json({ ...report, caution: DRILL_CAUTION });
});
