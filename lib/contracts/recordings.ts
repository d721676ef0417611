import { z } from 'zod';
import { pageSchema } from './pagination';
import { recordingOptionsSchema } from '@/lib/recordings/options';
import { EVENT_NAMES } from '@/lib/signal/types';
import { clubs, flights, strikes } from '@/lib/contracts/swings';

// The recordings API's responses (lib/recordings/views.ts, lib/recordings/upload.ts build them; the client parses
// them through lib/fetcher.ts).

export const recordingStatusValues = ['received', 'processing', 'ready', 'failed'] as const;
export type RecordingStatus = (typeof recordingStatusValues)[number];

const perEvent = <S extends z.ZodType>(schema: S) => z.object(Object.fromEntries(EVENT_NAMES.map((n) => [n, schema])) as Record<(typeof EVENT_NAMES)[number], S>);
const eventTimes = perEvent(z.number().nullable());
const eventSource = z.object({ source: z.enum(['auto', 'manual']), autoTimeS: z.number().nullable(), misfit: z.boolean() });

export const swingSummarySchema = z.object({
  id: z.number().int(),
  recordingId: z.number().int(),
  index: z.number().int(),
  startS: z.number(),
  endS: z.number(),
  events: eventTimes,
  /** per event: detected or moved by hand, the detector's own time, and whether a reprocess no longer fits it */
  eventSources: perEvent(eventSource),
  impactSource: z.enum(['marker', 'detected']),
  tempoRatio: z.number().nullable(),
  leadPctAtImpact: z.number().nullable(),
  hidden: z.boolean(),
  stale: z.boolean(),
  /** a pitch or half swing: the shape of a full swing with clearly less travel toward the lead foot */
  partial: z.boolean(),
  /** a small shift toward the lead foot right before the takeaway: start (s) and size (mm) */
  forwardPress: z.object({ timeS: z.number(), sizeMm: z.number() }).nullable(),
  /** set when a coach counted a rejected candidate as a swing: 'detected' (relaxed checks) or 'placed' (events to adjust) */
  promoted: z.enum(['detected', 'placed']).nullable(),
});

/** A move the swing finder looked at and did not count: the rejection code (lib/signal REJECT_REASONS) and the
 *  reason in plain words. */
export const candidateSchema = z.object({ timeS: z.number(), reason: z.string(), reasonText: z.string() });
/** A candidate a coach counted as a swing (POST .../candidates/promote), kept over every reprocess. */
export const promotionSchema = z.object({ id: z.number().int(), timeS: z.number(), reason: z.string(), userId: z.number().int().nullable(), at: z.string() });

export const recordingErrorSchema = z.object({ message: z.string(), line: z.number().nullable(), column: z.number().nullable() });

const recordingBase = {
  id: z.number().int(),
  athleteId: z.number().int(),
  sessionId: z.number().int(),
  filename: z.string(),
  byteSize: z.number(),
  sha256: z.string(),
  status: z.enum(recordingStatusValues),
  error: recordingErrorSchema.nullable(),
  /** the processing parameters of the last analysis; before one, the requested values */
  parameters: z.record(z.string(), z.unknown()),
  options: recordingOptionsSchema,
  /** where handedness and stance width came from: the upload form, the file's metadata, the athlete's profile or the default */
  parameterSources: z.record(z.string(), z.unknown()).nullable(),
  algorithmVersion: z.string().nullable(),
  /** the file's metadata lines */
  recording: z.record(z.string(), z.unknown()).nullable(),
  createdAt: z.string(),
  processedAt: z.string().nullable(),
};

export const recordingViewSchema = z.object({
  ...recordingBase,
  swings: z.array(swingSummarySchema),
  /** rejected swing candidates of the last analysis (the coach may promote one) */
  candidates: z.array(candidateSchema),
  promotions: z.array(promotionSchema),
  /** which swings this answer holds (?limit=&offset=, in swing order) */
  swingsPage: pageSchema,
});

/** A swing's labels as the session's swing table shows and filters them ("not a swing" is `hidden`). */
export const swingListLabelsSchema = z.object({
  club: z.enum(clubs).nullable(),
  strike: z.enum(strikes).nullable(),
  flight: z.enum(flights).nullable(),
  tags: z.array(z.string()),
  rating: z.number().int().min(1).max(5).nullable(),
});

/** A swing in its session's list: `number` runs 1..N over the whole session in time order; `filename` is its file. */
export const sessionSwingSchema = swingSummarySchema.extend({
  number: z.number().int().positive(),
  filename: z.string(),
  labels: swingListLabelsSchema,
});

export const sessionRecordingsSchema = z.object({
  session: z.object({ id: z.number().int(), athleteId: z.number().int(), sessionDate: z.string(), context: z.string(), location: z.string().nullable() }),
  recordings: z.array(z.object({ ...recordingBase, swingCount: z.number().int() })),
  /** the swings of this answer's recordings, numbered over the whole session */
  swings: z.array(sessionSwingSchema),
  /** which recordings this answer holds (?limit=&offset=, in upload order) */
  page: pageSchema,
});

export const uploadResponseSchema = z.object({
  recordings: z.array(
    z.object({ id: z.number().int(), filename: z.string(), status: z.enum(recordingStatusValues), duplicate: z.boolean(), sessionId: z.number().int() }),
  ),
});

export type SwingSummary = z.infer<typeof swingSummarySchema>;
export type CandidateView = z.infer<typeof candidateSchema>;
export type PromotionView = z.infer<typeof promotionSchema>;
export type SessionSwing = z.infer<typeof sessionSwingSchema>;
export type UploadResponse = z.infer<typeof uploadResponseSchema>;
export type RecordingView = z.infer<typeof recordingViewSchema>;
export type SessionRecordings = z.infer<typeof sessionRecordingsSchema>;
export type SessionRecording = SessionRecordings['recordings'][number];
export type RecordingError = z.infer<typeof recordingErrorSchema>;

export const isSettled = (status: RecordingStatus) => status === 'ready' || status === 'failed';

/** POST /api/recordings/:id/candidates/promote: a rejected candidate's time as GET /api/recordings/:id lists it. */
export const promoteSchema = z.strictObject({ timeS: z.number({ error: 'timeS must be a number of seconds.' }).finite() });
export type PromoteInput = z.infer<typeof promoteSchema>;
