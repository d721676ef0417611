import { z } from 'zod';
import { sessionContextValues } from '@/lib/contracts/athletes';
import { clubValues, strikeValues } from '@/lib/contracts/swings';
import { scoreCheckSchema, scoreSummarySchema, tempoScoreSchema } from '@/lib/contracts/targets';
import { EVENT_NAMES } from '@/lib/signal/types';

// The live lesson's contract: POST /api/live, POST /api/live/:id/samples (bridge, bearer token), POST /api/live/:id/end,
// GET /api/live/:id (the page's state), GET /api/live/:id/events (Server-Sent Events), PATCH /api/live/:id/swings/:n
// (one-tap labels), POST /api/live/:id/demo-bridge (replays a demo recording into the live session).

/** A live session with no chunk for this long ends itself (issue 16). */
export const LIVE_IDLE_MS = 10 * 60 * 1000;

export const liveStartInputSchema = z.strictObject({
  athleteId: z.number({ error: 'Choose a student.' }).int().positive(),
  sessionId: z.number().int().positive().optional(),
  context: z.enum(sessionContextValues, { error: 'Choose lesson, practice or on-course.' }).optional(),
  drillFocus: z.string().trim().max(200, { error: 'At most 200 characters.' }).optional(),
});
export type LiveStartInput = z.infer<typeof liveStartInputSchema>;

export const liveStartedSchema = z.object({ id: z.number(), token: z.string() });
export const liveSamplesAcceptedSchema = z.object({
  seq: z.number(),
  /** true when this sequence number was stored before: the chunk was ignored */
  duplicate: z.boolean(),
});
export const liveEndedSchema = z.object({ recordingId: z.number() });

export const liveLabelInputSchema = z
  .strictObject({
    club: z.enum(clubValues, { error: 'Choose a club from the list.' }).nullable().optional(),
    strike: z.enum(strikeValues, { error: 'Choose solid, fat, thin or topped.' }).nullable().optional(),
    notSwing: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { error: 'Send at least one label.' });
export type LiveLabelInput = z.infer<typeof liveLabelInputSchema>;

const eventsSchema = z.object(Object.fromEntries(EVENT_NAMES.map((e) => [e, z.number()])) as Record<(typeof EVENT_NAMES)[number], z.ZodNumber>);
const atEventSchema = z.object({ leadPct: z.number(), leadHeelPct: z.number(), trailHeelPct: z.number() });

/** event: level, about 10 times a second: the weight between the feet and heel % in each foot, from the last chunk */
export const liveLevelSchema = z.object({ t: z.number(), leadPct: z.number().nullable(), leadHeelPct: z.number().nullable(), trailHeelPct: z.number().nullable() });
export type LiveLevel = z.infer<typeof liveLevelSchema>;

/** event: swing, once per swing. Times are seconds on the stream's time axis from its first sample. */
export const liveSwingSchema = z.object({
  swingId: z.number(),
  number: z.number(),
  events: eventsSchema,
  values: z.object({
    tempoRatio: z.number(),
    partial: z.boolean(),
    atEvents: z.object(Object.fromEntries(EVENT_NAMES.map((e) => [e, atEventSchema])) as Record<(typeof EVENT_NAMES)[number], typeof atEventSchema>),
  }),
  score: z
    .object({ targetName: z.string(), commonPractice: z.boolean(), checks: z.array(scoreCheckSchema), tempo: tempoScoreSchema.nullable(), summary: scoreSummarySchema })
    .nullable(),
  /** lead % from 0.5 s before address to the finish, every dt seconds (the card's small trace) */
  trace: z.object({ t0: z.number(), dt: z.number(), leadPct: z.array(z.number()) }),
  labels: z.object({ club: z.enum(clubValues).nullable(), strike: z.enum(strikeValues).nullable(), notSwing: z.boolean() }),
});
export type LiveSwingEvent = z.infer<typeof liveSwingSchema>;

/** event: gap: chunks the server has not received while later ones arrived (sequence numbers) */
export const liveGapSchema = z.object({ missing: z.array(z.number()), at: z.string() });
/** event: status */
export const liveStatusSchema = z.object({
  status: z.enum(['waiting', 'streaming', 'ended']),
  message: z.string(),
  recordingId: z.number().nullable(),
});
export type LiveStatus = z.infer<typeof liveStatusSchema>;

export const liveViewSchema = z.object({
  id: z.number(),
  athleteId: z.number(),
  athleteName: z.string(),
  sessionId: z.number(),
  status: z.enum(['active', 'ended']),
  drillFocus: z.string().nullable(),
  recordingId: z.number().nullable(),
  swings: z.array(liveSwingSchema),
  /** the player's lead % band over the swing (address -> finish, 0..100 %), when the coach has built one */
  band: z.object({ name: z.string(), mean: z.array(z.number()), lower: z.array(z.number()), upper: z.array(z.number()) }).nullable(),
});
export type LiveView = z.infer<typeof liveViewSchema>;
export const liveSwingResponseSchema = z.object({ swing: liveSwingSchema });
export const liveDemoBridgeSchema = z.object({ recordingId: z.number().nullable(), filename: z.string() });
