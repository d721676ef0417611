import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireRecording } from '@/lib/auth/access';
import { reprocessSchema } from '@/lib/recordings/fields';
import { requestReprocess } from '@/lib/recordings/reprocess';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// JSON { layout?, profile?, handedness?, stanceWidthMm?, cutoffHz? }; fields left out keep their current value.
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'write');
  const input = reprocessSchema.parse(await readJson(request));
  return json({ recording: await requestReprocess(id, input) }, 202);
});
