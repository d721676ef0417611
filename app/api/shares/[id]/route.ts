import { requireRole } from '@/lib/auth/roles';
import { deleteShare, updateShareNote } from '@/lib/accounts/shares';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { shareNotePatchSchema } from '@/lib/contracts/shares';

export const dynamic = 'force-dynamic';
type Context = { params: Promise<{ id: string }> };

// PATCH { note } (the player's coach): 200 { share }; an empty note clears it. No new mail.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  const patch = shareNotePatchSchema.parse(await readJson(request));
  return json({ share: await updateShareNote(viewer, id, patch) });
});

// DELETE (the player's coach): the share goes to the bin (POST /api/shares/:id/restore within 30 days); the student's
// list leaves it out.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  return json({ share: await deleteShare(viewer, parseId((await params).id)) });
});
