import { z } from 'zod';

// A recording's videos: POST /api/recordings/:id/videos (multipart, one or more files), GET/PATCH/DELETE
// /api/videos/:id, GET /api/videos/:id/stream (the playable mp4, Range), GET /api/videos/:id/poster,
// GET /api/recordings/:id/videos (the list for the viewer). Video time = recording time + offsetS.

export const VIDEO_STATUSES = ['queued', 'processing', 'ready', 'failed'] as const;
export const SYNC_SOURCES = ['audio', 'manual'] as const;
export const VIDEO_EXTENSIONS = ['mp4', 'mov', 'webm'] as const;
/** 1 GB per file (the limit) */
export const MAX_VIDEO_BYTES = 1024 * 1024 * 1024;

export const videoUploadedSchema = z.strictObject({
  videos: z.array(z.strictObject({ id: z.number().int(), status: z.enum(VIDEO_STATUSES) })),
});
export type VideoUploaded = z.infer<typeof videoUploadedSchema>;

export const videoSchema = z.strictObject({
  id: z.number().int(),
  status: z.enum(VIDEO_STATUSES),
  fps: z.number().nullable(),
  durationS: z.number().nullable(),
  offsetS: z.number().nullable(),
  syncSource: z.enum(SYNC_SOURCES).nullable(),
  posterUrl: z.string().nullable(),
});
export type VideoView = z.infer<typeof videoSchema>;

/** The list for the viewer: the fields plus the file name, the reason of a failure and the sync note. */
export const videoListItemSchema = videoSchema.extend({
  recordingId: z.number().int(),
  filename: z.string(),
  error: z.string().nullable(),
  syncNote: z.string().nullable(),
  streamUrl: z.string().nullable(),
});
export const videoListSchema = z.strictObject({ videos: z.array(videoListItemSchema) });
export type VideoList = z.infer<typeof videoListSchema>;

/**
 * PATCH /api/videos/:id: exactly one way to sync.
 * - `impact`: "this is impact": the video time shown (videoTimeS) is the impact of swing `swingId` -> manual.
 * - `nudgeFrames`: move the offset by whole frames of this video (+ = later in the video); a nudge is the coach's
 *   hand, so the source becomes manual.
 * - `offsetS`: set the offset directly -> manual.
 */
export const videoPatchSchema = z.union([
  z.strictObject({ impact: z.strictObject({ swingId: z.number().int().positive(), videoTimeS: z.number().min(0).max(86_400) }) }),
  z.strictObject({ nudgeFrames: z.number().int().min(-10_000).max(10_000).refine((n) => n !== 0, { error: 'Nudge by at least one frame.' }) }),
  z.strictObject({ offsetS: z.number().min(-86_400).max(86_400) }),
]);
export type VideoPatch = z.infer<typeof videoPatchSchema>;

/** DELETE /api/videos/:id: the video is in the bin until restorableUntil (YYYY-MM-DD, UTC); then the sweep removes it. */
export const videoBinnedSchema = z.strictObject({ id: z.number().int(), binnedAt: z.string(), restorableUntil: z.string().nullable() });
export type VideoBinned = z.infer<typeof videoBinnedSchema>;
