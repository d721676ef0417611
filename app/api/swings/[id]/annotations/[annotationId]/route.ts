import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireSwing } from '@/lib/auth/access';
import { deleteAnnotation, updateAnnotation } from '@/lib/swings/annotations';
import { annotationPatchSchema } from '@/lib/contracts/swings';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string; annotationId: string }> };

// Change or remove one note: its author or the athlete's coach (a student gets 403 on every write).
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const { id: rawId, annotationId: rawNote } = await params;
  const id = parseId(rawId);
  const noteId = parseId(rawNote);
  const { access } = await requireSwing(viewer, id, 'write');
  const input = annotationPatchSchema.parse(await readJson(request));
  return json({ annotation: await updateAnnotation(viewer, access === 'coach', id, noteId, input) });
});

export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const { id: rawId, annotationId: rawNote } = await params;
  const id = parseId(rawId);
  const noteId = parseId(rawNote);
  const { access } = await requireSwing(viewer, id, 'write');
  await deleteAnnotation(viewer, access === 'coach', id, noteId);
  return new Response(null, { status: 204, headers: { 'Cache-Control': 'no-store' } });
});
