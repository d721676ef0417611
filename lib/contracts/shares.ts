import { z } from 'zod';

// A coach sends a student a lesson summary (sessionId) or one swing (swingId): exactly one of the two.
export const createShareSchema = z
  .strictObject({
    sessionId: z.number().int().positive().optional(),
    swingId: z.number().int().positive().optional(),
    note: z.string().trim().max(500, { error: 'Use at most 500 characters.' }).optional(),
  })
  .refine((v) => (v.sessionId === undefined) !== (v.swingId === undefined), { error: 'Send a sessionId or a swingId (one of them).' });

export type CreateShareInput = z.infer<typeof createShareSchema>;

export const shareSchema = z.object({
  id: z.number().int(),
  kind: z.enum(['lesson', 'swing']),
  athleteId: z.number().int(),
  sessionId: z.number().int(),
  swingId: z.number().int().nullable(),
  sessionDate: z.string(),
  sharedBy: z.string().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
  href: z.string(),
});
export const shareResponseSchema = z.object({ share: shareSchema });
export const shareListResponseSchema = z.object({ shares: z.array(shareSchema) });
export type Share = z.infer<typeof shareSchema>;
