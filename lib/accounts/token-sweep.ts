// Spent sign-in links are removed once nobody can use or ask about them, beside the hourly bin sweep
// (lib/jobs/start.ts). Common practice, not a published value: a password-reset row is a security token and nothing
// else, so it goes a day after it expired (used or not); an invitation that was never accepted stays listed for
// the admin (expired ones are flagged and can be resent) for BIN_DAYS after it expired or was withdrawn, then goes.
// Accepted invitations stay: they record who invited whom. Takes the connection, so tests and scripts can call it.
import type { Knex } from 'knex';
import { BIN_DAYS } from '@/lib/contracts/sessions';

const DAY_MS = 24 * 60 * 60 * 1000;
export const RESET_KEEP_DAYS = 1;

export async function sweepSpentTokens(db: Knex, now = new Date()): Promise<{ resets: number; invitations: number }> {
  const resetCutoff = new Date(now.getTime() - RESET_KEEP_DAYS * DAY_MS);
  const inviteCutoff = new Date(now.getTime() - BIN_DAYS * DAY_MS);
  const resets = await db('password_resets').where('expires_at', '<', resetCutoff).delete();
  const invitations = await db('invitations')
    .whereNull('accepted_at')
    .andWhere((q) => q.where('expires_at', '<', inviteCutoff).orWhere('revoked_at', '<', inviteCutoff))
    .delete();
  return { resets, invitations };
}
