import { z } from 'zod';
import { athleteSummarySchema } from './athletes';
import { roleValues } from './users';

// GET /api/me: who is signed in, and for a student their own player profile (null when no player is linked yet).

export const viewerSchema = z.object({
  id: z.number().int(),
  role: z.enum(roleValues),
  academyId: z.number().int(),
  name: z.string(),
  email: z.string(),
});

export const meResponseSchema = z.object({ user: viewerSchema, athlete: athleteSummarySchema.nullable() });

export type ViewerResponse = z.infer<typeof viewerSchema>;
export type MeResponse = z.infer<typeof meResponseSchema>;
