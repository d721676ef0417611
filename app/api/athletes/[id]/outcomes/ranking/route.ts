import { requireRole } from '@/lib/auth/roles';
import { rankingQuerySchema } from '@/lib/contracts/shots';
import { json, parseId, withErrors } from '@/lib/http';
import { rankingForViewer } from '@/lib/shots/outcomes';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET ?outcome=O&club=C&from=&to=: every pressure measure against the outcome, ranked by |r|, with p values and
// their Benjamini-Hochberg adjustment across the measures. The athlete's coach or the student.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const q = rankingQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  return json(await rankingForViewer(viewer, id, q));
});
