import 'server-only';
import type { Knex } from 'knex';
import { requireAthlete } from '@/lib/auth/access';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { toIsoDate, toIsoTime } from '@/lib/db/values';
import { getEnv } from '@/lib/env';
import { ForbiddenError, NotFoundError } from '@/lib/http';
import type { ConsentInput, ConsentResponse } from '@/lib/contracts/research';
import { ageOn, sessionConsented } from './age';

// Research consent per player (append-only consent_records; the newest row is the current consent, the older ones
// are its history). Who may record it: an admin for any player of the academy, the player's coach, or the student for
// their own player. Reading it: the same people.

export interface CurrentConsent {
  research: boolean;
  guardianConsent: boolean;
}

async function requireConsentAccess(viewer: Viewer, athleteId: number): Promise<void> {
  if (viewer.role === 'admin') {
    const row = await db('athletes').where({ id: athleteId, academy_id: viewer.academyId }).first('id');
    if (!row) throw new NotFoundError('No athlete with this id.');
    return;
  }
  if (viewer.role !== 'coach' && viewer.role !== 'student') throw new ForbiddenError();
  // coach: their roster; student: their own player (read access is exactly "the athlete themself" for a student)
  await requireAthlete(viewer, athleteId, viewer.role === 'coach' ? 'write' : 'read');
}

/** The newest consent of each athlete (none recorded: no consent). */
export async function currentConsents(athleteIds: number[], conn: Knex = db): Promise<Map<number, CurrentConsent>> {
  const out = new Map<number, CurrentConsent>();
  if (athleteIds.length === 0) return out;
  const newest = conn('consent_records').whereIn('athlete_id', athleteIds).groupBy('athlete_id').max('id');
  const rows = await conn('consent_records').whereIn('id', newest).select('athlete_id', 'research', 'guardian_consent');
  for (const r of rows) out.set(Number(r.athlete_id), { research: Boolean(r.research), guardianConsent: Boolean(r.guardian_consent) });
  return out;
}

async function consentView(athleteId: number): Promise<ConsentResponse> {
  const adultAge = getEnv().RESEARCH_ADULT_AGE;
  const athlete = await db('athletes').where({ id: athleteId }).first('date_of_birth');
  const dob = toIsoDate(athlete?.date_of_birth);
  const history = await db('consent_records as c')
    .leftJoin('users as u', 'u.id', 'c.recorded_by')
    .where('c.athlete_id', athleteId)
    .orderBy('c.id', 'desc')
    .select('c.id', 'c.research', 'c.guardian_consent', 'c.scope', 'c.recorded_at', 'c.recorded_by_role', 'u.name');
  const current = history[0] ? { research: Boolean(history[0].research), guardianConsent: Boolean(history[0].guardian_consent) } : { research: false, guardianConsent: false };
  const sessions = await db('practice_sessions').where({ athlete_id: athleteId }).whereNull('binned_at').select('session_date');
  const dates = sessions.map((s) => toIsoDate(s.session_date) ?? '');
  const guardianNeeded = dob === null || dates.some((d) => ageOn(dob, d) < adultAge) || (dates.length === 0 && ageOn(dob, new Date().toISOString().slice(0, 10)) < adultAge);
  return {
    athleteId,
    research: current.research,
    guardianConsent: current.guardianConsent,
    guardianNeeded,
    adultAge,
    sessionsIncluded: dates.filter((d) => sessionConsented(current, dob, d, adultAge)).length,
    sessionsTotal: dates.length,
    history: history.map((h) => ({
      id: Number(h.id),
      research: Boolean(h.research),
      guardianConsent: Boolean(h.guardian_consent),
      scope: 'research' as const,
      recordedAt: toIsoTime(h.recorded_at)!,
      recordedBy: h.name ?? null,
      recordedByRole: h.recorded_by_role,
    })),
  };
}

export async function getConsent(viewer: Viewer, athleteId: number): Promise<ConsentResponse> {
  await requireConsentAccess(viewer, athleteId);
  return consentView(athleteId);
}

/**
 * Records a decision. Revoking (research: false) clears the guardian's consent too; it takes effect for every later
 * export at once (exports read the newest row for every batch they write). A guardian's consent given earlier is kept
 * when a later call leaves guardianConsent out.
 */
export async function setConsent(viewer: Viewer, athleteId: number, input: ConsentInput): Promise<ConsentResponse> {
  await requireConsentAccess(viewer, athleteId);
  await db.transaction(async (trx) => {
    await trx('athletes').where({ id: athleteId }).forUpdate().first('id'); // one decision at a time per player
    const last = (await currentConsents([athleteId], trx)).get(athleteId);
    const guardian = input.research ? (input.guardianConsent ?? last?.guardianConsent ?? false) : false;
    await trx('consent_records').insert({
      athlete_id: athleteId,
      scope: 'research',
      research: input.research,
      guardian_consent: guardian,
      recorded_by: viewer.id,
      recorded_by_role: viewer.role as 'admin' | 'coach' | 'student',
    });
  });
  return consentView(athleteId);
}
