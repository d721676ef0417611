import 'server-only';
import { db } from '@/lib/db/client';

export async function recordLoginAttempt(attempt: { email: string; ip: string; succeeded: boolean; at: Date }): Promise<void> {
  await db('login_attempts').insert({
    email: attempt.email.toLowerCase().slice(0, 254),
    ip: attempt.ip.slice(0, 45),
    succeeded: attempt.succeeded,
    attempted_at: attempt.at,
  });
}

function toDate(value: unknown): Date {
  return value instanceof Date ? value : new Date(String(value));
}

/** Times of failed attempts for `email` since `since`, after the latest success (a success clears the count). */
export async function recentEmailFailures(email: string, since: Date): Promise<Date[]> {
  const lastSuccess = await db('login_attempts')
    .where({ email: email.toLowerCase(), succeeded: true })
    .andWhere('attempted_at', '>=', since)
    .max({ at: 'attempted_at' })
    .first();
  const from = lastSuccess?.at ? toDate(lastSuccess.at) : since;
  const rows: { attempted_at: unknown }[] = await db('login_attempts')
    .select('attempted_at')
    .where({ email: email.toLowerCase(), succeeded: false })
    .andWhere('attempted_at', lastSuccess?.at ? '>' : '>=', from)
    .orderBy('attempted_at', 'asc');
  return rows.map((r) => toDate(r.attempted_at));
}

/** Times of failed attempts from `ip` since `since` (any email). */
export async function recentIpFailures(ip: string, since: Date): Promise<Date[]> {
  const rows: { attempted_at: unknown }[] = await db('login_attempts')
    .select('attempted_at')
    .where({ ip, succeeded: false })
    .andWhere('attempted_at', '>=', since)
    .orderBy('attempted_at', 'asc');
  return rows.map((r) => toDate(r.attempted_at));
}

/** Test and maintenance helper: forget attempts for one email. */
export async function clearLoginAttempts(email: string): Promise<void> {
  await db('login_attempts').where({ email: email.toLowerCase() }).delete();
}
