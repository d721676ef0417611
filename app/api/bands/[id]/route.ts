import { requireRole } from '@/lib/auth/roles';
import { bandJson, deleteBand, getBand } from '@/lib/bands/store';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET: the band's curves on the 0-100 % axis (mean, sd, lower, upper; null where no swing had a value) and provenance.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  return json({ band: bandJson(await getBand(viewer, parseId((await params).id))) });
});

// DELETE: the coach who built it.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  await deleteBand(viewer, parseId((await params).id));
  return json({ ok: true });
});
