// The drills API's contract: /api/drills, /api/drill-assignments, /api/athletes/:id/drill-assignments and
// /api/sessions/:id/drill-report. lib/drills returns these types, the routes send them, the client parses them
// through lib/fetcher.ts; the drill, assign and practice forms use the request schemas.
import { z } from 'zod';
import { MEASURES, TARGET_EVENTS } from './targets';
import { binnedRefSchema } from './sessions';

// --- request bodies ---
export const drillInputSchema = z.strictObject({
  name: z.string({ error: 'Give the drill a name.' }).trim().min(1, { error: 'Give the drill a name.' }).max(120, { error: 'At most 120 characters.' }),
  steps: z.array(z.string().trim().min(1, { error: 'A step cannot be empty.' }).max(500, { error: 'At most 500 characters per step.' })).min(1, { error: 'Add at least one step.' }).max(20),
  addressesChecks: z.array(z.strictObject({ event: z.enum(TARGET_EVENTS), measure: z.enum(MEASURES) })).max(20).default([]),
  cautions: z.string({ error: 'Say what to watch out for.' }).trim().min(1, { error: 'Give the cautions for this drill (pain, medical advice, minors).' }).max(2000),
});
export type DrillInput = z.infer<typeof drillInputSchema>;
export const drillPatchSchema = drillInputSchema.partial().refine((v) => Object.keys(v).length > 0, { error: 'Change at least one field.' });

// z.iso.date checks the calendar (2026-02-30 and 2025-02-29 are refused); years before 1900 (0000) are typos.
const isoDate = z.iso.date({ error: 'Give the due date as a real date, YYYY-MM-DD.' }).refine((s) => s >= '1900-01-01', { error: 'Give a due date after 1900.' });

export const assignmentInputSchema = z.strictObject({ drillId: z.number({ error: 'Choose a drill.' }).int().positive(), dueDate: isoDate });

/** A student may send only practiceDone and a note; a coach may also move the due date. */
export const assignmentPatchSchema = z
  .strictObject({ practiceDone: z.boolean().optional(), studentNote: z.string().trim().max(2000, { error: 'At most 2000 characters.' }).optional(), dueDate: isoDate.optional() })
  .refine((v) => Object.keys(v).length > 0, { error: 'Change at least one field.' });

// --- responses ---
const addressedCheckSchema = z.object({ event: z.enum(TARGET_EVENTS), measure: z.enum(MEASURES) });
export const drillSchema = z.object({
  id: z.number(),
  name: z.string(),
  steps: z.array(z.string()),
  addressesChecks: z.array(addressedCheckSchema),
  cautions: z.string(),
  ownerUserId: z.number(),
});
export type Drill = z.infer<typeof drillSchema>;
/** `caution` is the general caution shown with every drill (coaching information; pain; medical advice; minors). */
export const drillsResponseSchema = z.object({ drills: z.array(drillSchema), caution: z.string() });
export const drillResponseSchema = z.object({ drill: drillSchema });
/** DELETE /api/drills/:id: the drill went to the bin (its assignments with it); POST .../restore answers drillResponseSchema */
export const drillBinnedResponseSchema = z.object({ drill: binnedRefSchema });

export const assignmentSchema = z.object({
  id: z.number(),
  drill: drillSchema,
  athleteId: z.number(),
  athleteName: z.string(),
  assignedBy: z.number().nullable(),
  assignedAt: z.string(),
  dueDate: z.string(),
  practiceDone: z.boolean(),
  /** when the student marked practice done (ISO timestamp) */
  doneAt: z.string().nullable(),
  studentNote: z.string().nullable(),
});
export type DrillAssignment = z.infer<typeof assignmentSchema>;
/** GET /api/drill-assignments adds the general caution; GET /api/athletes/:id/drill-assignments does not. */
export const assignmentsResponseSchema = z.object({ assignments: z.array(assignmentSchema), caution: z.string().optional() });
export const assignmentResponseSchema = z.object({ assignment: assignmentSchema });
/** DELETE /api/drill-assignments/:id (`name` is the drill's); POST .../restore answers assignmentResponseSchema */
export const assignmentBinnedResponseSchema = z.object({ assignment: binnedRefSchema });

const statSchema = z.object({ mean: z.number(), n: z.number() }).nullable();
export const checkMoveSchema = addressedCheckSchema.extend({ before: statSchema, after: statSchema, moved: z.number().nullable() });
export type CheckMove = z.infer<typeof checkMoveSchema>;
export const drillReportSchema = z.object({
  sessionId: z.number(),
  sessionDate: z.string(),
  assignments: z.array(
    z.object({
      id: z.number(),
      drill: drillSchema,
      assignedAt: z.string(),
      dueDate: z.string(),
      practiceDone: z.boolean(),
      studentNote: z.string().nullable(),
      checks: z.array(checkMoveSchema),
    }),
  ),
});
export type DrillReport = z.infer<typeof drillReportSchema>;
export const drillReportResponseSchema = drillReportSchema.extend({ caution: z.string() });
