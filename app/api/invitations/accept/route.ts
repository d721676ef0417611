import { acceptInvitation } from '@/lib/accounts/invitations';
import { json, readJson, withErrors } from '@/lib/http';
import { acceptInvitationSchema } from '@/lib/contracts/invitations';

export const dynamic = 'force-dynamic';

// POST { token, password, name? } without a session (the token is the credential): 200 { user, athleteId }.
// A used, expired, revoked or altered token: 400 invalid_link. The page then signs in with the new password.
export const POST = withErrors(async (request: Request) => {
  const input = acceptInvitationSchema.parse(await readJson(request));
  return json(await acceptInvitation(input));
});
