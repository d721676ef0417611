import { requireRole } from '@/lib/auth/roles';
import { json, parseId, withErrors } from '@/lib/http';
import { requireRecording } from '@/lib/auth/access';
import { withdrawPromotion } from '@/lib/recordings/promote';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string; promotionId: string }> };

// Withdraws a coach's promotion; 202: the recording is re-analysed without it.
export const DELETE = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const p = await params;
  const id = parseId(p.id);
  await requireRecording(viewer, id, 'write');
  return json(await withdrawPromotion(id, parseId(p.promotionId)), 202);
});
