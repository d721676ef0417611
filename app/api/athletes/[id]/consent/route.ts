import { requireRole } from '@/lib/auth/roles';
import { json, parseId, readJson, withErrors } from '@/lib/http';
import { consentInputSchema } from '@/lib/contracts/research';
import { getConsent, setConsent } from '@/lib/research/consent';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ id: string }> };

// A player's research consent and its history: the player's coach, the student for their own player, or an admin.
export const GET = withErrors(async (_request: Request, { params }: Context) => {
  const viewer = await requireRole('admin', 'coach', 'student');
  return json(await getConsent(viewer, parseId((await params).id)));
});

export const PUT = withErrors(async (request: Request, { params }: Context) => {
  const viewer = await requireRole('admin', 'coach', 'student');
  const id = parseId((await params).id);
  const input = consentInputSchema.parse(await readJson(request));
  return json(await setConsent(viewer, id, input));
});
