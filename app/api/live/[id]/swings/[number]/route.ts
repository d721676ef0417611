import { requireRole } from '@/lib/auth/roles';
import { liveLabelInputSchema } from '@/lib/contracts/live';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireLive } from '@/lib/live/session';
import { labelLiveSwing } from '@/lib/live/view';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

type Context = { params: Promise<{ id: string; number: string }> };

// One-tap labels of a live swing: { club?, strike?, notSwing? } -> { swing }.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const p = await params;
  const row = await requireLive(viewer, parseId(p.id), 'write');
  const input = liveLabelInputSchema.parse(await readJson(request));
  return json({ swing: await labelLiveSwing(row, parseId(p.number), input) });
});
