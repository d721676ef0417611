import { requireRole } from '@/lib/auth/roles';
import { requireAthlete } from '@/lib/auth/access';
import { getAthleteForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { sessionInputSchema } from '@/lib/contracts/sessions';
import { createSession } from '@/lib/sessions/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The athlete's sessions in use, newest first; binned ones are left out (they are listed under /bin).
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  await getAthleteForViewer(viewer, id); // scope check: 404 outside the viewer's athletes
  return json({ sessions: await listSessionsForAthlete(id) });
});

// A lesson, practice or on-course session on a date, by the athlete's coach.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireAthlete(viewer, id, 'write');
  const input = sessionInputSchema.parse(await readJson(request));
  return json(await createSession(viewer, id, input), 201);
});
