import { requireRole } from '@/lib/auth/roles';
import { getSwingForViewer } from '@/lib/db/swings';
import { json, parseId, withErrors } from '@/lib/http';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// One swing: its events with the values at them, the phase table, the processing parameters and algorithm version.
// The athlete's coach and the student whose account is the athlete may read it; everyone else gets 403.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  return json({ swing: await getSwingForViewer(viewer, id) });
});
