// Client-side zod schemas for the targets, bands, scores, compare, progress and drills API answers (camelCase JSON,
// the issue-6 API contract). The fetcher validates every answer against these before a component sees it.
import { z } from 'zod';

export const clubGroups = ['driver', 'woods-hybrids', 'irons', 'wedges'] as const;
export const measures = ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copSide'] as const;
export const targetEvents = ['address', 'top', 'transition', 'impact', 'finish'] as const;
export type ClubGroup = (typeof clubGroups)[number];
export type Measure = (typeof measures)[number];
export type TargetEvent = (typeof targetEvents)[number];

export const clubGroupLabels: Record<ClubGroup, string> = { driver: 'Driver', 'woods-hybrids': 'Woods & hybrids', irons: 'Irons', wedges: 'Wedges' };
export const measureLabels: Record<Measure, string> = {
  leadPct: 'Lead %',
  leadHeelPct: 'Lead heel %',
  trailHeelPct: 'Trail heel %',
  copSide: 'COP side (% of half stance)',
};
export const eventLabels: Record<TargetEvent, string> = { address: 'Address', top: 'Top', transition: 'Transition', impact: 'Impact', finish: 'Finish' };

export const checkSchema = z.object({
  event: z.enum(targetEvents),
  measure: z.enum(measures),
  expected: z.number(),
  tolerance: z.number(),
});
export const tempoSchema = z.object({ min: z.number(), max: z.number() });

export const targetSchema = z.object({
  id: z.number(),
  name: z.string(),
  description: z.string().optional(),
  clubGroup: z.enum(clubGroups),
  athleteId: z.number().nullable(),
  ownerUserId: z.number().nullable(),
  isDefault: z.boolean(),
  commonPractice: z.boolean(),
  checks: z.array(checkSchema),
  tempo: tempoSchema.nullable(),
  updatedAt: z.string().nullable().optional(),
});
export type Target = z.infer<typeof targetSchema>;
export const targetsResponseSchema = z.object({ targets: z.array(targetSchema) });
export const targetResponseSchema = z.object({ target: targetSchema }).or(targetSchema);

export const scoreCheckSchema = checkSchema.extend({ actual: z.number().nullable(), pass: z.boolean().nullable() });
export const scoreResponseSchema = z.object({
  target: z
    .object({
      id: z.number(),
      name: z.string().optional(),
      checks: z.array(scoreCheckSchema),
      tempo: z.object({ min: z.number(), max: z.number(), actual: z.number().nullable(), pass: z.boolean().nullable() }).nullable().optional(),
      summary: z.object({ passed: z.number(), total: z.number() }).optional(),
    })
    .nullable(),
  band: z.object({ id: z.number(), insidePct: z.number().nullable(), rms: z.number().nullable(), cmc: z.number().nullable() }).nullable(),
});
export type ScoreResponse = z.infer<typeof scoreResponseSchema>;

export const bandSummarySchema = z.object({
  id: z.number(),
  name: z.string(),
  swingCount: z.number(),
  k: z.number(),
  shared: z.boolean(),
  ownerName: z.string().nullable().optional(),
  createdAt: z.string(),
});
export type BandSummary = z.infer<typeof bandSummarySchema>;
export const bandsResponseSchema = z.object({ bands: z.array(bandSummarySchema) });
export const bandCreatedSchema = z.object({ id: z.number(), swingCount: z.number() });

const curveSchema = z.object({ mean: z.array(z.number()), lower: z.array(z.number()), upper: z.array(z.number()), sd: z.array(z.number()) });
export const bandDetailSchema = z.object({
  band: z.object({
    id: z.number(),
    name: z.string(),
    k: z.number(),
    swingIds: z.array(z.number()),
    parameters: z.unknown().optional(),
    createdAt: z.string(),
    axis: z.array(z.number()),
    landmarks: z.object({ address: z.number(), top: z.number(), transition: z.number(), impact: z.number(), finish: z.number() }),
    curves: z.record(z.string(), curveSchema),
  }),
});
export type BandDetail = z.infer<typeof bandDetailSchema>['band'];

const meanCurveSchema = z
  .object({ axis: z.array(z.number()).optional(), curves: z.record(z.string(), curveSchema).optional() })
  .passthrough()
  .nullable()
  .optional();
const compareSetSchema = z.object({ label: z.string(), n: z.number(), values: z.record(z.string(), z.array(z.number())), meanCurve: meanCurveSchema });
export const compareResponseSchema = z.object({
  a: compareSetSchema,
  b: compareSetSchema,
  differences: z.array(
    z.object({
      metric: z.string(),
      meanA: z.number().nullable(),
      meanB: z.number().nullable(),
      diff: z.number().nullable(),
      ci95: z.tuple([z.number(), z.number()]).nullable(),
      method: z.string(),
      note: z.string().nullable(),
    }),
  ),
});
export type CompareResponse = z.infer<typeof compareResponseSchema>;

export const progressResponseSchema = z.object({
  sessions: z.array(
    z.object({
      id: z.number(),
      date: z.string(),
      context: z.string(),
      n: z.number(),
      metrics: z.record(z.string(), z.object({ mean: z.number().nullable(), sd: z.number().nullable(), n: z.number() })),
      targetScore: z.object({ passed: z.number(), total: z.number() }).nullable(),
    }),
  ),
});
export type ProgressResponse = z.infer<typeof progressResponseSchema>;

export const drillSchema = z.object({
  id: z.number(),
  name: z.string(),
  steps: z.array(z.string()),
  addressesChecks: z.array(z.object({ event: z.enum(targetEvents), measure: z.enum(measures) })),
  cautions: z.string(),
  ownerUserId: z.number().nullable().optional(),
});
export type Drill = z.infer<typeof drillSchema>;
export const drillsResponseSchema = z.object({ drills: z.array(drillSchema) });
export const drillResponseSchema = z.object({ drill: drillSchema }).or(drillSchema);

export const assignmentSchema = z
  .object({
    id: z.number(),
    drillId: z.number().optional(),
    drill: drillSchema.partial().extend({ name: z.string() }).optional(),
    athleteId: z.number().optional(),
    athleteName: z.string().nullable().optional(),
    dueDate: z.string().nullable(),
    assignedAt: z.string().nullable().optional(),
    practiceDone: z.boolean(),
    practiceDoneAt: z.string().nullable().optional(),
    studentNote: z.string().nullable().optional(),
  })
  .passthrough();
export type Assignment = z.infer<typeof assignmentSchema>;
export const assignmentsResponseSchema = z.object({ assignments: z.array(assignmentSchema) });
export const assignmentResponseSchema = z.object({ assignment: assignmentSchema }).or(assignmentSchema);

const statSchema = z.object({ mean: z.number(), n: z.number() }).nullable();
export const drillReportSchema = z.object({
  assignments: z.array(
    z.object({
      drill: z.object({ id: z.number().optional(), name: z.string() }).passthrough(),
      assignedAt: z.string().nullable(),
      checks: z.array(z.object({ event: z.string(), measure: z.string(), before: statSchema, after: statSchema, moved: z.number().nullable() })),
    }),
  ),
});
export type DrillReport = z.infer<typeof drillReportSchema>;
