import { requireRole } from '@/lib/auth/roles';
import { bandJson, deleteBand, getBand, updateBand } from '@/lib/bands/store';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { bandPatchSchema } from '@/lib/contracts/bands';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// GET: the band's curves on the 0-100 % axis (mean, sd, lower, upper; null where no swing had a value) and provenance.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  return json({ band: bandJson(await getBand(viewer, parseId((await params).id))) });
});

// PATCH { name?, shared? }: the coach who built it.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const patch = bandPatchSchema.parse(await readJson(request));
  return json({ band: await updateBand(viewer, id, patch) });
});

// DELETE: the coach who built it; the band goes to the bin (POST /api/bands/:id/restore within 30 days).
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ band: await deleteBand(viewer, parseId((await params).id)) });
});
