import { requireRole } from '@/lib/auth/roles';
import { json, readJson, withErrors } from '@/lib/http';
import { createTarget, listTargets } from '@/lib/targets/store';
import { targetInputSchema } from '@/lib/contracts/targets';

export const dynamic = 'force-dynamic';

// GET: the targets the caller can see (coach: academy defaults, own, own athletes'; student: those that apply to them).
// Defaults are marked commonPractice: a starting point, never the only correct pattern.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach', 'student');
  return json({ targets: await listTargets(viewer) });
});

// POST (coach): a new target, optionally for one athlete on the coach's roster. 201 { target }.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = targetInputSchema.parse(await readJson(request));
  return json({ target: await createTarget(viewer, input) }, 201);
});
