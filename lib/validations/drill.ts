import { z } from 'zod';
import { MEASURES, TARGET_EVENTS } from '@/lib/targets/types';

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
