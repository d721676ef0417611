import { requireRole } from '@/lib/auth/roles';
import { createBand, listBands } from '@/lib/bands/store';
import { json, readJson, withErrors } from '@/lib/http';
import { bandInputSchema } from '@/lib/contracts/bands';

export const dynamic = 'force-dynamic';

// GET (coach): own bands and those shared in the academy. A student has no band list (403) but may open a band of
// their coaches by id (GET /api/bands/:id) and be scored against it.
export const GET = withErrors(async () => {
  const viewer = await requireRole('coach');
  return json({ bands: await listBands(viewer) });
});

// POST (coach) { name, swingIds, k?, shared? }: 201 { id, swingCount }; 422 on swingIds when fewer than 3 usable swings.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = bandInputSchema.parse(await readJson(request));
  return json(await createBand(viewer, input), 201);
});
