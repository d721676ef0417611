import 'server-only';
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { db } from '@/lib/db/client';

type From = (table: string) => Knex.QueryBuilder;
const shared: From = (table) => db(table);

export async function recordLoginAttempt(attempt: { email: string; ip: string; succeeded: boolean; at: Date }, from: From = shared): Promise<number> {
  const [id] = await from('login_attempts').insert({
    email: attempt.email.toLowerCase().slice(0, 254),
    ip: attempt.ip.slice(0, 45),
    succeeded: attempt.succeeded,
    attempted_at: attempt.at,
  });
  return Number(id);
}

function toDate(value: unknown): Date {
  return value instanceof Date ? value : new Date(String(value));
}

/** Times of failed attempts for `email` since `since`, after the latest success (a success clears the count). */
export async function recentEmailFailures(email: string, since: Date, from: From = shared): Promise<Date[]> {
  const lastSuccess = await from('login_attempts')
    .where({ email: email.toLowerCase(), succeeded: true })
    .andWhere('attempted_at', '>=', since)
    .max({ at: 'attempted_at' })
    .first();
  const start = lastSuccess?.at ? toDate(lastSuccess.at) : since;
  const rows: { attempted_at: unknown }[] = await from('login_attempts')
    .select('attempted_at')
    .where({ email: email.toLowerCase(), succeeded: false })
    .andWhere('attempted_at', lastSuccess?.at ? '>' : '>=', start)
    .orderBy('attempted_at', 'asc');
  return rows.map((r) => toDate(r.attempted_at));
}

/** Times of failed attempts from `ip` since `since` (any email). */
export async function recentIpFailures(ip: string, since: Date, from: From = shared): Promise<Date[]> {
  const rows: { attempted_at: unknown }[] = await from('login_attempts')
    .select('attempted_at')
    .where({ ip, succeeded: false })
    .andWhere('attempted_at', '>=', since)
    .orderBy('attempted_at', 'asc');
  return rows.map((r) => toDate(r.attempted_at));
}

/** MariaDB lock names are at most 64 characters: a prefix and a hash of the key. */
function lockName(kind: 'e' | 'i', key: string): string {
  return `stanceline-login-${kind}:${createHash('sha1').update(key).digest('hex')}`;
}

const LOCK_WAIT_S = 10;

/**
 * Counting the failures and recording the attempt as one step, so that concurrent attempts cannot all read the same
 * count (40 at once were all let through a limit of 10). Each attempt takes MariaDB's named locks for its email and
 * its IP (always in that order, so two attempts never wait on each other in a cycle) on one pinned connection,
 * reads the failures, and, when `decide` allows it, records the attempt as a failure before the locks are released;
 * a success turns that row into a success later (markLoginSucceeded). The locks are held for a few milliseconds,
 * never during the password check. Returns the new row's id, or the refusal `decide` gave.
 */
export async function reserveLoginAttempt<R extends { allowed: boolean }>(
  attempt: { email: string; ip: string; at: Date },
  since: Date,
  decide: (emailFailures: Date[], ipFailures: Date[]) => R,
): Promise<{ decision: R; attemptId: number | null }> {
  const client = db.client as Knex.Client;
  const connection = await client.acquireConnection();
  const on: From = (table) => db(table).connection(connection);
  try {
    for (const name of [lockName('e', attempt.email.toLowerCase()), lockName('i', attempt.ip)]) {
      const [rows] = (await db.raw('SELECT GET_LOCK(?, ?) AS got', [name, LOCK_WAIT_S]).connection(connection)) as unknown as [{ got: number | null }[]];
      if (Number(rows[0]?.got) !== 1) throw new Error(`sign-in lock not granted within ${LOCK_WAIT_S} s`);
    }
    const [emailFailures, ipFailures] = [await recentEmailFailures(attempt.email, since, on), await recentIpFailures(attempt.ip, since, on)];
    const decision = decide(emailFailures, ipFailures);
    // Refused attempts are not recorded: recording them would push the window forward and the "try again in N
    // minutes" promise would never come true.
    if (!decision.allowed) return { decision, attemptId: null };
    return { decision, attemptId: await recordLoginAttempt({ ...attempt, succeeded: false }, on) };
  } finally {
    await db.raw('SELECT RELEASE_ALL_LOCKS()').connection(connection).catch(() => undefined);
    await client.releaseConnection(connection);
  }
}

export async function markLoginSucceeded(attemptId: number): Promise<void> {
  await db('login_attempts').where({ id: attemptId }).update({ succeeded: true });
}

/** Test and maintenance helper: forget attempts for one email. */
export async function clearLoginAttempts(email: string): Promise<void> {
  await db('login_attempts').where({ email: email.toLowerCase() }).delete();
}
