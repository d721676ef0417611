import { z } from 'zod';
import { emailSchema, roleValues } from './users';

// Same rule as createUserSchema's password (12+ characters, NIST SP 800-63B 5.1.1.2 asks for 8; 12 is our choice).
export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(12, { error: 'Use at least 12 characters.' })
  .max(200, { error: 'Use at most 200 characters.' });

export const INVITATION_HOURS = 72;

export const createInvitationSchema = z.strictObject({
  email: emailSchema,
  role: z.enum(roleValues, { error: 'Choose a role.' }),
  athleteId: z.number({ error: 'Choose a player.' }).int().positive().nullable().optional(),
});

// The token is 32 random bytes in base64url (43 characters); anything else is refused before a look-up.
export const tokenSchema = z.string({ error: 'The link is missing its code.' }).regex(/^[A-Za-z0-9_-]{43}$/, { error: 'This link is not valid.' });

export const acceptInvitationSchema = z.strictObject({
  token: tokenSchema,
  password: newPasswordSchema,
  // optional: the name on the account (default: the player's name for a student, else the address before the @)
  name: z.string().trim().min(1, { error: 'Enter a name.' }).max(120, { error: 'Use at most 120 characters.' }).optional(),
});

export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

// --- responses ---
export const invitationSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  role: z.enum(roleValues),
  athleteId: z.number().int().nullable(),
  athleteName: z.string().nullable(),
  invitedBy: z.string().nullable(),
  sentAt: z.string(),
  expiresAt: z.string(),
  expired: z.boolean(),
});
export const invitationResponseSchema = z.object({ invitation: invitationSchema });
export const invitationListResponseSchema = z.object({ invitations: z.array(invitationSchema) });
export const acceptInvitationResponseSchema = z.object({
  user: z.object({ id: z.number().int(), email: z.string(), name: z.string(), role: z.enum(roleValues) }),
  athleteId: z.number().int().nullable(),
});

export type Invitation = z.infer<typeof invitationSchema>;
export type AcceptInvitationResponse = z.infer<typeof acceptInvitationResponseSchema>;
