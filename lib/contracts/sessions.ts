import { z } from 'zod';
import { practiceSessionSchema, sessionContextValues } from '@/lib/contracts/athletes';

// The sessions API's contract: POST /api/athletes/:id/sessions, PATCH/DELETE /api/sessions/:id,
// POST /api/sessions/:id/restore, DELETE /api/recordings/:id and POST /api/recordings/:id/restore.
// The upload page's "new session" form validates with the same input schema.

export const SESSION_LOCATION_MAX = 120;
export const SESSION_NOTES_MAX = 4000;
/** Days a binned session or recording can be restored; the sweep removes it after that. */
export const BIN_DAYS = 30;

/** What DELETE answers for a drill, band or drill assignment moved to the bin (restorable until the given day). */
export const binnedRefSchema = z.object({ id: z.number(), name: z.string(), binnedAt: z.string().nullable(), restorableUntil: z.string().nullable() });
export type BinnedRef = z.infer<typeof binnedRefSchema>;

const optionalText = (max: number) =>
  z
    .string({ error: 'Use text.' })
    .trim()
    .max(max, { error: `Use at most ${max} characters.` })
    .nullable()
    .optional()
    .transform((v) => (v === undefined ? undefined : v === null || v === '' ? null : v));

export const sessionInputSchema = z.strictObject({
  date: z.iso.date({ error: 'Use the date format YYYY-MM-DD.' }).refine((v) => v >= '1900-01-01', { error: 'The date must be after 1900-01-01.' }),
  context: z.enum(sessionContextValues, { error: 'Choose lesson, practice or on-course.' }),
  location: optionalText(SESSION_LOCATION_MAX),
  notes: optionalText(SESSION_NOTES_MAX),
});

export const sessionPatchSchema = sessionInputSchema.partial().refine((value) => Object.keys(value).length > 0, {
  error: 'Send at least one field to change.',
});

export type SessionInput = z.input<typeof sessionInputSchema>;
export type SessionInputParsed = z.infer<typeof sessionInputSchema>;
export type SessionPatch = z.infer<typeof sessionPatchSchema>;

/** A session as the API sends it after a create, edit, bin or restore. */
export const sessionResponseSchema = practiceSessionSchema.extend({
  /** when it went to the bin; null while it is in use */
  binnedAt: z.string().nullable(),
  /** the last day it can be restored (YYYY-MM-DD); null while it is in use */
  restorableUntil: z.string().nullable(),
});

export const binnedRecordingSchema = z.object({
  id: z.number().int(),
  sessionId: z.number().int(),
  filename: z.string(),
  binnedAt: z.string().nullable(),
  restorableUntil: z.string().nullable(),
});

export type SessionResponse = z.infer<typeof sessionResponseSchema>;
export type BinnedRecording = z.infer<typeof binnedRecordingSchema>;
