// Error codes passed from authorize() to the sign-in page through next-auth's `error` parameter,
// and the words shown for each. Shared by server and client, so no server imports here.

/** Sign-in could not be checked (database down, ...): the cause goes to the server log, never into the URL. */
export const SERVICE_UNAVAILABLE = 'service-unavailable';

export function rateLimitedCode(scope: 'email' | 'ip', minutes: number): string {
  return `rate-limited-${scope}-${minutes}`;
}

export function describeSignInError(code: string | null | undefined): string | null {
  if (!code) return null;
  const limited = /^rate-limited-(email|ip)-(\d+)$/.exec(code);
  if (limited) {
    const minutes = Number(limited[2]);
    const unit = minutes === 1 ? 'minute' : 'minutes';
    return limited[1] === 'email'
      ? `Too many attempts for this email; try again in ${minutes} ${unit}.`
      : `Too many sign-in attempts from your network; try again in ${minutes} ${unit}.`;
  }
  if (code === 'CredentialsSignin') return 'That email and password do not match an active account.';
  if (code === 'invalid-input') return 'Enter a valid email address and your password.';
  if (code === 'SessionRequired') return 'Sign in to continue.';
  if (code === SERVICE_UNAVAILABLE) return 'The service is unavailable right now; please try again in a few minutes.';
  return 'Sign-in failed. Please try again.';
}
