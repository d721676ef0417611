// Demo research consents (invented): three of coach@'s players said yes (Ada for herself, as a student; the coach
// recorded Jonah's and Sunniva's), coach2@'s junior has a guardian's consent too, and one player said yes and then
// withdrew, so the history shows a withdrawal. Rafe has no consent recorded.
import type { Knex } from 'knex';

export const DEMO_CONSENTS = [
  { id: 1, athlete_id: 1, research: true, guardian_consent: false, recorded_by: 4, recorded_by_role: 'student', recorded_at: '2026-02-10 09:00:00.000' },
  { id: 2, athlete_id: 2, research: true, guardian_consent: false, recorded_by: 2, recorded_by_role: 'coach', recorded_at: '2026-02-12 10:00:00.000' },
  { id: 3, athlete_id: 3, research: true, guardian_consent: false, recorded_by: 2, recorded_by_role: 'coach', recorded_at: '2026-01-20 11:00:00.000' },
  { id: 4, athlete_id: 5, research: true, guardian_consent: true, recorded_by: 3, recorded_by_role: 'coach', recorded_at: '2026-02-07 15:00:00.000' },
  { id: 5, athlete_id: 6, research: true, guardian_consent: false, recorded_by: 3, recorded_by_role: 'coach', recorded_at: '2026-01-28 12:00:00.000' },
  { id: 6, athlete_id: 6, research: false, guardian_consent: false, recorded_by: 1, recorded_by_role: 'admin', recorded_at: '2026-03-01 08:30:00.000' },
] as const;

export async function seedDemoConsents(trx: Knex.Transaction): Promise<void> {
  await trx('consent_records').insert(DEMO_CONSENTS.map((c) => ({ ...c, scope: 'research' })));
}
