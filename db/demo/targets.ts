// Demo targets: the academy's common-practice defaults (lib/targets/defaults.ts), one per club group, plus one
// invented player-specific target coach@ made for Ada Fenwick. Fixed ids so the seed is deterministic.
import type { Knex } from 'knex';
import { DEFAULT_TARGETS } from '../../lib/targets/defaults';

export async function seedDefaultTargets(knex: Knex, academyId: number, firstId?: number): Promise<void> {
  await knex('targets').insert(
    DEFAULT_TARGETS.map((t, i) => ({
      ...(firstId !== undefined ? { id: firstId + i } : {}),
      academy_id: academyId,
      owner_user_id: null,
      athlete_id: null,
      name: t.name,
      description: t.description,
      club_group: t.clubGroup,
      is_default: true,
      common_practice: true,
      checks: JSON.stringify(t.checks),
      tempo_min: t.tempo?.min ?? null,
      tempo_max: t.tempo?.max ?? null,
    })),
  );
}

export async function seedDemoTargets(knex: Knex, academyId: number): Promise<void> {
  await seedDefaultTargets(knex, academyId, 1);
  const irons = DEFAULT_TARGETS.find((t) => t.clubGroup === 'wedges')!;
  await knex('targets').insert({
    id: 5,
    academy_id: academyId,
    owner_user_id: 2, // coach@ (Maren Solberg)
    athlete_id: 1, // Ada Fenwick
    name: 'Ada: wedges, softer shift',
    description: 'Ada plays a quieter lower body with wedges; we accept less lead pressure at impact. Coaching information, not a medical assessment.',
    club_group: 'wedges',
    is_default: false,
    common_practice: false,
    checks: JSON.stringify(irons.checks.map((c) => (c.event === 'impact' && c.measure === 'leadPct' ? { ...c, expected: 75, tolerance: 12 } : c))),
    tempo_min: 2.5,
    tempo_max: 3.5,
  });
}
