// The form fields of an upload and of a reprocess request, validated with zod. Layout and profile arrive as text
// (a preset id or JSON) and are checked with the signal core's own schemas, so a bad one is a 422 on its field.
import { z } from 'zod';
import { builtinLayout, importProfileSchema, parseLayout, parseProfile, sensorLayoutSchema, SignalInputError, type ImportProfile } from '@/lib/signal';
import { STANCE_WIDTH_MAX_MM, STANCE_WIDTH_MIN_MM } from '@/lib/contracts/athletes';
import type { RecordingOptions } from './options';

/** Form fields arrive as text; a blank one counts as left out. */
const optional = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? undefined : v), schema.optional());

const positiveInt = (what: string) =>
  z.coerce.number({ error: `${what} must be a whole number.` }).int({ error: `${what} must be a whole number.` }).positive({ error: `${what} must be positive.` });

// Cutoff limits: 1-50 Hz covers every sensible low-pass for ground-pressure swing data (common practice: 6-20 Hz);
// the core still refuses a cutoff at or above Nyquist for the file's own rate.
export const cutoffSchema = z.coerce
  .number({ error: 'The filter cutoff must be a number of hertz.' })
  .min(1, { error: 'The filter cutoff must be at least 1 Hz.' })
  .max(50, { error: 'The filter cutoff must be at most 50 Hz.' });

export const stanceWidthSchema = z.coerce
  .number({ error: 'Enter the stance width in millimetres.' })
  .int({ error: 'Use whole millimetres.' })
  .min(STANCE_WIDTH_MIN_MM, { error: `Stance width must be at least ${STANCE_WIDTH_MIN_MM} mm.` })
  .max(STANCE_WIDTH_MAX_MM, { error: `Stance width must be at most ${STANCE_WIDTH_MAX_MM} mm.` });

const handednessSchema = z.enum(['right', 'left'], { error: 'Handedness must be right or left.' });

function jsonText(text: string, ctx: z.RefinementCtx, what: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    ctx.addIssue({ code: 'custom', message: `The ${what} is not valid JSON: ${(error as Error).message}` });
    return z.NEVER;
  }
}

/** `layout`: a built-in preset id, or a sensor layout JSON document as text. */
export const layoutFieldSchema = z.string().trim().min(1).transform((text, ctx): RecordingOptions['layout'] => {
  if (!text.startsWith('{')) {
    if (!builtinLayout(text)) {
      ctx.addIssue({ code: 'custom', message: `"${text}" is not a layout preset; use pair-8 or pair-16, or send a layout JSON.` });
      return z.NEVER;
    }
    return { preset: text };
  }
  const value = jsonText(text, ctx, 'layout');
  try {
    return { custom: parseLayout(value) };
  } catch (error) {
    ctx.addIssue({ code: 'custom', message: error instanceof SignalInputError ? error.message : String(error) });
    return z.NEVER;
  }
});

/** `profile`: an import profile JSON document as text. */
export const profileFieldSchema = z.string().trim().min(1).transform((text, ctx): ImportProfile => {
  const value = jsonText(text, ctx, 'import profile');
  try {
    return parseProfile(value);
  } catch (error) {
    ctx.addIssue({ code: 'custom', message: error instanceof SignalInputError ? error.message : String(error) });
    return z.NEVER;
  }
});

export const uploadFieldsSchema = z.object({
  athleteId: z
    .string({ error: 'athleteId is required: the id of the athlete these files belong to.' })
    .trim()
    .min(1, { error: 'athleteId is required: the id of the athlete these files belong to.' })
    .regex(/^\d+$/, { error: 'athleteId must be a whole number.' })
    .transform(Number)
    .pipe(z.number().int().positive({ error: 'athleteId must be positive.' })),
  sessionId: optional(positiveInt('sessionId')),
  layout: optional(layoutFieldSchema),
  profile: optional(profileFieldSchema),
  /** a saved import profile of this coach, by id (instead of `profile`) */
  profileId: optional(positiveInt('profileId')),
  /** save the `profile` sent with this upload under this name, for later uploads */
  saveProfileAs: optional(z.string().max(80, { error: 'Use at most 80 characters.' })),
  handedness: optional(handednessSchema),
  stanceWidthMm: optional(stanceWidthSchema),
  cutoffHz: optional(cutoffSchema),
});

export type UploadFields = z.infer<typeof uploadFieldsSchema>;

/** POST /api/recordings/:id/reprocess: JSON; every field optional, the recording's current options fill the rest. */
export const reprocessSchema = z
  .object({
    layout: z.union([layoutFieldSchema, sensorLayoutSchema.transform((custom) => ({ custom })), z.null()]).optional(),
    profile: z.union([importProfileSchema.transform((p) => p as ImportProfile), z.null()]).optional(),
    handedness: handednessSchema.optional(),
    stanceWidthMm: stanceWidthSchema.optional(),
    cutoffHz: z.union([cutoffSchema, z.null()]).optional(),
  })
  .strict();

export type ReprocessInput = z.infer<typeof reprocessSchema>;
