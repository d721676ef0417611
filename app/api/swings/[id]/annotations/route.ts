import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireSwing } from '@/lib/auth/access';
import { createAnnotation, listAnnotations } from '@/lib/swings/annotations';
import { annotationCreateSchema } from '@/lib/contracts/swings';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The notes of a swing: the coach gets all, the student only those shared with them.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const { access } = await requireSwing(viewer, id, 'read');
  return json({ annotations: await listAnnotations(id, access !== 'coach') });
});

// JSON { body, timeS? | phase?, visibility: 'coach' | 'shared' }; the athlete's coach only.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSwing(viewer, id, 'write');
  const input = annotationCreateSchema.parse(await readJson(request));
  return json({ annotation: await createAnnotation(viewer, id, input) }, 201);
});
