import { z } from 'zod';
import { EVENT_NAMES, PHASE_NAMES, PHASES, type EventName, type PhaseName } from '@/lib/signal/types';

// The swing API's contract: responses of GET/PATCH /api/swings/:id and the annotation routes (lib/db/swings.ts
// returns these types, the client parses them through lib/fetcher.ts), and the request bodies of PATCH
// /api/swings/:id and the annotation routes (the viewer's forms use the same schemas through zodResolver).

export const eventNames = EVENT_NAMES;
export const phaseNames = PHASE_NAMES;

const capitalised = (s: string) => s[0].toUpperCase() + s.slice(1);
/** The events' names on screen: Address, Top, Transition, Impact, Finish. */
export const eventLabels = Object.fromEntries(EVENT_NAMES.map((e) => [e, capitalised(e)])) as Record<EventName, string>;
/** Each phase's name on screen and the events that bound it (lib/signal/types.ts PHASES), e.g. "address → top". */
export const phaseLabels = Object.fromEntries(PHASES.map((p) => [p.name, { name: capitalised(p.name), span: `${p.from} → ${p.to}` }])) as Record<
  PhaseName,
  { name: string; span: string }
>;

const num = z.number().nullable();

export const swingDetailSchema = z.object({
  id: z.number().int(),
  index: z.number().int(),
  startS: z.number(),
  endS: z.number(),
  impactSource: z.enum(['marker', 'detected']),
  tempoRatio: num,
  hidden: z.boolean(),
  stale: z.boolean(),
  /** a pitch or half swing (less travel toward the lead foot than the golfer's full swings) */
  partial: z.boolean(),
  /** a small shift toward the lead foot right before the takeaway */
  forwardPress: z.object({ timeS: z.number(), sizeMm: z.number() }).nullable(),
  /** a coach counted this rejected candidate as a swing */
  promoted: z.enum(['detected', 'placed']).nullable(),
  recording: z.object({ id: z.number().int(), filename: z.string(), algorithmVersion: z.string().nullable(), parameters: z.record(z.string(), z.unknown()) }),
  session: z.object({ id: z.number().int(), sessionDate: z.string(), context: z.enum(['lesson', 'practice', 'on-course']) }),
  athlete: z.object({ id: z.number().int(), displayName: z.string(), dateOfBirth: z.string().nullable() }),
  events: z.array(
    z.object({
      name: z.enum(eventNames),
      timeS: z.number(),
      source: z.enum(['auto', 'manual']),
      autoTimeS: num,
      misfit: z.boolean(),
      leadPct: num,
      leadHeelPct: num,
      trailHeelPct: num,
      copXMm: num,
      copYMm: num,
    }),
  ),
  phases: z.array(
    z.object({ name: z.enum(phaseNames), durationS: num, copPathMm: num, peakCopSpeedMmS: num, meanLeadPct: num }),
  ),
});

export const swingResponseSchema = z.object({ swing: swingDetailSchema });

export type SwingDetail = z.infer<typeof swingDetailSchema>;

// The viewer's fields of GET/PATCH /api/swings/:id.

export const clubs = ['driver', 'wood', 'hybrid', 'iron-3', 'iron-4', 'iron-5', 'iron-6', 'iron-7', 'iron-8', 'iron-9', 'wedge'] as const;
export const strikes = ['solid', 'fat', 'thin', 'topped'] as const;
export const flights = ['push', 'pull', 'slice', 'hook', 'fade', 'draw', 'straight'] as const;

const nullableSeries = z.array(z.number().nullable());

export const swingLabelsSchema = z.object({
  club: z.enum(clubs).nullable(),
  strike: z.enum(strikes).nullable(),
  flight: z.enum(flights).nullable(),
  tags: z.array(z.string()),
  rating: z.number().int().min(1).max(5).nullable(),
  notASwing: z.boolean(),
});

export const annotationSchema = z.object({
  id: z.number().int(),
  authorName: z.string(),
  authorRole: z.string(),
  body: z.string(),
  timeS: z.number().nullable(),
  phase: z.enum(phaseNames).nullable(),
  visibility: z.enum(['coach', 'shared']),
  createdAt: z.string(),
  updatedAt: z.string(),
});

/**
 * A uniform time axis sent as its first time, step and length instead of one number per sample: sample i is at
 * start + i * step (seconds; the viewer rounds to 0.1 ms).
 */
export const timeAxisSchema = z.object({ start: z.number(), step: z.number().positive(), count: z.number().int().min(0) });
export type TimeAxis = z.infer<typeof timeAxisSchema>;

export const swingViewSchema = swingDetailSchema.extend({
  // Columns of numbers at the precision the charts draw: shares and millimetres to 0.1, COP speed to 1 mm/s.
  series: z.object({
    time: timeAxisSchema,
    leadPct: nullableSeries,
    leadHeelPct: nullableSeries,
    trailHeelPct: nullableSeries,
    copX: nullableSeries,
    copY: nullableSeries,
    copSpeed: nullableSeries,
  }),
  /** the previous and next swing of the same recording (GET /api/swings/:id/overlay-options lists the athlete's others) */
  siblings: z.object({
    previousId: z.number().int().nullable(),
    nextId: z.number().int().nullable(),
  }),
  layout: z.object({
    id: z.string(),
    name: z.string(),
    foot_length_mm: z.number(),
    sensors: z.array(z.object({ id: z.string(), foot: z.enum(['left', 'right']), x_mm: z.number(), y_mm: z.number(), area_mm2: z.number(), region: z.enum(['heel', 'toe']).optional() })),
  }),
  handedness: z.enum(['right', 'left']),
  stanceWidthMm: z.number(),
  sensorFrames: z.array(z.object({ timeS: z.number(), event: z.enum(eventNames), forcesN: z.record(z.string(), z.number().nullable()) })),
  labels: swingLabelsSchema,
  annotations: z.array(annotationSchema),
  corrections: z.array(z.object({ event: z.enum(eventNames), fromS: z.number(), toS: z.number(), byName: z.string(), at: z.string(), kind: z.enum(['move', 'reset']).optional() })),
  canEdit: z.boolean(),
});

export const swingViewResponseSchema = z.object({ swing: swingViewSchema });
export const annotationResponseSchema = z.object({ annotation: annotationSchema });

export type SwingView = z.infer<typeof swingViewSchema>;
export type SwingLabels = z.infer<typeof swingLabelsSchema>;
export type Annotation = z.infer<typeof annotationSchema>;

// --- request bodies ---
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

export const swingLabelsInputSchema = z.strictObject({
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
  labels: swingLabelsInputSchema.partial().optional(),
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
export type SwingLabelsInput = z.infer<typeof swingLabelsInputSchema>;
export type AnnotationCreateInput = z.infer<typeof annotationCreateSchema>;
export type AnnotationPatchInput = z.infer<typeof annotationPatchSchema>;

/**
 * GET /api/swings/:id/overlay-options: the athlete's other swings to draw over this one, newest session first, each
 * session's swings in time order with their session-wide number; `group` names the session. At most 200.
 */
export const overlayOptionSchema = z.object({ id: z.number().int(), label: z.string(), group: z.string() });
export type OverlayOption = z.infer<typeof overlayOptionSchema>;
export const overlayOptionsResponseSchema = z.object({ options: z.array(overlayOptionSchema) });
export type OverlayOptionsResponse = z.infer<typeof overlayOptionsResponseSchema>;

/**
 * GET /api/recordings/:id/overview: the whole recording for the overview strip and the viewer's "Whole recording"
 * zoom, min/max per display bucket (at most 2,000 points per trace), with the moves the swing finder passed over.
 * The same for every swing of the recording, so it is its own (cacheable) request, not part of each swing's.
 */
export const recordingOverviewSchema = z.object({
  time: z.array(z.number()),
  leadPct: nullableSeries,
  copX: nullableSeries,
  leadHeelPct: nullableSeries,
  trailHeelPct: nullableSeries,
  copSpeed: nullableSeries,
  /** moves the swing finder looked at and did not count, with the reason in plain words */
  candidates: z.array(z.object({ timeS: z.number(), reason: z.string(), reasonText: z.string() })),
});
export type RecordingOverview = z.infer<typeof recordingOverviewSchema>;
export const recordingOverviewResponseSchema = z.object({ overview: recordingOverviewSchema });
export type RecordingOverviewResponse = z.infer<typeof recordingOverviewResponseSchema>;
