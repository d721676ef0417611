import { requireRole } from '@/lib/auth/roles';
import { requireSwing } from '@/lib/auth/access';
import type { OverlayOptionsResponse } from '@/lib/contracts/swings';
import { json, parseId, withErrors } from '@/lib/http';
import { overlayOptions } from '@/lib/swings/viewer-data';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// The athlete's other swings to draw over this one (the viewer's "Compare with" list). Whoever may read the swing
// (its athlete's coach, the student whose swing it is) may read the list; everyone else gets 404.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('coach', 'student');
  const id = parseId((await params).id);
  const { athleteId } = await requireSwing(viewer, id, 'read');
  const body: OverlayOptionsResponse = { options: await overlayOptions(id, athleteId) };
  return json(body);
});
