import { z } from 'zod';

const e2eEnvSchema = z.object({
  E2E_BASE_URL: z.url({ error: 'E2E_BASE_URL must be the URL of a running `next start` (npm test sets it)' }),
  DATABASE_URL: z.string().startsWith('mysql://', { error: 'DATABASE_URL must point at the server’s seeded database' }),
  CHROMIUM_PATH: z.string().default('/usr/bin/chromium'),
  // the SMTP fake's folder of .eml files (scripts/lib/fakes/smtp.ts; npm test passes it to the app and the tests)
  MAIL_DIR: z.string().min(1, { error: 'MAIL_DIR must be the SMTP fake’s folder (npm test sets it)' }).optional(),
});

export type E2eEnv = z.infer<typeof e2eEnvSchema>;

export function e2eEnv(): E2eEnv {
  const parsed = e2eEnvSchema.safeParse(process.env);
  if (!parsed.success) {
    throw new Error(`End-to-end environment: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  }
  return { ...parsed.data, E2E_BASE_URL: parsed.data.E2E_BASE_URL.replace(/\/$/, '') };
}

export const DEMO_PASSWORD = 'stanceline-demo';
export const DEMO = {
  admin: 'admin@stanceline.test',
  coach: 'coach@stanceline.test',
  coach2: 'coach2@stanceline.test',
  student: 'student@stanceline.test',
  researcher: 'researcher@stanceline.test',
} as const;
