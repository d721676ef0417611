// Accounts by e-mail over HTTP against the running app and its SMTP fake: invitations, password reset (identical
// answers for known and unknown addresses, rate-limited: OWASP Forgot Password Cheat Sheet, "return a consistent
// message for both existent and non-existent accounts"), sharing, and the demo outbox.
import { beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, e2eEnv } from './support/env';
import { HttpSession, signedIn } from './support/http-session';
import { alterOne, linkIn, mailsNow, waitForMail } from './support/mail';
import { sampleRecording } from './support/recordings-http';

const env = e2eEnv();
const run = Date.now().toString(36);
const post = (body: unknown): RequestInit => ({ method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
let admin: HttpSession;
let coach: HttpSession;

beforeAll(async () => {
  admin = await signedIn(env.E2E_BASE_URL, DEMO.admin, DEMO_PASSWORD);
  coach = await signedIn(env.E2E_BASE_URL, DEMO.coach, DEMO_PASSWORD);
});

describe('invitation over HTTP', () => {
  it('201, a mail with /invite/<token>; the page opens signed out; accept 200 once; altered and used tokens 400', async () => {
    const email = `invited-${run}@stanceline.test`;
    const before = mailsNow();
    const created = await admin.json('/api/invitations', post({ email, role: 'coach' }));
    expect(created.status).toBe(201);
    const mail = await waitForMail(email, before);
    expect(mail.text).toBeTruthy();
    expect(typeof mail.html).toBe('string');
    const { url, token } = linkIn(mail, '/invite');
    expect(url.startsWith(env.E2E_BASE_URL)).toBe(true);

    const visitor = new HttpSession(env.E2E_BASE_URL);
    const page = await visitor.fetch(`/invite/${token}`, { redirect: 'manual' });
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Join Harrow Vale Golf Academy');

    expect((await visitor.json('/api/invitations/accept', post({ token: alterOne(token), password: 'a-long-enough-password' }))).status).toBe(400);
    const accepted = await visitor.json('/api/invitations/accept', post({ token, password: 'a-long-enough-password' }));
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ user: { email, role: 'coach' }, athleteId: null });
    const again = await visitor.json('/api/invitations/accept', post({ token, password: 'a-long-enough-password' }));
    expect(again.status).toBe(400);
    expect(again.body).toMatchObject({ error: { code: 'invalid_link' } });
    // the new account signs in
    await signedIn(env.E2E_BASE_URL, email, 'a-long-enough-password');
  });
});

describe('password reset over HTTP', () => {
  it('202 with the same body for a known and an unknown address', async () => {
    const visitor = new HttpSession(env.E2E_BASE_URL);
    const known = await visitor.json('/api/password-reset', post({ email: DEMO.researcher }));
    const unknown = await visitor.json('/api/password-reset', post({ email: `nobody-${run}@stanceline.test` }));
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    expect(known.contentType).toBe(unknown.contentType);
  });

  it('is rate-limited per address (the 4th request in an hour is 429), for unknown addresses too', async () => {
    const visitor = new HttpSession(env.E2E_BASE_URL);
    const email = `limited-${run}@stanceline.test`;
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await visitor.json('/api/password-reset', post({ email }))).status);
    const limited = await visitor.fetch('/api/password-reset', post({ email }));
    statuses.push(limited.status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    // RFC 9110 10.2.3: delay-seconds, here within the hour the limit counts
    const retryAfter = limited.headers.get('retry-after');
    expect(retryAfter).toMatch(/^\d+$/);
    expect(Number(retryAfter)).toBeGreaterThan(0);
    expect(Number(retryAfter)).toBeLessThanOrEqual(3600);
    expect(((await limited.json()) as { error: { code: string } }).error.code).toBe('rate_limited');
  });

  it('the link works once, changes the password and ends the other sessions', async () => {
    const email = `reset-${run}@stanceline.test`;
    const made = await admin.json('/api/users', post({ email, name: 'Reset Person', role: 'researcher', password: 'the-first-password' }));
    expect(made.status).toBe(201);
    const other = await signedIn(env.E2E_BASE_URL, email, 'the-first-password');
    expect((await other.json('/api/me')).status).toBe(200);

    const before = mailsNow();
    const visitor = new HttpSession(env.E2E_BASE_URL);
    expect((await visitor.json('/api/password-reset', post({ email }))).status).toBe(202);
    const mail = await waitForMail(email, before);
    const { token } = linkIn(mail, '/reset-password');
    expect((await visitor.json('/api/password-reset/confirm', post({ token: alterOne(token), password: 'the-second-password' }))).status).toBe(400);
    const done = await visitor.json('/api/password-reset/confirm', post({ token, password: 'the-second-password' }));
    expect(done.status).toBe(200);
    expect(done.body).toEqual({ status: 'password-changed' });
    expect((await visitor.json('/api/password-reset/confirm', post({ token, password: 'the-third-password' }))).status).toBe(400);
    // the session from before the reset is over (session version)
    expect((await other.json('/api/me')).status).toBe(401);
    await signedIn(env.E2E_BASE_URL, email, 'the-second-password');
  });
});

describe('sharing one swing', () => {
  it('the coach shares a swing; the student gets a mail with its link and sees it first on GET /api/shares', async () => {
    const sample = await sampleRecording(coach);
    const email = `share-${run}@stanceline.test`;
    expect((await admin.json('/api/users', post({ email, name: 'Share Student', role: 'student', password: 'a-long-enough-password' }))).status).toBe(201);
    expect((await coach.json(`/api/athletes/${sample.athleteId}/account`, post({ email }))).status).toBe(200);
    const before = mailsNow();
    const shared = await coach.json('/api/shares', post({ swingId: sample.swingId, note: 'Watch the weight shift here.' }));
    expect(shared.status).toBe(201);
    const mail = await waitForMail(email, before);
    expect(mail.text).toContain(`/swings/${sample.swingId}`);
    expect(typeof mail.html).toBe('string');
    const student = await signedIn(env.E2E_BASE_URL, email, 'a-long-enough-password');
    const list = await student.json('/api/shares');
    expect(list.status).toBe(200);
    expect((list.body as { shares: { swingId: number | null; kind: string }[] }).shares[0]).toMatchObject({ swingId: sample.swingId, kind: 'swing' });
    expect((await student.fetch(`/swings/${sample.swingId}`, { redirect: 'manual' })).status).toBe(200);
  });
});

describe('outbox (demo mode)', () => {
  it('lists the kept mails, newest first, with the text part and its links', async () => {
    const res = await admin.json('/api/outbox');
    expect(res.status).toBe(200);
    const messages = (res.body as { messages: { receivedAt: string; hasHtml: boolean; links: string[] }[] }).messages;
    expect(messages.length).toBeGreaterThan(0);
    const times = messages.map((m) => m.receivedAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(messages.every((m) => m.hasHtml && m.links.length > 0)).toBe(true);
  });
});
