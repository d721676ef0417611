import knex from 'knex';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { authorizeCredentials } from '@/lib/auth/options';
import { describeSignInError } from '@/lib/auth/sign-in-errors';
import { findFreePort } from '@/scripts/lib/free-port';

// With the database unreachable, sign-in must fail with a generic code: next-auth copies a thrown error's message
// into the redirect URL (?error=...), and "connect ECONNREFUSED 127.0.0.1:PORT" there told the world the address.
const globalForDb = globalThis as typeof globalThis & { __stancelineDb?: unknown };

afterAll(() => {
  globalForDb.__stancelineDb = undefined;
});

describe('sign-in with the database down', () => {
  it('throws "service-unavailable", not the driver message, and the page words it generically', async () => {
    const port = await findFreePort(); // nothing listens there
    const dead = knex({ client: 'mysql2', connection: { host: '127.0.0.1', port, user: 'x', password: 'x', database: 'x' }, pool: { min: 0, max: 1 }, acquireConnectionTimeout: 5_000 });
    globalForDb.__stancelineDb = dead;
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const outcome = authorizeCredentials({ email: 'coach@stanceline.test', password: 'stanceline-demo' }, '10.0.0.1');
      await expect(outcome).rejects.toThrow(/^service-unavailable$/);
      expect(String(log.mock.calls[0]?.[1])).toMatch(/ECONNREFUSED/); // the cause is kept in the server log
    } finally {
      log.mockRestore();
      globalForDb.__stancelineDb = undefined;
      await dead.destroy();
    }
    expect(describeSignInError('service-unavailable')).toBe('The service is unavailable right now; please try again in a few minutes.');
    // an unknown code (an old link with a leaked message) is shown as a generic failure, never echoed
    expect(describeSignInError('connect ECONNREFUSED 127.0.0.1:3311')).toBe('Sign-in failed. Please try again.');
  });
});
