import { after } from 'next/server';
import { notifyDrillAssigned } from '@/lib/accounts/drill-mail';
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
// The student gets a drill reminder mail (lib/accounts/drill-mail.ts).
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const input = assignmentInputSchema.parse(await readJson(request));
  const today = new Date().toISOString().slice(0, 10);
  const assignment = await assignDrill(viewer, id, input.drillId, input.dueDate, today);
  // the student's drill reminder (at most one a day, unless they opted out), after the answer
  after(() => notifyDrillAssigned(assignment.id).then(() => undefined, (error: unknown) => console.error('[stanceline mail] drill reminder failed', error)));
  return json({ assignment }, 201);
});
