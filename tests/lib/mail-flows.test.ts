// Every mail of lib/mail through the real SMTP path: nodemailer -> the local SMTP fake (smtp-server) -> an .eml file
// -> mailparser. Invitations, password reset, sharing and drill reminders on a real MariaDB (the demo scenario).
// Outside references beside each check: RFC 2046 (multipart/alternative), RFC 4648 section 5 (base64url), FIPS 180-4
// / the SHA-256 test vector, OWASP's Forgot Password Cheat Sheet (same answer for known and unknown addresses).
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startSmtpFake } from '@/scripts/lib/fakes/smtp';
import type { Viewer } from '@/lib/auth/viewer';
import { resetToDemo } from './db-fixture';

const mailDir = mkdtempSync(join(tmpdir(), 'stanceline-mail-test-'));
let fake: Awaited<ReturnType<typeof startSmtpFake>>;

// The environment is read once (lib/env.ts): set it before any app module loads.
beforeAll(async () => {
  fake = await startSmtpFake(mailDir);
  Object.assign(process.env, fake.env, { NEXTAUTH_URL: 'http://127.0.0.1:3999' });
});
afterAll(async () => {
  const { closeDb } = await import('@/lib/db/client');
  await closeDb();
  await fake?.stop();
});
beforeEach(async () => {
  await resetToDemo();
});

const admin: Viewer = { id: 1, role: 'admin', academyId: 1, name: 'Wren Castellane', email: 'admin@stanceline.test' };
const coach: Viewer = { id: 2, role: 'coach', academyId: 1, name: 'Maren Solberg', email: 'coach@stanceline.test' };
const student: Viewer = { id: 4, role: 'student', academyId: 1, name: 'Ada Fenwick', email: 'student@stanceline.test' };
const HOUR = 3_600_000;
const PASSWORD = 'a-new-long-password';

let seen = new Set<string>();
/** The mails that arrived since the last call, parsed (the fake writes one .eml per message). */
async function newMails(expected: number): Promise<ParsedMail[]> {
  const deadline = Date.now() + 10_000;
  let fresh: string[] = [];
  while (Date.now() < deadline) {
    fresh = readdirSync(mailDir).filter((n) => n.endsWith('.eml') && !seen.has(n)).sort();
    if (fresh.length >= expected) break;
    await new Promise((r) => setTimeout(r, 50));
  }
  fresh.forEach((n) => seen.add(n));
  return Promise.all(fresh.map((n) => simpleParser(readFileSync(join(mailDir, n)))));
}

function tokenIn(mail: ParsedMail, path: string): string {
  const match = (mail.text ?? '').match(new RegExp(`${path}/([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link in:\n${mail.text}`);
  return match[1]!;
}

/** The same token with one character changed. */
const altered = (token: string) => token.slice(0, 10) + (token[10] === 'A' ? 'B' : 'A') + token.slice(11);

/** Both parts present (RFC 2046 multipart/alternative: text/plain and text/html), the academy named, a reason given. */
function expectWellFormed(mail: ParsedMail, link: RegExp) {
  expect(mail.text).toBeTruthy();
  expect(typeof mail.html === 'string' && mail.html.length > 0).toBe(true);
  expect(mail.headers.get('content-type')).toMatchObject({ value: 'multipart/alternative' });
  for (const part of [mail.text!, mail.html as string]) {
    expect(part).toContain('Harrow Vale Golf Academy');
    expect(part).toMatch(/You received this because/);
    expect(part).toMatch(link);
  }
}

describe('tokens', () => {
  it('hashToken is SHA-256 hex (FIPS 180-4 test vector "abc"); tokens are 43 base64url characters (RFC 4648 section 5)', async () => {
    const { hashToken, newToken } = await import('@/lib/accounts/tokens');
    // SHA-256("abc"), the one-block example of FIPS 180-2 appendix B.1 (also printed by python3 -c "import hashlib; print(hashlib.sha256(b'abc').hexdigest())")
    expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    const a = newToken();
    const b = newToken();
    expect(a.token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 bytes -> ceil(256 / 6) = 43 characters, no padding
    expect(a.token).not.toBe(b.token);
    expect(a.hash).toBe(hashToken(a.token));
  });
});

describe('invitations', () => {
  it('admin invites a coach: the mail links /invite/<token>; only the hash is stored; the link works once', async () => {
    const { createInvitation, acceptInvitation, describeInvitation } = await import('@/lib/accounts/invitations');
    const { db } = await import('@/lib/db/client');
    const { hashToken } = await import('@/lib/accounts/tokens');
    seen = new Set(readdirSync(mailDir));
    const invitation = await createInvitation(admin, { email: 'new.coach@stanceline.test', role: 'coach' });
    expect(invitation).toMatchObject({ email: 'new.coach@stanceline.test', role: 'coach', athleteId: null, expired: false });
    // 72 h between sending and expiry
    expect(Date.parse(invitation.expiresAt) - Date.parse(invitation.sentAt)).toBe(72 * HOUR);

    const [mail] = await newMails(1);
    expect(mail!.to).toMatchObject({ text: 'new.coach@stanceline.test' });
    expectWellFormed(mail!, /http:\/\/127\.0\.0\.1:3999\/invite\/[A-Za-z0-9_-]{43}/);
    const token = tokenIn(mail!, '/invite');
    const row = await db('invitations').where({ id: invitation.id }).first();
    expect(row.token_hash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);

    expect(await describeInvitation(altered(token))).toBeNull();
    await expect(acceptInvitation({ token: altered(token), password: PASSWORD })).rejects.toMatchObject({ status: 400 });
    expect(await describeInvitation(token)).toMatchObject({ email: 'new.coach@stanceline.test', role: 'coach', academyName: 'Harrow Vale Golf Academy' });
    const accepted = await acceptInvitation({ token, password: PASSWORD, name: 'Ines Marlow' });
    expect(accepted.user).toMatchObject({ email: 'new.coach@stanceline.test', role: 'coach', name: 'Ines Marlow' });
    const { verifyPassword } = await import('@/lib/auth/password');
    const user = await db('users').where({ id: accepted.user.id }).first('password_hash', 'academy_id');
    expect(await verifyPassword(PASSWORD, user.password_hash)).toBe(true);
    expect(user.academy_id).toBe(1);
    // used: refused the second time
    await expect(acceptInvitation({ token, password: PASSWORD })).rejects.toMatchObject({ status: 400, code: 'invalid_link' });
    expect(await describeInvitation(token)).toBeNull();
  });

  it('an expired link is refused (72 h)', async () => {
    const { createInvitation, acceptInvitation } = await import('@/lib/accounts/invitations');
    seen = new Set(readdirSync(mailDir));
    const sentAt = new Date('2026-12-01T08:00:00Z');
    await createInvitation(admin, { email: 'late@stanceline.test', role: 'researcher' }, sentAt);
    const token = tokenIn((await newMails(1))[0]!, '/invite');
    await expect(acceptInvitation({ token, password: PASSWORD }, new Date(sentAt.getTime() + 72 * HOUR + 1))).rejects.toMatchObject({ status: 400 });
    // one minute before the end it still works
    await expect(acceptInvitation({ token, password: PASSWORD }, new Date(sentAt.getTime() + 72 * HOUR - 60_000))).resolves.toMatchObject({ user: { role: 'researcher' } });
  });

  it('coach invites a student for a roster player: accepting links the account like POST /api/athletes/:id/account', async () => {
    const { createInvitation, acceptInvitation } = await import('@/lib/accounts/invitations');
    const { athleteAccess } = await import('@/lib/auth/access');
    const { linkedAccount } = await import('@/lib/athletes/account-link');
    seen = new Set(readdirSync(mailDir));
    await createInvitation(coach, { email: 'jonah@stanceline.test', role: 'student', athleteId: 2 });
    const [mail] = await newMails(1);
    expect(mail!.text).toContain('Jonah Pelliker');
    const accepted = await acceptInvitation({ token: tokenIn(mail!, '/invite'), password: PASSWORD });
    expect(accepted).toMatchObject({ athleteId: 2, user: { role: 'student', name: 'Jonah Pelliker' } });
    expect(await linkedAccount(2)).toEqual({ id: accepted.user.id, email: 'jonah@stanceline.test', name: 'Jonah Pelliker' });
    const viewer: Viewer = { id: accepted.user.id, role: 'student', academyId: 1, name: 'Jonah Pelliker', email: 'jonah@stanceline.test' };
    expect(await athleteAccess(viewer, 2)).toBe('student');
    expect(await athleteAccess(viewer, 1)).toBeNull();
  });

  it('a coach cannot invite other roles, nor for another coach’s player; resend replaces the link; revoke ends it', async () => {
    const { createInvitation, resendInvitation, revokeInvitation, acceptInvitation, listPendingInvitations } = await import('@/lib/accounts/invitations');
    await expect(createInvitation(coach, { email: 'x@stanceline.test', role: 'coach' })).rejects.toMatchObject({ status: 403 });
    await expect(createInvitation(coach, { email: 'x@stanceline.test', role: 'student', athleteId: 4 })).rejects.toMatchObject({ status: 404 });
    await expect(createInvitation(coach, { email: 'x@stanceline.test', role: 'student', athleteId: 1 })).rejects.toMatchObject({ status: 409 }); // already linked
    seen = new Set(readdirSync(mailDir));
    const inv = await createInvitation(coach, { email: 'sunniva@stanceline.test', role: 'student', athleteId: 3 });
    const first = tokenIn((await newMails(1))[0]!, '/invite');
    await resendInvitation(coach, inv.id);
    const second = tokenIn((await newMails(1))[0]!, '/invite');
    expect(second).not.toBe(first);
    await expect(acceptInvitation({ token: first, password: PASSWORD })).rejects.toMatchObject({ status: 400 });
    expect((await listPendingInvitations(coach)).map((i) => i.id)).toContain(inv.id);
    // coach2 does not see it, and cannot revoke it
    const coach2: Viewer = { id: 3, role: 'coach', academyId: 1, name: 'Tobias Quill', email: 'coach2@stanceline.test' };
    expect((await listPendingInvitations(coach2)).map((i) => i.id)).not.toContain(inv.id);
    await expect(revokeInvitation(coach2, inv.id)).rejects.toMatchObject({ status: 404 });
    await revokeInvitation(coach, inv.id);
    await expect(acceptInvitation({ token: second, password: PASSWORD })).rejects.toMatchObject({ status: 400 });
  });
});

describe('password reset', () => {
  it('known address: a 1 h single-use link; the reset changes the password and bumps the session version', async () => {
    const { requestPasswordReset, confirmPasswordReset } = await import('@/lib/accounts/password-reset');
    const { db } = await import('@/lib/db/client');
    const before = await db('users').where({ id: 4 }).first('session_version');
    seen = new Set(readdirSync(mailDir));
    const send = await requestPasswordReset('student@stanceline.test', '10.0.0.1');
    expect(send).not.toBeNull();
    await send!();
    const [mail] = await newMails(1);
    expectWellFormed(mail!, /\/reset-password\/[A-Za-z0-9_-]{43}/);
    const token = tokenIn(mail!, '/reset-password');
    await expect(confirmPasswordReset(altered(token), PASSWORD)).rejects.toMatchObject({ status: 400 });
    await confirmPasswordReset(token, PASSWORD);
    const after = await db('users').where({ id: 4 }).first('session_version', 'password_hash');
    expect(after.session_version).toBe(before.session_version + 1);
    const { verifyPassword } = await import('@/lib/auth/password');
    expect(await verifyPassword(PASSWORD, after.password_hash)).toBe(true);
    await expect(confirmPasswordReset(token, 'another-long-password')).rejects.toMatchObject({ status: 400 });
  });

  it('an expired link (past 1 h) is refused; an unknown address gets no mail', async () => {
    const { requestPasswordReset, confirmPasswordReset } = await import('@/lib/accounts/password-reset');
    seen = new Set(readdirSync(mailDir));
    const at = new Date();
    await (await requestPasswordReset('coach@stanceline.test', '10.0.0.2', at))!();
    const token = tokenIn((await newMails(1))[0]!, '/reset-password');
    await expect(confirmPasswordReset(token, PASSWORD, new Date(at.getTime() + HOUR + 1))).rejects.toMatchObject({ status: 400 });
    expect(await requestPasswordReset('nobody@stanceline.test', '10.0.0.2')).toBeNull();
    expect(await newMails(0)).toHaveLength(0);
  });

  it('is rate-limited per address whether or not it exists (3 an hour, common practice)', async () => {
    const { requestPasswordReset, RESET_LIMITS } = await import('@/lib/accounts/password-reset');
    for (const email of ['coach2@stanceline.test', 'ghost@stanceline.test']) {
      for (let i = 0; i < RESET_LIMITS.perEmail.points; i++) await requestPasswordReset(email, `10.1.0.${i}`);
      await expect(requestPasswordReset(email, '10.1.0.99')).rejects.toMatchObject({ status: 429, code: 'rate_limited' });
    }
  });
});

describe('sharing', () => {
  it('a lesson summary: the student gets a link (no numbers) and sees the shares newest first (a swing: tests/http/mail.test.ts)', async () => {
    const { shareWithStudent, listSharesForStudent } = await import('@/lib/accounts/shares');
    const { db } = await import('@/lib/db/client');
    const session = await db('practice_sessions').where({ athlete_id: 1 }).whereNull('binned_at').orderBy('id').first('id');
    seen = new Set(readdirSync(mailDir));
    const first = await shareWithStudent(coach, { sessionId: session.id, note: 'Look at the finish.' }, new Date('2026-12-02T09:00:00Z'));
    const [mail] = await newMails(1);
    expect(mail!.to).toMatchObject({ text: 'student@stanceline.test' });
    expectWellFormed(mail!, new RegExp(`/sessions/${session.id}/summary`));
    expect(mail!.text).toContain('Look at the finish.');
    // a link, never measurements: no percentages, forces or seconds in the mail
    expect(mail!.text).not.toMatch(/%|\bN\b|\bkg\b|\d\s?s\b/);
    // a second share later: listed first
    const laterSession = await db('practice_sessions').where({ athlete_id: 1 }).whereNull('binned_at').orderBy('id', 'desc').first('id');
    const second = await shareWithStudent(coach, { sessionId: laterSession.id }, new Date('2026-12-02T10:00:00Z'));
    expect((await listSharesForStudent(student)).map((s) => s.id)).toEqual([second.id, first.id]);
    // another coach's player, or a player without a student account
    await expect(shareWithStudent(coach, { sessionId: (await db('practice_sessions').where({ athlete_id: 4 }).first('id')).id })).rejects.toMatchObject({ status: 404 });
    const jonahSession = await db('practice_sessions').where({ athlete_id: 2 }).first('id');
    if (jonahSession) await expect(shareWithStudent(coach, { sessionId: jonahSession.id })).rejects.toMatchObject({ status: 409 });
  });
});

describe('drill reminders', () => {
  it('at most one a day, none after opting out', async () => {
    const { notifyDrillAssigned, setMailPreferences } = await import('@/lib/accounts/drill-mail');
    const { db } = await import('@/lib/db/client');
    const drill = (await db('drills').first('id'))!;
    const assign = async (due: string) => Number((await db('drill_assignments').insert({ drill_id: drill.id, athlete_id: 1, assigned_by: 2, assigned_at: '2026-12-02', due_date: due }))[0]);
    seen = new Set(readdirSync(mailDir));
    const day = new Date('2026-12-02T09:00:00Z');
    expect(await notifyDrillAssigned(await assign('2026-12-05'), day)).toBe(true);
    const [mail] = await newMails(1);
    expectWellFormed(mail!, /\/drills/);
    expect(mail!.text).toMatch(/physician or physiotherapist/);
    expect(await notifyDrillAssigned(await assign('2026-12-06'), new Date('2026-12-02T18:00:00Z'))).toBe(false);
    expect(await newMails(0)).toHaveLength(0);
    // the next UTC day may send again
    expect(await notifyDrillAssigned(await assign('2026-12-07'), new Date('2026-12-03T07:00:00Z'))).toBe(true);
    await newMails(1);
    await setMailPreferences(student, { drillReminders: false });
    expect(await notifyDrillAssigned(await assign('2026-12-08'), new Date('2026-12-04T07:00:00Z'))).toBe(false);
  });

  it('the daily run mails students with a drill due tomorrow', async () => {
    const { sendDueTomorrowReminders } = await import('@/lib/accounts/drill-mail');
    const { db } = await import('@/lib/db/client');
    const drill = (await db('drills').first('id', 'name'))!;
    await db('drill_assignments').where({ athlete_id: 1 }).delete();
    await db('drill_assignments').insert({ drill_id: drill.id, athlete_id: 1, assigned_by: 2, assigned_at: '2026-12-01', due_date: '2026-12-11' });
    seen = new Set(readdirSync(mailDir));
    expect(await sendDueTomorrowReminders(new Date('2026-12-09T06:00:00Z'))).toBe(0); // due in two days
    expect(await sendDueTomorrowReminders(new Date('2026-12-10T06:00:00Z'))).toBe(1);
    expect(await sendDueTomorrowReminders(new Date('2026-12-10T07:00:00Z'))).toBe(0); // the hourly run again: already sent today
    const [mail] = await newMails(1);
    expect(mail!.text).toContain(`Due tomorrow: “${drill.name}”`);
  });
});
