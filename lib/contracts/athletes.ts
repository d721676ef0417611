import { z } from 'zod';
import { pageSchema } from './pagination';

// The athletes API's contract. Requests: one schema for the athlete form (client, via zodResolver) and for
// POST/PATCH /api/athletes (server). Responses: lib/db/athletes.ts returns these types, the client parses them.
// Form inputs turn empty strings into null before validation (see components/athletes/athlete-form.tsx).

export const handednessValues = ['right', 'left'] as const;
export const sessionContextValues = ['lesson', 'practice', 'on-course'] as const;

// Stance width limits 150-900 mm: the product's plausible range for inside-heel to inside-heel distance
// (common practice: about shoulder width, roughly 300-500 mm for adults, wider with the driver).
export const STANCE_WIDTH_MIN_MM = 150;
export const STANCE_WIDTH_MAX_MM = 900;

const isoDate = z.iso.date({ error: 'Use the date format YYYY-MM-DD.' });

export const dateOfBirthSchema = isoDate.refine((value) => value <= new Date().toISOString().slice(0, 10), {
  error: 'The date of birth cannot be in the future.',
}).refine((value) => value >= '1900-01-01', { error: 'The date of birth must be after 1900-01-01.' });

export const athleteInputSchema = z.strictObject({
  displayName: z
    .string({ error: 'Enter a name.' })
    .trim()
    .min(1, { error: 'Enter a name.' })
    .max(120, { error: 'Use at most 120 characters.' }),
  handedness: z.enum(handednessValues, { error: 'Choose right- or left-handed.' }),
  stanceWidthMm: z
    .number({ error: 'Enter the stance width in millimetres.' })
    .int({ error: 'Use whole millimetres.' })
    .min(STANCE_WIDTH_MIN_MM, { error: `Stance width must be at least ${STANCE_WIDTH_MIN_MM} mm.` })
    .max(STANCE_WIDTH_MAX_MM, { error: `Stance width must be at most ${STANCE_WIDTH_MAX_MM} mm.` }),
  dateOfBirth: dateOfBirthSchema.nullable(),
  homeClub: z.string().trim().max(120, { error: 'Use at most 120 characters.' }).nullable(),
});

export const athletePatchSchema = athleteInputSchema.partial().refine((value) => Object.keys(value).length > 0, {
  error: 'Send at least one field to change.',
});

export type AthleteInput = z.infer<typeof athleteInputSchema>;
export type AthletePatch = z.infer<typeof athletePatchSchema>;

export const athleteListQuerySchema = z.object({
  q: z.string().trim().max(120).optional().transform((v) => (v ? v : undefined)),
  context: z.enum(sessionContextValues).optional(),
  handedness: z.enum(handednessValues).optional(),
  /** true: only the archived players (to restore them); otherwise they are left out */
  archived: z.boolean().optional(),
});

export type AthleteListQuery = Partial<z.infer<typeof athleteListQuerySchema>>;

/** Age in whole years on `today` (both YYYY-MM-DD). */
export function ageOn(dateOfBirth: string, today: string): number {
  const [by, bm, bd] = dateOfBirth.split('-').map(Number);
  const [ty, tm, td] = today.split('-').map(Number);
  let age = ty - by;
  if (tm < bm || (tm === bm && td < bd)) age -= 1;
  return age;
}

export function isMinor(dateOfBirth: string | null, today = new Date().toISOString().slice(0, 10)): boolean {
  return dateOfBirth !== null && ageOn(dateOfBirth, today) < 18;
}

// --- responses ---
export const athleteSummarySchema = z.object({
  id: z.number().int(),
  displayName: z.string(),
  handedness: z.enum(handednessValues),
  stanceWidthMm: z.number().int(),
  dateOfBirth: z.string().nullable(),
  homeClub: z.string().nullable(),
  lastSession: z.object({ date: z.string(), context: z.enum(sessionContextValues) }).nullable(),
  /** when a coach archived the player (ISO time); null on the roster */
  archivedAt: z.string().nullable(),
});

/** GET /api/athletes: the roster in name order (?limit=&offset=; `page` says which part). */
export const athleteListResponseSchema = z.object({ athletes: z.array(athleteSummarySchema), page: pageSchema });
export const athleteResponseSchema = z.object({ athlete: athleteSummarySchema });

export const practiceSessionSchema = z.object({
  id: z.number().int(),
  athleteId: z.number().int(),
  sessionDate: z.string(),
  context: z.enum(sessionContextValues),
  location: z.string().nullable(),
  notes: z.string().nullable(),
});
export const sessionListResponseSchema = z.object({ sessions: z.array(practiceSessionSchema) });

export type AthleteSummary = z.infer<typeof athleteSummarySchema>;
export type PracticeSession = z.infer<typeof practiceSessionSchema>;
