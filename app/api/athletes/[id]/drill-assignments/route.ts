import { requireRole } from '@/lib/auth/roles';
import { assignDrill, listAssignments } from '@/lib/drills/store';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireAthlete } from '@/lib/auth/access';
import { assignmentInputSchema } from '@/lib/contracts/drills';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET: this athlete's drill assignments (their coach, or the student themself).
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await requireAthlete(viewer, id, 'read');
  return json({ assignments: await listAssignments(viewer, id) });
});

// POST (the athlete's coach) { drillId, dueDate: 'YYYY-MM-DD' }: 201 { assignment }; assigned today (UTC date).
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const input = assignmentInputSchema.parse(await readJson(request));
  const today = new Date().toISOString().slice(0, 10);
  return json({ assignment: await assignDrill(viewer, id, input.drillId, input.dueDate, today) }, 201);
});
