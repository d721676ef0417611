import { requireRole } from '@/lib/auth/roles';
import { getSwingForViewer, swingViewBytes } from '@/lib/db/swings';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { requireSwing } from '@/lib/auth/access';
import { patchSwing } from '@/lib/swings/patch';
import { swingPatchSchema } from '@/lib/contracts/swings';
import { sendCacheableJson } from '@/lib/swings/payload';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// One swing: its events with the values at them, the phase table, the processing parameters and algorithm version,
// and the viewer's data (full-rate traces, overview, layout and sensor forces at events, labels, notes, audit).
// The athlete's coach and the student whose account is the athlete may read it; everyone else gets 404.
// Served with a weak ETag (304 on a matching If-None-Match) after the role and access checks; the heavy part is
// stored at processing time (lib/swings/payload-build.ts); Next compresses it.
export const GET = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  return sendCacheableJson(request, await swingViewBytes(viewer, id));
});

// JSON { events?: { top: 12.34, ... }, resetEvents?: [...] | 'all', labels?: { club, strike, flight, tags, rating, notASwing } }.
// The athlete's coach only (a student gets 403 on their own swing). Answers the swing as GET does.
export const PATCH = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('coach');
  const id = parseId((await params).id);
  await requireSwing(viewer, id, 'write');
  const input = swingPatchSchema.parse(await readJson(request));
  await patchSwing(viewer, id, input);
  return json({ swing: await getSwingForViewer(viewer, id) });
});
