// The sweep of spent sign-in links (lib/accounts/token-sweep.ts) on the real integration MariaDB: what goes and what
// stays, around each cut-off. The retention periods are the module's own (common practice, its header says why);
// the test checks that rows on each side of them are treated as the module promises.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/client';
import { RESET_KEEP_DAYS, sweepSpentTokens } from '@/lib/accounts/token-sweep';
import { BIN_DAYS } from '@/lib/contracts/sessions';
import { resetToDemo } from './db-fixture';

const DAY = 24 * 60 * 60 * 1000;
const now = new Date('2026-12-02T12:00:00Z');
const ago = (days: number, plusMs = 0) => new Date(now.getTime() - days * DAY + plusMs);
const hash = () => randomBytes(32).toString('hex');

beforeEach(async () => {
  await resetToDemo();
  // only this test's rows, so the counts are exactly theirs
  await db('password_resets').delete();
  await db('invitations').delete();
});
afterAll(async () => {
  await resetToDemo();
  await closeDb();
});

describe('sweepSpentTokens', () => {
  it('removes password-reset rows a day past expiry, used or not, and keeps the rest', async () => {
    const row = (label: string, expires: Date, used: Date | null) => ({ user_id: 2, token_hash: hash(), created_at: ago(3), expires_at: expires, used_at: used, _label: label });
    const rows = [
      row('expired long ago, unused', ago(RESET_KEEP_DAYS + 2), null),
      row('expired long ago, used', ago(RESET_KEEP_DAYS + 2), ago(RESET_KEEP_DAYS + 2, -60_000)),
      row('expired just now', ago(0, -60_000), null),
      row('still valid', ago(0, 30 * 60_000), null),
    ];
    for (const { _label, ...r } of rows) await db('password_resets').insert(r);
    expect(await sweepSpentTokens(db, now)).toEqual({ resets: 2, invitations: 0 });
    const left = await db('password_resets').pluck('token_hash');
    expect(left.sort()).toEqual([rows[2].token_hash, rows[3].token_hash].sort());
  });

  it('removes unaccepted invitations expired or withdrawn more than BIN_DAYS ago; keeps accepted ones and recent ones', async () => {
    const invitation = (email: string, expires: Date, extra: Record<string, unknown> = {}) => ({
      academy_id: 1,
      email,
      role: 'student',
      token_hash: hash(),
      created_at: ago(BIN_DAYS + 10),
      sent_at: ago(BIN_DAYS + 10),
      expires_at: expires,
      ...extra,
    });
    const old = invitation('old-expired@stanceline.test', ago(BIN_DAYS + 1));
    const withdrawn = invitation('old-withdrawn@stanceline.test', ago(0, 3600_000), { revoked_at: ago(BIN_DAYS + 1) });
    const accepted = invitation('accepted@stanceline.test', ago(BIN_DAYS + 5), { accepted_at: ago(BIN_DAYS + 6), accepted_user_id: 2 });
    const recent = invitation('recent-expired@stanceline.test', ago(BIN_DAYS - 1));
    const open = invitation('open@stanceline.test', ago(-2));
    for (const row of [old, withdrawn, accepted, recent, open]) await db('invitations').insert(row);
    expect(await sweepSpentTokens(db, now)).toEqual({ resets: 0, invitations: 2 });
    const left = await db('invitations').pluck('email');
    expect(left.sort()).toEqual([accepted.email, open.email, recent.email].sort());
  });
});
