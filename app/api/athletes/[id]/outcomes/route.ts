import { requireRole } from '@/lib/auth/roles';
import { outcomesQuerySchema } from '@/lib/contracts/shots';
import { json, parseId, withErrors } from '@/lib/http';
import { outcomesForViewer } from '@/lib/shots/outcomes';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET ?metric=M&outcome=O&club=C&from=&to=: one pressure measure against one shot result over the player's paired
// shots: Pearson's r with its Fisher z 95 % interval, Spearman's rho, the least squares line and the points.
// The athlete's coach or the student.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const q = outcomesQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return json(await outcomesForViewer(viewer, id, q));
});
