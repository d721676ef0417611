import { z } from 'zod';
import { newPasswordSchema, tokenSchema } from './invitations';
import { emailSchema } from './users';

export const RESET_MINUTES = 60;

export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export const passwordResetConfirmSchema = z.strictObject({ token: tokenSchema, password: newPasswordSchema });

// One answer for every address, known or not, so the endpoint cannot tell who has an account.
export const PASSWORD_RESET_ACCEPTED = {
  status: 'accepted',
  message: 'If an account uses this address, a link to choose a new password is on its way. It works once, for one hour.',
} as const;
export const passwordResetAcceptedSchema = z.object({ status: z.literal('accepted'), message: z.string() });
export const passwordResetDoneSchema = z.object({ status: z.literal('password-changed') });
