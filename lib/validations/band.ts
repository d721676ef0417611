import { z } from 'zod';

// POST /api/bands: a name and the swings to build from (at least 3 usable ones; fewer is a 422 from the builder).
export const bandInputSchema = z.strictObject({
  name: z.string({ error: 'Give the band a name.' }).trim().min(1, { error: 'Give the band a name.' }).max(120, { error: 'At most 120 characters.' }),
  swingIds: z.array(z.number().int().positive(), { error: 'Give swingIds as a list of swing ids.' }).min(1, { error: 'Pick at least 3 swings.' }).max(200, { error: 'At most 200 swings.' }),
  k: z.number({ error: 'k must be a number.' }).positive({ error: 'k must be above 0.' }).max(4, { error: 'k must be at most 4.' }).default(1),
  shared: z.boolean().default(false),
});
export type BandInput = z.infer<typeof bandInputSchema>;
