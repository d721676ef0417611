import { z } from 'zod';

export const roleValues = ['admin', 'coach', 'student', 'researcher'] as const;
export type Role = (typeof roleValues)[number];

export const emailSchema = z
  .string({ error: 'Enter an email address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid email address.' }).max(254, { error: 'Use at most 254 characters.' }));

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, { error: 'Enter your password.' }).max(200),
});

// 12 characters minimum: length matters more than composition rules (NIST SP 800-63B, section 5.1.1.2
// asks for at least 8; 12 is our own stricter choice).
export const createUserSchema = z.strictObject({
  email: emailSchema,
  name: z.string({ error: 'Enter a name.' }).trim().min(1, { error: 'Enter a name.' }).max(120),
  role: z.enum(roleValues, { error: 'Choose a role.' }),
  password: z
    .string({ error: 'Enter a password.' })
    .min(12, { error: 'Use at least 12 characters.' })
    .max(200, { error: 'Use at most 200 characters.' }),
});

export const updateUserSchema = z
  .strictObject({
    role: z.enum(roleValues, { error: 'Choose a role.' }).optional(),
    active: z.boolean({ error: 'Active must be true or false.' }).optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, { error: 'Send a role or an active flag.' });

export type CreateUserInput = z.infer<typeof createUserSchema>;
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

// --- responses ---
export const academyUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roleValues),
  active: z.boolean(),
});
export const userListResponseSchema = z.object({ users: z.array(academyUserSchema) });
export const userResponseSchema = z.object({ user: academyUserSchema });

export type AcademyUser = z.infer<typeof academyUserSchema>;
