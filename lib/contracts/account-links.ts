import { z } from 'zod';

// Linking a student account to a player (POST/DELETE /api/athletes/:id/account): the student then sees that player's
// sessions, swings and drills. An admin links any student account of the academy to any player; a coach links one to a
// player on their roster.

export const accountLinkInputSchema = z.strictObject({
  email: z.string({ error: 'Enter the student’s e-mail address.' }).trim().toLowerCase().email({ error: 'Enter a valid e-mail address.' }).max(254),
});

export const accountLinkResponseSchema = z.object({
  athleteId: z.number().int(),
  /** the linked student account, or null after unlinking */
  account: z.object({ id: z.number().int(), email: z.string(), name: z.string() }).nullable(),
});

export type AccountLinkInput = z.infer<typeof accountLinkInputSchema>;
export type AccountLinkResponse = z.infer<typeof accountLinkResponseSchema>;
