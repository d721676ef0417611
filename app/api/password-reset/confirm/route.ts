import { confirmPasswordReset } from '@/lib/accounts/password-reset';
import { json, readJson, withErrors } from '@/lib/http';
import { passwordResetConfirmSchema } from '@/lib/contracts/password-reset';

export const dynamic = 'force-dynamic';

// POST { token, password }: 200; every session of the account ends (session version). Bad link: 400 invalid_link.
export const POST = withErrors(async (request: Request) => {
  const input = passwordResetConfirmSchema.parse(await readJson(request));
  await confirmPasswordReset(input.token, input.password);
  return json({ status: 'password-changed' as const });
});
