// Drill reminder mails: when a coach assigns a drill, and the day before a drill is due (not yet practised). At most
// one such mail per student a day: mail_log's unique (user, kind, day) row is claimed before sending, so two
// processes (or an assignment and the daily run) cannot both send. A student can switch them off.
import 'server-only';
import type { Knex } from 'knex';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { appUrl, sendDrillReminderMail } from '@/lib/mail';
import type { MailPreferences } from '@/lib/contracts/mail-preferences';
import { academyName } from './academy';

export const DRILL_MAIL_KIND = 'drills';

const utcDay = (at: Date) => at.toISOString().slice(0, 10);
const addDays = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

/** Claims today's drill mail for a user; false when one was already sent (or claimed) today. */
async function claimToday(knex: Knex, userId: number, now: Date): Promise<boolean> {
  try {
    await knex('mail_log').insert({ user_id: userId, kind: DRILL_MAIL_KIND, day: utcDay(now), created_at: now });
    return true;
  } catch (error) {
    if ((error as { code?: string }).code === 'ER_DUP_ENTRY') return false;
    throw error;
  }
}

type Recipient = { userId: number; email: string; academyId: number };

async function recipientFor(knex: Knex, athleteId: number): Promise<Recipient | null> {
  const row = await knex('athletes as a')
    .join('users as u', 'u.id', 'a.user_id')
    .where({ 'a.id': athleteId, 'u.active': true, 'u.drill_mail_opt_out': false })
    .first('u.id', 'u.email', 'u.academy_id');
  return row ? { userId: Number(row.id), email: row.email, academyId: Number(row.academy_id) } : null;
}

async function send(knex: Knex, to: Recipient, assigned: string[], dueTomorrow: string[], now: Date): Promise<boolean> {
  if (!(await claimToday(knex, to.userId, now))) return false;
  try {
    await sendDrillReminderMail(to.email, { academyName: await academyName(to.academyId), assigned, dueTomorrow, url: appUrl('/drills') });
    return true;
  } catch (error) {
    // not sent: give the day back so the next run may try again
    await knex('mail_log').where({ user_id: to.userId, kind: DRILL_MAIL_KIND, day: utcDay(now) }).delete();
    throw error;
  }
}

/** After an assignment: tells the student, unless they opted out or already had a drill mail today. */
export async function notifyDrillAssigned(assignmentId: number, now = new Date(), knex: Knex = db): Promise<boolean> {
  const row = await knex('drill_assignments as da').join('drills as d', 'd.id', 'da.drill_id').where('da.id', assignmentId).first('da.athlete_id', 'd.name');
  if (!row) return false;
  const to = await recipientFor(knex, Number(row.athlete_id));
  if (!to) return false;
  const tomorrow = addDays(utcDay(now), 1);
  const due = await knex('drill_assignments as da')
    .join('drills as d', 'd.id', 'da.drill_id')
    .where({ 'da.athlete_id': row.athlete_id, 'da.due_date': tomorrow, 'da.practice_done': false })
    .whereNot('da.id', assignmentId)
    .pluck('d.name');
  return send(knex, to, [row.name], due, now);
}

/** The daily run: every student with an unpractised drill due tomorrow (UTC), one mail each. Returns how many were sent. */
export async function sendDueTomorrowReminders(now = new Date(), knex: Knex = db): Promise<number> {
  const tomorrow = addDays(utcDay(now), 1);
  const rows: { athlete_id: number; name: string }[] = await knex('drill_assignments as da')
    .join('drills as d', 'd.id', 'da.drill_id')
    .where({ 'da.due_date': tomorrow, 'da.practice_done': false })
    .select('da.athlete_id', 'd.name')
    .orderBy('da.id');
  const byAthlete = new Map<number, string[]>();
  for (const r of rows) byAthlete.set(Number(r.athlete_id), [...(byAthlete.get(Number(r.athlete_id)) ?? []), r.name]);
  let sent = 0;
  for (const [athleteId, names] of byAthlete) {
    const to = await recipientFor(knex, athleteId);
    if (to && (await send(knex, to, [], names, now))) sent += 1;
  }
  return sent;
}

export async function getMailPreferences(viewer: Viewer): Promise<MailPreferences> {
  const row = await db('users').where({ id: viewer.id }).first('drill_mail_opt_out');
  return { drillReminders: !row?.drill_mail_opt_out };
}

export async function setMailPreferences(viewer: Viewer, prefs: MailPreferences): Promise<MailPreferences> {
  await db('users').where({ id: viewer.id }).update({ drill_mail_opt_out: !prefs.drillReminders, updated_at: new Date() });
  return getMailPreferences(viewer);
}
