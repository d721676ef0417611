import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireRecording } from '@/lib/auth/access';
import { promoteSchema } from '@/lib/contracts/recordings';
import { promoteCandidate } from '@/lib/recordings/promote';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// JSON { timeS }: a rejected candidate's time as GET /api/recordings/:id lists it. 202: the recording is re-analysed
// with that candidate counted as a swing (relaxed checks, else events placed for the coach to adjust).
export const POST = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireRecording(viewer, id, 'write');
  const input = promoteSchema.parse(await readJson(request));
  return json(await promoteCandidate(id, viewer.id, input), 202);
});
