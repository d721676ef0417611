// Password reset: the request answers the same for every address (the route sends PASSWORD_RESET_ACCEPTED) and is
// rate-limited per address and per client IP (rate-limiter-flexible on MariaDB, so every app process shares the
// counts). Only a known, active account gets a mail. Confirming sets the password, spends the token and bumps
// users.session_version in one transaction, which ends every other session of the account (DEVELOPERS.md, hardening).
import 'server-only';
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { hashPassword } from '@/lib/auth/password';
import { getDb, db } from '@/lib/db/client';
import { getEnv } from '@/lib/env';
import { HttpError } from '@/lib/http';
import { appUrl, sendPasswordResetMail } from '@/lib/mail';
import { RESET_MINUTES } from '@/lib/contracts/password-reset';
import { academyName } from './academy';
import { InvalidLinkError } from './invitations';
import { hashToken, newToken } from './tokens';

// Common practice, not a published value: a few requests per address an hour is plenty for a person who lost a
// password, and a per-IP cap slows anyone walking a list of addresses.
export const RESET_LIMITS = {
  perEmail: { points: 3, durationS: 60 * 60 },
  perIp: { points: 20, durationS: 60 * 60 },
} as const;

export class TooManyRequestsError extends HttpError {
  constructor(readonly retryAfterS: number) {
    super(429, 'rate_limited', `Too many requests for a new password. Try again in ${Math.max(1, Math.ceil(retryAfterS / 60))} minutes.`);
  }

  /** RFC 9110 section 10.2.3 (and RFC 6585 section 4): Retry-After in whole seconds. */
  override responseHeaders(): Record<string, string> {
    return { 'Retry-After': String(Math.max(1, Math.ceil(this.retryAfterS))) };
  }
}

type Limiters = { email: RateLimiterMySQL; ip: RateLimiterMySQL };
const globalForLimits = globalThis as typeof globalThis & { __stancelineResetLimits?: Limiters };

function limiters(): Limiters {
  if (globalForLimits.__stancelineResetLimits) return globalForLimits.__stancelineResetLimits;
  const dbName = decodeURIComponent(new URL(getEnv().DATABASE_URL).pathname.slice(1));
  const common = { storeClient: getDb(), storeType: 'knex', dbName, tableName: 'rate_limits', tableCreated: true, clearExpiredByTimeout: false };
  globalForLimits.__stancelineResetLimits = {
    email: new RateLimiterMySQL({ ...common, keyPrefix: 'reset-email', points: RESET_LIMITS.perEmail.points, duration: RESET_LIMITS.perEmail.durationS }),
    ip: new RateLimiterMySQL({ ...common, keyPrefix: 'reset-ip', points: RESET_LIMITS.perIp.points, duration: RESET_LIMITS.perIp.durationS }),
  };
  return globalForLimits.__stancelineResetLimits;
}

async function consume(limiter: RateLimiterMySQL, key: string): Promise<void> {
  try {
    await limiter.consume(key);
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) throw new TooManyRequestsError(Math.ceil(rejection.msBeforeNext / 1000));
    throw rejection;
  }
}

/**
 * Counts the request (per address, then per IP; both count whether or not the address exists, so a 429 tells nothing
 * about accounts) and returns the mail to send, or null for an unknown or inactive address. The caller sends it after
 * answering, so a known address does not answer slower than an unknown one.
 */
export async function requestPasswordReset(email: string, ip: string, now = new Date()): Promise<(() => Promise<void>) | null> {
  const { email: byEmail, ip: byIp } = limiters();
  await consume(byEmail, email);
  await consume(byIp, ip);
  const user = await db('users').where({ email, active: true }).first('id', 'academy_id', 'email');
  if (!user) return null;
  const { token, hash } = newToken();
  await db('password_resets').insert({ user_id: user.id, token_hash: hash, created_at: now, expires_at: new Date(now.getTime() + RESET_MINUTES * 60_000) });
  return async () => {
    await sendPasswordResetMail(user.email, { academyName: await academyName(Number(user.academy_id)), url: appUrl(`/reset-password/${token}`), expiresMinutes: RESET_MINUTES });
  };
}

/** Whether a reset link can still be used (the page asks before showing the form). */
export async function resetLinkUsable(token: string, now = new Date()): Promise<boolean> {
  if (!/^[A-Za-z0-9_-]{43}$/.test(token)) return false;
  const row = await db('password_resets as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where({ 'r.token_hash': hashToken(token), 'u.active': true })
    .whereNull('r.used_at')
    .where('r.expires_at', '>', now)
    .first('r.id');
  return Boolean(row);
}

export async function confirmPasswordReset(token: string, password: string, now = new Date()): Promise<{ userId: number; email: string }> {
  // A cheap look first, so a link that matches nothing costs no password hash (a public route); checked again under lock.
  if (!(await resetLinkUsable(token, now))) throw new InvalidLinkError();
  const passwordHash = await hashPassword(password);
  return db.transaction(async (trx) => {
    const row = await trx('password_resets as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where({ 'r.token_hash': hashToken(token), 'u.active': true })
      .whereNull('r.used_at')
      .where('r.expires_at', '>', now)
      .forUpdate()
      .first('r.id', 'r.user_id', 'u.email');
    if (!row) throw new InvalidLinkError('This link is not valid: it may have been used already, have expired, or be mistyped. Ask for a new one.');
    await trx('password_resets').where({ id: row.id }).update({ used_at: now });
    // any other open link of the account dies with this one
    await trx('password_resets').where({ user_id: row.user_id }).whereNull('used_at').update({ used_at: now });
    await trx('users')
      .where({ id: row.user_id })
      .update({ password_hash: passwordHash, session_version: db.raw('session_version + 1'), updated_at: now });
    return { userId: Number(row.user_id), email: row.email };
  });
}
