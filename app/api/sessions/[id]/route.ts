import { requireRole } from '@/lib/auth/roles';
import { requireSession } from '@/lib/auth/access';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { sessionPatchSchema } from '@/lib/contracts/sessions';
import { binSession, updateSession } from '@/lib/sessions/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// Edit a session's date, context, place or notes (the athlete's coach).
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write');
  const patch = sessionPatchSchema.parse(await readJson(request));
  return json(await updateSession(id, patch));
});

// Into the bin with its recordings; POST /api/sessions/:id/restore brings it back within 30 days.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSession(viewer, id, 'write');
  return json(await binSession(id));
});
