import { requireRole } from '@/lib/auth/roles';
import { createInvitation, listPendingInvitations } from '@/lib/accounts/invitations';
import { json, readJson, withErrors } from '@/lib/http';
import { createInvitationSchema } from '@/lib/contracts/invitations';

export const dynamic = 'force-dynamic';

// GET (admin: the academy's pending invitations; coach: those they sent or for players on their roster).
export const GET = withErrors(async () => {
  const viewer = await requireRole('admin', 'coach');
  return json({ invitations: await listPendingInvitations(viewer) });
});

// POST { email, role, athleteId? }: 201 { invitation }; the mail goes out before the answer.
export const POST = withErrors(async (request: Request) => {
  const viewer = await requireRole('admin', 'coach');
  const input = createInvitationSchema.parse(await readJson(request));
  return json({ invitation: await createInvitation(viewer, input) }, 201);
});
