import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { deleteTarget, updateTarget } from '@/lib/targets/store';
import { targetPatchSchema } from '@/lib/contracts/targets';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// PATCH (coach): the coach's own target or an academy default (defaults are editable). 200 { target }.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const input = targetPatchSchema.parse(await readJson(request));
  return json({ target: await updateTarget(viewer, id, input) });
});

// DELETE (coach): own targets only; academy defaults answer 409.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await deleteTarget(viewer, id);
  return json({ ok: true });
});
