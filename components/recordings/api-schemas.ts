import { z } from 'zod';
import { eventNames } from '@/components/swings/swing-schemas';

// Shapes of the recordings API (lib/recordings/views.ts, lib/recordings/upload.ts), checked on the client by
// lib/fetcher.ts. Only the fields the pages use are required; the rest pass through.

export const recordingStatusValues = ['received', 'processing', 'ready', 'failed'] as const;
export type RecordingStatus = (typeof recordingStatusValues)[number];

const eventTimes = z.object(Object.fromEntries(eventNames.map((n) => [n, z.number().nullable()])) as Record<(typeof eventNames)[number], z.ZodNullable<z.ZodNumber>>);

export const swingSummarySchema = z.object({
  id: z.number().int(),
  recordingId: z.number().int(),
  index: z.number().int(),
  startS: z.number().nullable(),
  endS: z.number().nullable(),
  events: eventTimes,
  impactSource: z.enum(['marker', 'detected']),
  tempoRatio: z.number().nullable(),
  leadPctAtImpact: z.number().nullable(),
  hidden: z.boolean(),
  stale: z.boolean(),
  /** a pitch or half swing (issue 9); optional so older responses still parse */
  partial: z.boolean().optional(),
});

export const recordingErrorSchema = z.object({ message: z.string(), line: z.number().nullable(), column: z.number().nullable() });

const recordingBase = {
  id: z.number().int(),
  athleteId: z.number().int(),
  sessionId: z.number().int(),
  filename: z.string(),
  byteSize: z.number(),
  status: z.enum(recordingStatusValues),
  error: recordingErrorSchema.nullable(),
  parameters: z.record(z.string(), z.unknown()),
  /** where handedness and stance width came from (issue 9); optional so older responses still parse */
  parameterSources: z.record(z.string(), z.unknown()).nullable().optional(),
  algorithmVersion: z.string().nullable(),
  createdAt: z.string(),
  processedAt: z.string().nullable(),
};

export const recordingViewSchema = z.object({ ...recordingBase, swings: z.array(swingSummarySchema) });

export const sessionRecordingsSchema = z.object({
  session: z.object({ id: z.number().int(), athleteId: z.number().int(), sessionDate: z.string(), context: z.string(), location: z.string().nullable() }),
  recordings: z.array(z.object({ ...recordingBase, swingCount: z.number().int() })),
  swings: z.array(swingSummarySchema),
});

export const uploadResponseSchema = z.object({
  recordings: z.array(
    z.object({ id: z.number().int(), filename: z.string(), status: z.enum(recordingStatusValues), duplicate: z.boolean().optional(), sessionId: z.number().int() }),
  ),
});

export type SwingSummary = z.infer<typeof swingSummarySchema>;
export type RecordingView = z.infer<typeof recordingViewSchema>;
export type SessionRecordings = z.infer<typeof sessionRecordingsSchema>;
export type SessionRecording = SessionRecordings['recordings'][number];
export type RecordingError = z.infer<typeof recordingErrorSchema>;

export const isSettled = (status: RecordingStatus) => status === 'ready' || status === 'failed';
