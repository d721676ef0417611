import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { requireSwing } from '@/lib/auth/access';
import { restoreAnnotation } from '@/lib/swings/annotations';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string; annotationId: string }> };

// Undo of a note's removal: the same note back (200 { annotation }), within 30 days (409 after). Its author or the
// athlete's coach; a student gets 403, an unknown or not-removed note 404.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const { id: rawId, annotationId: rawNote } = await params;
  const id = parseId(rawId);
  const noteId = parseId(rawNote);
  const { access } = await requireSwing(viewer, id, 'write');
  return json({ annotation: await restoreAnnotation(viewer, access === 'coach', id, noteId) });
});
