import { z } from 'zod';
import { handednessValues, sessionContextValues } from './athlete';
import { roleValues } from './user';

// Shapes of API responses, checked on the client by lib/fetcher.ts.

export const athleteSummarySchema = z.object({
  id: z.number().int(),
  displayName: z.string(),
  handedness: z.enum(handednessValues),
  stanceWidthMm: z.number().int(),
  dateOfBirth: z.string().nullable(),
  homeClub: z.string().nullable(),
  lastSession: z.object({ date: z.string(), context: z.enum(sessionContextValues) }).nullable(),
});

export const athleteListResponseSchema = z.object({ athletes: z.array(athleteSummarySchema) });
export const athleteResponseSchema = z.object({ athlete: athleteSummarySchema });

export const practiceSessionSchema = z.object({
  id: z.number().int(),
  athleteId: z.number().int(),
  sessionDate: z.string(),
  context: z.enum(sessionContextValues),
  location: z.string().nullable(),
  notes: z.string().nullable(),
});
export const sessionListResponseSchema = z.object({ sessions: z.array(practiceSessionSchema) });

export const academyUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roleValues),
  active: z.boolean(),
});
export const userListResponseSchema = z.object({ users: z.array(academyUserSchema) });
export const userResponseSchema = z.object({ user: academyUserSchema });

export const errorResponseSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
  }),
});

export type AthleteSummary = z.infer<typeof athleteSummarySchema>;
export type PracticeSession = z.infer<typeof practiceSessionSchema>;
export type AcademyUser = z.infer<typeof academyUserSchema>;
