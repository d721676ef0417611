import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { authorizeCredentials } from '@/lib/auth/options';
import { decideThrottle, retryAfterMs, SIGN_IN_WINDOW_MS } from '@/lib/auth/rate-limit';
import { describeSignInError } from '@/lib/auth/sign-in-errors';
import { closeDb, db } from '@/lib/db/client';
import { recentEmailFailures, recordLoginAttempt } from '@/lib/db/login-attempts';
import { resetToDemo } from './db-fixture';

// Limits under test are the product's own choice (common practice): 10 failures per email and 50 per IP in a
// sliding 15-minute window.
const minute = 60_000;
const now = new Date('2026-03-01T12:00:00.000Z');
const ago = (ms: number) => new Date(now.getTime() - ms);
const failures = (count: number, everyMs: number, startAgoMs: number) =>
  Array.from({ length: count }, (_, i) => ago(startAgoMs - i * everyMs));

describe('retryAfterMs(failures, max, now)', () => {
  it('is 0 below the limit', () => {
    expect(retryAfterMs(failures(9, minute, 9 * minute), 10, now)).toBe(0);
  });

  it('waits until the oldest counted failure leaves the window', () => {
    // 10 failures, one a minute, the oldest 10 minutes ago: it leaves the window in 15 - 10 = 5 minutes.
    expect(retryAfterMs(failures(10, minute, 10 * minute), 10, now)).toBe(5 * minute);
  });

  it('with more than max failures, waits for failure n - max (so max - 1 remain)', () => {
    // 12 failures at 12..1 minutes ago: index 2 (10 minutes ago) must expire -> 5 minutes.
    expect(retryAfterMs(failures(12, minute, 12 * minute), 10, now)).toBe(5 * minute);
  });
});

describe('decideThrottle', () => {
  it('allows with few failures', () => {
    expect(decideThrottle(failures(3, minute, 3 * minute), [], now)).toEqual({ allowed: true });
  });

  it('refuses by email with the minutes rounded up', () => {
    const decision = decideThrottle(failures(10, 1000, 30_000), [], now);
    expect(decision).toMatchObject({ allowed: false, scope: 'email' });
    // oldest failure 30 s ago -> 14.5 minutes left -> "15 minutes"
    expect(decision.allowed === false && decision.retryAfterMinutes).toBe(15);
  });

  it('refuses by IP at 50 failures from one address', () => {
    const decision = decideThrottle(failures(2, minute, 2 * minute), failures(50, 1000, 60_000), now);
    expect(decision).toMatchObject({ allowed: false, scope: 'ip', retryAfterMinutes: 14 });
  });

  it('the sign-in page words a refusal with the minutes', () => {
    expect(describeSignInError('rate-limited-email-7')).toBe('Too many attempts for this email; try again in 7 minutes.');
    expect(describeSignInError('rate-limited-email-1')).toBe('Too many attempts for this email; try again in 1 minute.');
  });
});

describe('authorizeCredentials against MariaDB', () => {
  beforeEach(async () => {
    await resetToDemo();
  });
  afterAll(async () => {
    await resetToDemo(); // leave the shared test database as the demo scenario
    await closeDb();
  });

  it('accepts the demo coach and records a successful attempt', async () => {
    const user = await authorizeCredentials({ email: 'Coach@Stanceline.test', password: 'stanceline-demo' }, '10.0.0.1', now);
    expect(user).toMatchObject({ id: '2', role: 'coach', academyId: 1, name: 'Maren Solberg' });
    const rows = await db('login_attempts').where({ email: 'coach@stanceline.test' });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ ip: '10.0.0.1', succeeded: true });
  });

  it('returns null for a wrong password and for an unknown email', async () => {
    expect(await authorizeCredentials({ email: 'coach@stanceline.test', password: 'nope' }, '10.0.0.1', now)).toBeNull();
    expect(await authorizeCredentials({ email: 'nobody@stanceline.test', password: 'nope' }, '10.0.0.1', now)).toBeNull();
  });

  it('refuses the 11th attempt after 10 failures, even with the right password', async () => {
    for (let i = 0; i < 10; i += 1) {
      const at = new Date(now.getTime() - (10 - i) * 1000);
      await recordLoginAttempt({ email: 'coach@stanceline.test', ip: '10.0.0.2', succeeded: false, at });
    }
    await expect(authorizeCredentials({ email: 'coach@stanceline.test', password: 'stanceline-demo' }, '10.0.0.3', now)).rejects.toThrow(
      /^rate-limited-email-15$/,
    );
    // The refusal itself is not recorded, so the promised wait stays true.
    expect(await db('login_attempts').where({ email: 'coach@stanceline.test' }).count({ n: '*' }).first()).toMatchObject({ n: 10 });
    // 15 minutes after the oldest failure the account opens again.
    const later = new Date(now.getTime() - 10_000 + SIGN_IN_WINDOW_MS + 1);
    expect(await authorizeCredentials({ email: 'coach@stanceline.test', password: 'stanceline-demo' }, '10.0.0.3', later)).not.toBeNull();
  });

  it('refuses an IP after 50 failures across many emails', async () => {
    const rows = Array.from({ length: 50 }, (_, i) => ({
      email: `spray-${i}@example.test`,
      ip: '10.9.9.9',
      succeeded: false,
      attempted_at: new Date(now.getTime() - 60_000 + i * 100),
    }));
    await db('login_attempts').insert(rows);
    await expect(authorizeCredentials({ email: 'coach@stanceline.test', password: 'stanceline-demo' }, '10.9.9.9', now)).rejects.toThrow(
      /^rate-limited-ip-\d+$/,
    );
    expect(await authorizeCredentials({ email: 'coach@stanceline.test', password: 'stanceline-demo' }, '10.9.9.8', now)).not.toBeNull();
  });

  it('a success clears the earlier failures of that email', async () => {
    await recordLoginAttempt({ email: 'coach@stanceline.test', ip: '10.0.0.2', succeeded: false, at: ago(5 * minute) });
    await recordLoginAttempt({ email: 'coach@stanceline.test', ip: '10.0.0.2', succeeded: true, at: ago(4 * minute) });
    await recordLoginAttempt({ email: 'coach@stanceline.test', ip: '10.0.0.2', succeeded: false, at: ago(3 * minute) });
    const counted = await recentEmailFailures('coach@stanceline.test', ago(SIGN_IN_WINDOW_MS));
    expect(counted.map((d) => d.toISOString())).toEqual([ago(3 * minute).toISOString()]);
  });

  it('a deactivated account is refused with the right password', async () => {
    await db('users').where({ id: 2 }).update({ active: false });
    expect(await authorizeCredentials({ email: 'coach@stanceline.test', password: 'stanceline-demo' }, '10.0.0.1', now)).toBeNull();
  });

  it('40 concurrent wrong passwords for one email: at most 10 are evaluated, the rest refused (was: all 40)', async () => {
    const outcomes = await Promise.allSettled(
      Array.from({ length: 40 }, (_, i) => authorizeCredentials({ email: 'coach@stanceline.test', password: `wrong-${i}` }, `10.1.0.${i}`, now)),
    );
    const evaluated = outcomes.filter((o) => o.status === 'fulfilled');
    const refused = outcomes.filter((o) => o.status === 'rejected');
    expect(evaluated.length).toBeLessThanOrEqual(10);
    expect(evaluated.length).toBeGreaterThan(0);
    for (const o of refused) expect(String((o as PromiseRejectedResult).reason)).toMatch(/rate-limited-email-\d+/);
    expect(await db('login_attempts').where({ email: 'coach@stanceline.test' }).count({ n: '*' }).first()).toMatchObject({ n: evaluated.length });
  });

  it('with 45 failures from one IP, 20 concurrent attempts over other emails: at most 5 more are evaluated', async () => {
    const rows = Array.from({ length: 45 }, (_, i) => ({ email: `spray-${i}@example.test`, ip: '10.7.7.7', succeeded: false, attempted_at: new Date(now.getTime() - 60_000 + i * 100) }));
    await db('login_attempts').insert(rows);
    const outcomes = await Promise.allSettled(
      Array.from({ length: 20 }, (_, i) => authorizeCredentials({ email: `other-${i}@example.test`, password: 'nope' }, '10.7.7.7', now)),
    );
    expect(outcomes.filter((o) => o.status === 'fulfilled').length).toBeLessThanOrEqual(5);
    expect(await db('login_attempts').where({ ip: '10.7.7.7' }).count({ n: '*' }).first()).toMatchObject({ n: 50 });
  });

  it('malformed input is a coded error, not a crash', async () => {
    await expect(authorizeCredentials({ email: 'not an email', password: '' }, '10.0.0.1', now)).rejects.toThrow('invalid-input');
  });
});
