import { z } from 'zod';
import { CLUB_GROUPS, MEASURES, TARGET_EVENTS } from '@/lib/targets/types';

// POST /api/targets and PATCH /api/targets/:id (and the target form). Percentages 0-100; copSide -150..150 (% of half
// the stance width, + toward the lead foot).
export const targetCheckSchema = z.strictObject({
  event: z.enum(TARGET_EVENTS, { error: 'Choose address, top, transition, impact or finish.' }),
  measure: z.enum(MEASURES, { error: 'Choose leadPct, leadHeelPct, trailHeelPct or copSide.' }),
  expected: z.number({ error: 'Give the expected value as a number.' }).min(-150, { error: 'Expected must be at least -150.' }).max(150, { error: 'Expected must be at most 150.' }),
  tolerance: z.number({ error: 'Give the tolerance as a number.' }).positive({ error: 'Tolerance must be above 0.' }).max(100, { error: 'Tolerance must be at most 100.' }),
});

export const tempoSchema = z
  .strictObject({
    min: z.number({ error: 'Give the lowest tempo ratio.' }).positive({ error: 'Tempo must be above 0.' }).max(10),
    max: z.number({ error: 'Give the highest tempo ratio.' }).positive({ error: 'Tempo must be above 0.' }).max(10),
  })
  .refine((t) => t.min <= t.max, { error: 'The lowest tempo must not exceed the highest.', path: ['max'] });

export const targetInputSchema = z.strictObject({
  name: z.string({ error: 'Give the target a name.' }).trim().min(1, { error: 'Give the target a name.' }).max(120, { error: 'At most 120 characters.' }),
  description: z.string().trim().max(2000, { error: 'At most 2000 characters.' }).default(''),
  clubGroup: z.enum(CLUB_GROUPS, { error: 'Choose driver, woods-hybrids, irons or wedges.' }),
  athleteId: z.number().int().positive().nullable().default(null),
  checks: z.array(targetCheckSchema).min(1, { error: 'Add at least one check.' }).max(30, { error: 'At most 30 checks.' }),
  tempo: tempoSchema.nullable().default(null),
});
export type TargetInput = z.infer<typeof targetInputSchema>;

export const targetPatchSchema = targetInputSchema.partial().refine((v) => Object.keys(v).length > 0, { error: 'Change at least one field.' });
