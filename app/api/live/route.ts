import { requireRole } from '@/lib/auth/roles';
import { liveStartInputSchema } from '@/lib/contracts/live';
import { json, readJson, withErrors } from '@/lib/http';
import { startLive } from '@/lib/live/session';

export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

// A coach starts a live lesson: { athleteId, sessionId?, context?, drillFocus? } -> 201 { id, token }. The token
// is the bridge's bearer token for POST /api/live/:id/samples, for this live session only, until it ends.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('coach');
  const input = liveStartInputSchema.parse(await readJson(request));
  return json(await startLive(viewer, input), 201);
});
