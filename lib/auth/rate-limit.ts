// Sign-in throttling: a sliding window over recorded failures.
// Limits are our own choice (common practice for credential stuffing defence): 10 failures per email and
// 50 per IP address within 15 minutes; the next attempt is refused, even with the right password, until enough
// failures have left the window.

export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_EMAIL = 10;
export const MAX_FAILURES_PER_IP = 50;

export type ThrottleDecision =
  | { allowed: true }
  | { allowed: false; scope: 'email' | 'ip'; retryAfterMs: number; retryAfterMinutes: number };

/**
 * `failures` sorted oldest first, all inside the window ending at `now`. With n >= max failures the attempt is
 * refused until failure number n - max (0-based) leaves the window: then n - 1 - (n - max) = max - 1 remain.
 */
export function retryAfterMs(failures: readonly Date[], max: number, now: Date, windowMs = SIGN_IN_WINDOW_MS): number {
  if (failures.length < max) return 0;
  const gate = failures[failures.length - max];
  return Math.max(0, gate.getTime() + windowMs - now.getTime());
}

export function decideThrottle(
  emailFailures: readonly Date[],
  ipFailures: readonly Date[],
  now: Date,
  limits = { perEmail: MAX_FAILURES_PER_EMAIL, perIp: MAX_FAILURES_PER_IP, windowMs: SIGN_IN_WINDOW_MS },
): ThrottleDecision {
  const emailWait = retryAfterMs(emailFailures, limits.perEmail, now, limits.windowMs);
  const ipWait = retryAfterMs(ipFailures, limits.perIp, now, limits.windowMs);
  if (emailWait <= 0 && ipWait <= 0) return { allowed: true };
  const scope = emailWait >= ipWait ? 'email' : 'ip';
  const wait = Math.max(emailWait, ipWait);
  return { allowed: false, scope, retryAfterMs: wait, retryAfterMinutes: Math.max(1, Math.ceil(wait / 60_000)) };
}
