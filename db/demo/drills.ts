// Demo drills in coach@'s library (our own wording), each with its cautions, and one assignment for Ada Fenwick given
// the day after her baseline lesson (session 1, 2026-02-10) and due before her practice session (2026-02-17), so the
// drill report of session 2 compares before and after. Invented scenario; fixed ids.
import type { Knex } from 'knex';

const GENERAL =
  'Coaching information, not a medical assessment. Stop at once if it hurts and see a physician or physiotherapist before trying again; their advice comes first. Players under 18 only with a parent or guardian’s consent.';

export const DEMO_DRILLS = [
  {
    id: 1,
    owner_user_id: 2,
    name: 'Pause-and-step transfer',
    steps: [
      'Set up with feet together and a short iron.',
      'Swing to the top at half speed and pause for a count of one.',
      'Step the lead foot out to a normal stance and let the downswing follow the step.',
      'Hold the finish for three seconds with the trail foot up on its toe.',
      'Three sets of eight; rest between sets.',
    ],
    addresses_checks: [
      { event: 'impact', measure: 'leadPct' },
      { event: 'transition', measure: 'leadPct' },
    ],
    cautions: `The step loads the lead knee and hip quickly: keep it short and smooth. ${GENERAL}`,
  },
  {
    id: 2,
    owner_user_id: 2,
    name: 'Trail-heel coil check',
    steps: [
      'Take a normal stance without a club, arms crossed on the chest.',
      'Turn back slowly until you feel the pressure settle into the back of the trail foot.',
      'Hold for two seconds without letting the trail knee slide outward.',
      'Ten slow repetitions, then five with a mid iron at half speed.',
    ],
    addresses_checks: [{ event: 'top', measure: 'trailHeelPct' }],
    cautions: `Turn only as far as is comfortable for the lower back; no forcing the coil. ${GENERAL}`,
  },
  {
    id: 3,
    owner_user_id: 2,
    name: 'Balanced finish hold',
    steps: [
      'Hit easy three-quarter shots with a wedge.',
      'Finish facing the target with almost all pressure on the lead foot, toward its heel.',
      'Hold the finish until the ball lands; if you wobble, the next swing is slower.',
    ],
    addresses_checks: [
      { event: 'finish', measure: 'leadPct' },
      { event: 'finish', measure: 'leadHeelPct' },
    ],
    cautions: `Do not hold a finish that strains the back or neck: ease off the rotation instead. ${GENERAL}`,
  },
] as const;

export async function seedDemoDrills(knex: Knex, academyId: number): Promise<void> {
  await knex('drills').insert(
    DEMO_DRILLS.map((d) => ({ ...d, academy_id: academyId, steps: JSON.stringify(d.steps), addresses_checks: JSON.stringify(d.addresses_checks) })),
  );
  await knex('drill_assignments').insert({ id: 1, drill_id: 1, athlete_id: 1, assigned_by: 2, assigned_at: '2026-02-11', due_date: '2026-02-16', practice_done: false });
}
