import { requireRole } from '@/lib/auth/roles';
import { deleteDrill, updateDrill } from '@/lib/drills/store';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { drillPatchSchema } from '@/lib/contracts/drills';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// PATCH / DELETE: the coach whose library holds the drill.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const input = drillPatchSchema.parse(await readJson(request));
  return json({ drill: await updateDrill(viewer, id, input) });
});

// DELETE moves the drill to the bin with its assignments (POST /api/drills/:id/restore within 30 days).
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ drill: await deleteDrill(viewer, parseId((await params).id)) });
});
