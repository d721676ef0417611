import { requireRole } from '@/lib/auth/roles';
import { requireRecording } from '@/lib/auth/access';
import { json, parseId, withErrors } from '@/lib/http';
import { restoreRecording } from '@/lib/sessions/store';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// A deleted recording back into its session, within 30 days of the delete.
export const POST = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'write', { binned: true });
  return json(await restoreRecording(id));
});
