import { z } from 'zod';
import { binnedRefSchema } from '@/lib/contracts/sessions';

// A coach sends a student a lesson summary (sessionId) or one swing (swingId): exactly one of the two.
export const createShareSchema = z
  .strictObject({
    sessionId: z.number().int().positive().optional(),
    swingId: z.number().int().positive().optional(),
    note: z.string().trim().max(500, { error: 'Use at most 500 characters.' }).optional(),
  })
  .refine((v) => (v.sessionId === undefined) !== (v.swingId === undefined), { error: 'Send a sessionId or a swingId (one of them).' });

export type CreateShareInput = z.infer<typeof createShareSchema>;

// PATCH /api/shares/:id: the note only (trimmed; an empty note clears it). DELETE answers { share: binnedRefSchema }
// (lib/contracts/sessions.ts), POST /api/shares/:id/restore and PATCH answer { share }, GET
// /api/athletes/:id/shares answers { shares } (newest first, binned ones left out).
export const shareNotePatchSchema = z.strictObject({
  note: z.string({ error: 'Use text.' }).trim().max(500, { error: 'Use at most 500 characters.' }),
});
export type ShareNotePatch = z.infer<typeof shareNotePatchSchema>;

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
export const shareBinnedResponseSchema = z.object({ share: binnedRefSchema });
export type Share = z.infer<typeof shareSchema>;
