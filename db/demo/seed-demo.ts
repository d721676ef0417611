// Writes the demo scenario. A reset, not a merge: every table is emptied (children first) and refilled with fixed
// ids inside one transaction, so running it twice gives identical rows.
import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { seedDemoConsents } from './consents';
import { seedDemoDrills } from './drills';
import { seedDemoTargets } from './targets';
import { DEMO_ACADEMY, DEMO_ATHLETES, DEMO_PASSWORD, DEMO_SESSIONS, DEMO_USERS } from './scenario';

/** Children before parents, the order deletes must run in. */
export const TABLES_CHILD_FIRST = [
  'payment_events',
  'review_payments',
  'review_history',
  'reviews',
  'review_offers',
  'export_audit',
  'api_tokens',
  'consent_records',
  'shots',
  'shot_imports',
  'mail_log',
  'shares',
  'password_resets',
  'invitations',
  'rate_limits',
  'drill_assignments',
  'drills',
  'bands',
  'targets',
  'swing_annotations',
  'swing_event_corrections',
  'swing_labels',
  'swing_series',
  'recording_payloads',
  'recording_series',
  'swing_event_values',
  'swing_phase_metrics',
  'swing_events',
  'swings',
  'processing_jobs',
  'recordings',
  'import_profiles',
  'shot_profiles',
  'login_attempts',
  'practice_sessions',
  'coach_athletes',
  'athletes',
  'users',
  'academies',
] as const;

// Demo accounts only: cost 10 and a fixed salt so the hash (and so the seed) is the same on every run.
// Real accounts are hashed with cost 12 and a random salt by the app.
const DEMO_SALT = '$2b$10$StancelineDemoSeedSale';

export function demoPasswordHash(): string {
  return bcrypt.hashSync(DEMO_PASSWORD, DEMO_SALT);
}

export async function seedDemo(knex: Knex): Promise<void> {
  const passwordHash = demoPasswordHash();
  await knex.transaction(async (trx) => {
    for (const table of TABLES_CHILD_FIRST) await trx(table).delete();
    await trx('academies').insert(DEMO_ACADEMY);
    await trx('users').insert(
      DEMO_USERS.map((user) => ({ ...user, academy_id: DEMO_ACADEMY.id, password_hash: passwordHash, active: true })),
    );
    await trx('athletes').insert(
      DEMO_ATHLETES.map((athlete) => ({
        id: athlete.id,
        academy_id: DEMO_ACADEMY.id,
        user_id: athlete.userId,
        display_name: athlete.displayName,
        handedness: athlete.handedness,
        stance_width_mm: athlete.stanceWidthMm,
        date_of_birth: athlete.dateOfBirth,
        home_club: athlete.homeClub,
      })),
    );
    await trx('coach_athletes').insert(
      DEMO_ATHLETES.map((athlete) => ({ coach_user_id: athlete.coachUserId, athlete_id: athlete.id })),
    );
    await trx('practice_sessions').insert(
      DEMO_SESSIONS.map((session) => ({
        id: session.id,
        athlete_id: session.athleteId,
        coach_user_id: session.coachUserId,
        session_date: session.sessionDate,
        context: session.context,
        location: session.location,
        notes: session.notes,
      })),
    );
    await seedDemoTargets(trx, DEMO_ACADEMY.id);
    await seedDemoDrills(trx, DEMO_ACADEMY.id);
    await seedDemoConsents(trx);
    // Maren Solberg's remote review offer (invented price): 45.00 EUR, back within 3 days.
    await trx('review_offers').insert({ coach_user_id: 2, price_cents: 4500, currency: 'EUR', turnaround_days: 3, updated_at: new Date('2026-11-01T09:00:00Z') });
  });
}

/** Seeds the demo only into an empty database (no users yet). Returns whether it seeded. */
export async function seedDemoIfEmpty(knex: Knex): Promise<boolean> {
  const row = await knex('users').count<{ n: number | string }[]>({ n: '*' }).first();
  if (Number(row?.n ?? 0) > 0) return false;
  await seedDemo(knex);
  return true;
}
