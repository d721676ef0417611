import { requireRole } from '@/lib/auth/roles';
import { deleteAssignment, updateAssignment } from '@/lib/drills/store';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { assignmentPatchSchema } from '@/lib/contracts/drills';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// PATCH: the student (own only) { practiceDone, studentNote? }; the athlete's coach { dueDate } (or practiceDone: false).
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const input = assignmentPatchSchema.parse(await readJson(request));
  return json({ assignment: await updateAssignment(viewer, id, input) });
});

// DELETE: the athlete's coach takes the assignment back; it goes to the bin (POST .../restore within 30 days).
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  return json({ assignment: await deleteAssignment(viewer, parseId((await params).id)) });
});
