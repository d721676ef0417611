import { after } from 'next/server';
import { headers } from 'next/headers';
import { clientIp } from '@/lib/auth/client-ip';
import { requestPasswordReset } from '@/lib/accounts/password-reset';
import { getEnv } from '@/lib/env';
import { json, readJson, withErrors } from '@/lib/http';
import { PASSWORD_RESET_ACCEPTED, passwordResetRequestSchema } from '@/lib/contracts/password-reset';

export const dynamic = 'force-dynamic';

// POST { email }: 202 with the same body for every address; 429 past the rate limits. The mail (known, active
// addresses only) is sent after the answer, so timing does not tell known addresses from unknown ones.
export const POST = withErrors(async (request: Request) => {
  const { email } = passwordResetRequestSchema.parse(await readJson(request));
  const ip = clientIp(Object.fromEntries((await headers()).entries()), getEnv().TRUST_PROXY === 'true');
  const send = await requestPasswordReset(email, ip);
  if (send) after(() => send().catch((error: unknown) => console.error('[stanceline mail] password reset mail failed', error)));
  return json(PASSWORD_RESET_ACCEPTED, 202);
});
