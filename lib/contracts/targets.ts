// The targets API's contract: GET/POST /api/targets, PATCH/DELETE /api/targets/:id and GET /api/swings/:id/score.
// lib/targets returns these types, the routes send them, the client parses them through lib/fetcher.ts; the target
// form uses the request schemas through zodResolver.
import { z } from 'zod';
import { EVENT_NAMES, type EventName } from '@/lib/signal/types';

export const CLUB_GROUPS = ['driver', 'woods-hybrids', 'irons', 'wedges'] as const;
export type ClubGroup = (typeof CLUB_GROUPS)[number];

// Targets check values at the swing events of the signal core (lib/signal/types.ts EVENT_NAMES).
export const TARGET_EVENTS = EVENT_NAMES;
export type TargetEvent = EventName;

/** copSide = combined COP x as % of half the stance width, + toward the lead foot (0 = centred, 100 = over the lead foot's centre). */
export const MEASURES = ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copSide'] as const;
export type Measure = (typeof MEASURES)[number];

export const clubGroups = CLUB_GROUPS;
export const measures = MEASURES;
export const targetEvents = TARGET_EVENTS;

export const clubGroupLabels: Record<ClubGroup, string> = { driver: 'Driver', 'woods-hybrids': 'Woods & hybrids', irons: 'Irons', wedges: 'Wedges' };
export const measureLabels: Record<Measure, string> = {
  leadPct: 'Lead %',
  leadHeelPct: 'Lead heel %',
  trailHeelPct: 'Trail heel %',
  copSide: 'COP side (% of half stance)',
};
export { eventLabels } from './swings';

// --- request bodies ---
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

// --- responses ---
export const checkSchema = z.object({
  event: z.enum(TARGET_EVENTS),
  measure: z.enum(MEASURES),
  expected: z.number(),
  tolerance: z.number(),
});
export const tempoRangeSchema = z.object({ min: z.number(), max: z.number() });

export const targetSchema = z.object({
  id: z.number(),
  name: z.string(),
  description: z.string(),
  clubGroup: z.enum(CLUB_GROUPS),
  athleteId: z.number().nullable(),
  ownerUserId: z.number().nullable(),
  isDefault: z.boolean(),
  commonPractice: z.boolean(),
  checks: z.array(checkSchema),
  tempo: tempoRangeSchema.nullable(),
  updatedAt: z.string(),
});
export type TargetCheck = z.infer<typeof checkSchema>;
export type Tempo = z.infer<typeof tempoRangeSchema>;
export type Target = z.infer<typeof targetSchema>;
export const targetsResponseSchema = z.object({ targets: z.array(targetSchema) });
export const targetResponseSchema = z.object({ target: targetSchema });

/** one check scored: `by` is the signed distance past the tolerance (0 on a pass, null when the value is missing) */
export const scoreCheckSchema = checkSchema.extend({ actual: z.number().nullable(), pass: z.boolean(), by: z.number().nullable() });
export const tempoScoreSchema = tempoRangeSchema.extend({ actual: z.number().nullable(), pass: z.boolean() });
export const scoreSummarySchema = z.object({ passed: z.number(), total: z.number(), text: z.string() });
export type CheckResult = z.infer<typeof scoreCheckSchema>;
export type TempoResult = z.infer<typeof tempoScoreSchema>;

const bandFitSchema = z.object({ insidePct: z.number().nullable(), rms: z.number().nullable(), cmc: z.number().nullable() });
export const scoreResponseSchema = z.object({
  clubGroup: z.enum(CLUB_GROUPS),
  clubGroupFromLabel: z.boolean(),
  target: z
    .object({
      id: z.number(),
      name: z.string(),
      commonPractice: z.boolean(),
      checks: z.array(scoreCheckSchema),
      tempo: tempoScoreSchema.optional(),
      summary: scoreSummarySchema,
    })
    .nullable(),
  /** the lead % curve's fit, and each curve's with the number of registered points compared */
  band: bandFitSchema.extend({ id: z.number(), name: z.string(), byCurve: z.record(z.string(), bandFitSchema.extend({ points: z.number() })) }).nullable(),
});
export type ScoreResponse = z.infer<typeof scoreResponseSchema>;
