import bcrypt from 'bcryptjs';
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knexConfig } from '@/knexfile';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession } from './support/http-session';

// A dedicated account for the throttle, so the demo accounts used by the other tests are never locked out.
const PROBE_EMAIL = 'throttle-probe@stanceline.test';
const PROBE_PASSWORD = 'throttle-probe-password';

let db: Knex;
let baseUrl: string;

beforeAll(async () => {
  const env = e2eEnv();
  baseUrl = env.E2E_BASE_URL;
  db = knex(knexConfig(env.DATABASE_URL));
  await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
  await db('users').where({ email: PROBE_EMAIL }).delete();
  await db('users').insert({
    academy_id: 1,
    email: PROBE_EMAIL,
    name: 'Throttle Probe',
    password_hash: await bcrypt.hash(PROBE_PASSWORD, 10),
    role: 'student',
    active: true,
    created_at: new Date(),
    updated_at: new Date(),
  });
});

afterAll(async () => {
  await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
  await db('users').where({ email: PROBE_EMAIL }).delete();
  await db.destroy();
});

describe('sign-in over HTTP', () => {
  it('the right password gives a session cookie and GET /api/me answers with the role', async () => {
    const session = new HttpSession(baseUrl);
    const result = await session.signIn(DEMO.coach, DEMO_PASSWORD);
    expect(result).toEqual({ ok: true, status: 200, error: null });
    expect(session.cookieNames()).toContain('next-auth.session-token');
    const me = await session.json('/api/me');
    expect(me.body).toMatchObject({ user: { email: DEMO.coach, role: 'coach', name: 'Maren Solberg' } });
  });

  it('the session cookie is httpOnly and SameSite=Lax (and not Secure over plain http)', async () => {
    const session = new HttpSession(baseUrl);
    expect((await session.signIn(DEMO.student, DEMO_PASSWORD)).ok).toBe(true);
    const line = session.setCookieLines.get('next-auth.session-token');
    expect(line).toBeDefined();
    expect(line).toMatch(/;\s*HttpOnly/i);
    expect(line).toMatch(/;\s*SameSite=Lax/i);
    expect(line).not.toMatch(/;\s*Secure/i);
  });

  it('a wrong password is refused with the credentials error and no session', async () => {
    const session = new HttpSession(baseUrl);
    const result = await session.signIn(PROBE_EMAIL, 'not-the-password');
    expect(result.ok).toBe(false);
    expect(result.status).toBe(401);
    expect(result.error).toBe('CredentialsSignin');
    expect((await session.json('/api/me')).status).toBe(401);
  });

  it('the sign-in page words the credentials error clearly', async () => {
    const html = await (await fetch(`${baseUrl}/sign-in?error=CredentialsSignin`)).text();
    expect(html).toContain('That email and password do not match an active account.');
  });

  it('after 10 failures in 15 minutes the 11th attempt is refused even with the right password', async () => {
    await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
    const session = new HttpSession(baseUrl);
    for (let i = 1; i <= 10; i += 1) {
      const result = await session.signIn(PROBE_EMAIL, `wrong-${i}`);
      expect(result.error, `attempt ${i}`).toBe('CredentialsSignin');
    }
    const eleventh = await session.signIn(PROBE_EMAIL, PROBE_PASSWORD);
    expect(eleventh.ok).toBe(false);
    // 10 failures just now: the oldest leaves the 15-minute window in at most 15 minutes.
    expect(eleventh.error).toMatch(/^rate-limited-email-(1[0-5]|[1-9])$/);
    expect((await session.json('/api/me')).status).toBe(401);

    const html = await (await fetch(`${baseUrl}/sign-in?error=${eleventh.error}`)).text();
    expect(html).toMatch(/Too many attempts for this email; try again in \d+ minutes?\./);

    // Other accounts are not affected by this email's lock.
    const other = await new HttpSession(baseUrl).signIn(DEMO.researcher, DEMO_PASSWORD);
    expect(other.ok).toBe(true);

    // Once the failures are outside the window (moved back 16 minutes), the right password works again.
    await db('login_attempts')
      .where({ email: PROBE_EMAIL })
      .update({ attempted_at: db.raw('attempted_at - interval 16 minute') });
    expect((await new HttpSession(baseUrl).signIn(PROBE_EMAIL, PROBE_PASSWORD)).ok).toBe(true);
  });

  it('40 concurrent wrong passwords for one email: at most 10 are evaluated (was: all 40)', async () => {
    await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
    const results = await Promise.all(Array.from({ length: 40 }, (_, i) => new HttpSession(baseUrl).signIn(PROBE_EMAIL, `wrong-${i}`)));
    const evaluated = results.filter((r) => r.error === 'CredentialsSignin');
    expect(evaluated.length).toBeLessThanOrEqual(10);
    expect(results.every((r) => r.error === 'CredentialsSignin' || /^rate-limited-email-\d+$/.test(r.error ?? ''))).toBe(true);
    expect(await db('login_attempts').where({ email: PROBE_EMAIL }).count({ n: '*' })).toEqual([{ n: evaluated.length }]);
    await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
  });

  it('a client-written X-Forwarded-For is not taken as its address (TRUST_PROXY is off)', async () => {
    await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
    const session = new HttpSession(baseUrl);
    const csrf = (await (await session.fetch('/api/auth/csrf')).json()) as { csrfToken: string };
    await session.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': '203.0.113.77' },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: PROBE_EMAIL, password: 'wrong', json: 'true' }),
    });
    const rows = await db('login_attempts').where({ email: PROBE_EMAIL }).select('ip');
    expect(rows).toHaveLength(1);
    expect(rows[0].ip).not.toBe('203.0.113.77');
    expect(rows[0].ip).toMatch(/127\.0\.0\.1$/); // the test connects over loopback
    await db('login_attempts').where({ email: PROBE_EMAIL }).delete();
  });

  it('a copied session token stops working once its user signs out (was: valid for up to 8 h)', async () => {
    const session = new HttpSession(baseUrl);
    expect((await session.signIn(PROBE_EMAIL, PROBE_PASSWORD)).ok).toBe(true);
    const copied = session.cookieHeader();
    const withCopy = () => fetch(`${baseUrl}/api/me`, { headers: { cookie: copied } }).then((r) => r.status);
    expect(await withCopy()).toBe(200);
    const csrf = (await (await session.fetch('/api/auth/csrf')).json()) as { csrfToken: string };
    const out = await session.fetch('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, json: 'true' }),
    });
    expect(out.status).toBeLessThan(400);
    expect(await withCopy()).toBe(401);
    // signing in again gives a working session under the new version
    const again = new HttpSession(baseUrl);
    expect((await again.signIn(PROBE_EMAIL, PROBE_PASSWORD)).ok).toBe(true);
    expect((await again.json('/api/me')).status).toBe(200);
  });

  it('getViewer decodes the cookie itself: a token altered in one character, or sealed with another secret, is a 401', async () => {
    const session = new HttpSession(baseUrl);
    expect((await session.signIn(PROBE_EMAIL, PROBE_PASSWORD)).ok).toBe(true);
    const header = session.cookieHeader();
    const match = /((?:__Secure-)?next-auth\.session-token)=([^;]+)/.exec(header)!;
    const [name, value] = [match[1], match[2]];
    const status = (cookie: string) => fetch(`${baseUrl}/api/me`, { headers: { cookie } }).then((r) => r.status);
    expect(await status(`${name}=${value}`)).toBe(200);
    // JWE compact form: the ciphertext is the 4th dot-separated part; A256GCM's tag refuses any change to it
    const parts = value.split('.');
    const c = parts[3];
    parts[3] = `${c.slice(0, 10)}${c[10] === 'A' ? 'B' : 'A'}${c.slice(11)}`;
    expect(await status(`${name}=${parts.join('.')}`)).toBe(401);
    const { encode } = await import('next-auth/jwt');
    const probe = await db('users').where({ email: PROBE_EMAIL }).first('id', 'session_version');
    const forged = await encode({ token: { uid: Number(probe.id), sv: Number(probe.session_version), role: 'coach', academyId: 1, name: 'x', email: PROBE_EMAIL }, secret: 'another-secret-of-at-least-32-characters!!' });
    expect(await status(`${name}=${forged}`)).toBe(401);
  });

  it('deactivating and reactivating an account does not revive its old tokens', async () => {
    const session = new HttpSession(baseUrl);
    expect((await session.signIn(PROBE_EMAIL, PROBE_PASSWORD)).ok).toBe(true);
    expect((await session.json('/api/me')).status).toBe(200);
    const adminSession = new HttpSession(baseUrl);
    expect((await adminSession.signIn(DEMO.admin, DEMO_PASSWORD)).ok).toBe(true);
    const probe = await db('users').where({ email: PROBE_EMAIL }).first('id');
    const patch = (active: boolean) =>
      adminSession.json(`/api/users/${probe.id}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ active }) });
    expect((await patch(false)).status).toBe(200);
    expect((await session.json('/api/me')).status).toBe(401);
    expect((await patch(true)).status).toBe(200);
    expect((await session.json('/api/me')).status).toBe(401); // the old token stays dead
    expect((await new HttpSession(baseUrl).signIn(PROBE_EMAIL, PROBE_PASSWORD)).ok).toBe(true);
  });

  it('a deactivated account cannot sign in', async () => {
    await db('users').where({ email: PROBE_EMAIL }).update({ active: false });
    const result = await new HttpSession(baseUrl).signIn(PROBE_EMAIL, PROBE_PASSWORD);
    expect(result.error).toBe('CredentialsSignin');
    await db('users').where({ email: PROBE_EMAIL }).update({ active: true });
  });
});
