// The band builder's form; the same rules as POST /api/bands (name, at least 3 swings, k > 0, shared flag).
import { z } from 'zod';

export const bandFormSchema = z.object({
  name: z.string().trim().min(1, 'Give the band a name.').max(120, 'Keep the name under 120 characters.'),
  k: z.number({ message: 'k must be a number.' }).positive('k must be greater than 0.').max(4, 'k above 4 SD makes a band that says little.'),
  shared: z.boolean(),
  swingIds: z.array(z.number().int().positive()).min(3, 'Pick at least 3 swings: a band from fewer says nothing about spread.'),
});
export type BandFormValues = z.infer<typeof bandFormSchema>;
