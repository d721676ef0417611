import { z } from 'zod';

export const mailPreferencesSchema = z.object({ drillReminders: z.boolean() });
export const updateMailPreferencesSchema = z.strictObject({ drillReminders: z.boolean({ error: 'drillReminders must be true or false.' }) });
export const mailPreferencesResponseSchema = z.object({ preferences: mailPreferencesSchema });
export type MailPreferences = z.infer<typeof mailPreferencesSchema>;
