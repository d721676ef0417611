import { z } from 'zod';
import { importProfileSchema } from '@/lib/signal/read/schemas';

// /api/import-profiles: a coach's saved import profiles (how a file that is not in recording format 1 maps onto it),
// reused on every upload. The profile itself is the public format of the recording spec (lib/signal/read/schemas.ts).

export const importProfileInputSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'Give the profile a name.' }).max(80, { error: 'Use at most 80 characters.' }),
  profile: importProfileSchema,
});

export const savedImportProfileSchema = z.object({ id: z.number().int(), name: z.string(), profile: importProfileSchema });
export const importProfilesResponseSchema = z.object({ profiles: z.array(savedImportProfileSchema) });
export const importProfileCreatedSchema = z.object({ profile: z.object({ id: z.number().int(), name: z.string() }) });

export type ImportProfileInput = z.infer<typeof importProfileInputSchema>;
export type SavedImportProfile = z.infer<typeof savedImportProfileSchema>;
export type ImportProfilesResponse = z.infer<typeof importProfilesResponseSchema>;
