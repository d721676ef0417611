import { requireRole } from '@/lib/auth/roles';
import { restoreAssignment } from '@/lib/drills/store';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// Out of the bin within 30 days (409 after that): the athlete's coach.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  return json({ assignment: await restoreAssignment(viewer, parseId((await params).id)) });
});
