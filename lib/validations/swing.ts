import { z } from 'zod';
import { clubs, eventNames, flights, phaseNames, strikes } from '@/components/swings/swing-schemas';

// One set of schemas for the swing viewer's forms (client, via zodResolver) and for PATCH /api/swings/:id and the
// annotation routes (server). Club, strike and flight values are golf trade terms.

export const clubValues = clubs;
export const strikeValues = strikes;
export const flightValues = flights;
export const visibilityValues = ['coach', 'shared'] as const;

export const TAG_MAX_CHARS = 40;
export const TAGS_MAX = 12; // the viewer's label form uses the same limits (components/swings/label-form-schema.ts)
export const ANNOTATION_MAX_CHARS = 2000;

const eventTime = z.number({ error: 'Give the event time in seconds.' }).refine(Number.isFinite, { error: 'Give a finite time in seconds.' });

/** Moved event times, seconds on the recording's axis; order and window are checked against the swing (422 events.<name>). */
export const eventMovesSchema = z.strictObject(
  Object.fromEntries(eventNames.map((name) => [name, eventTime.optional()])) as Record<(typeof eventNames)[number], z.ZodOptional<typeof eventTime>>,
  { error: 'Unknown event name: use address, top, transition, impact or finish.' },
);

export const swingLabelsSchema = z.strictObject({
  club: z.enum(clubValues, { error: 'Choose a club from the list.' }).nullable(),
  strike: z.enum(strikeValues, { error: 'Choose solid, fat, thin or topped.' }).nullable(),
  flight: z.enum(flightValues, { error: 'Choose push, pull, slice, hook, fade, draw or straight.' }).nullable(),
  tags: z
    .array(
      z.string({ error: 'A tag is text.' }).trim().min(1, { error: 'A tag cannot be empty.' }).max(TAG_MAX_CHARS, { error: `Use at most ${TAG_MAX_CHARS} characters per tag.` }),
      { error: 'Tags are a list of words.' },
    )
    .max(TAGS_MAX, { error: `Use at most ${TAGS_MAX} tags.` })
    .transform((tags) => [...new Set(tags)]),
  rating: z.number({ error: 'Rate from 1 to 5.' }).int({ error: 'Rate with a whole number from 1 to 5.' }).min(1, { error: 'Rate from 1 to 5.' }).max(5, { error: 'Rate from 1 to 5.' }).nullable(),
  /** set aside from stats and swing lists (swings.hidden); restorable */
  notASwing: z.boolean({ error: 'notASwing is true or false.' }),
});

export const swingPatchSchema = z.strictObject({
  events: eventMovesSchema.optional(),
  resetEvents: z.union([z.literal('all'), z.array(z.enum(eventNames, { error: 'Unknown event name.' }))]).optional(),
  labels: swingLabelsSchema.partial().optional(),
});

const annotationBody = z
  .string({ error: 'Write the note.' })
  .trim()
  .min(1, { error: 'Write the note.' })
  .max(ANNOTATION_MAX_CHARS, { error: `Use at most ${ANNOTATION_MAX_CHARS} characters.` });
const annotationTime = z.number({ error: 'Give the time in seconds.' }).refine(Number.isFinite, { error: 'Give a finite time in seconds.' }).nullable();
const annotationPhase = z.enum(phaseNames, { error: 'Choose backswing, transition, downswing or follow-through.' }).nullable();
const visibility = z.enum(visibilityValues, { error: 'Choose coach-only or shared with the student.' });

const onePin = (v: { timeS?: number | null; phase?: string | null }) => !(v.timeS != null && v.phase != null);
const pinError = { error: 'Pin the note to a time or to a phase, not both.', path: ['timeS'] };

export const annotationCreateSchema = z
  .strictObject({ body: annotationBody, timeS: annotationTime.optional(), phase: annotationPhase.optional(), visibility })
  .refine(onePin, pinError);

export const annotationPatchSchema = z
  .strictObject({ body: annotationBody.optional(), timeS: annotationTime.optional(), phase: annotationPhase.optional(), visibility: visibility.optional() })
  .refine(onePin, pinError);

export type SwingPatchInput = z.infer<typeof swingPatchSchema>;
export type SwingLabelsInput = z.infer<typeof swingLabelsSchema>;
export type AnnotationCreateInput = z.infer<typeof annotationCreateSchema>;
export type AnnotationPatchInput = z.infer<typeof annotationPatchSchema>;
