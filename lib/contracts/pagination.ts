// Offset pagination of list responses: `?limit=N&offset=M` (both optional; N at most the list's maximum). Without
// `limit` the answer holds the whole list from `offset` on (as before pagination, so existing clients keep working);
// `nextOffset` says where the next page starts (null on the last page). Offsets are over a stable order (each list
// names its sort keys).
import { z } from 'zod';

export const pageSchema = z.object({
  offset: z.number().int().min(0),
  /** the limit asked for; null = the rest of the list */
  limit: z.number().int().positive().nullable(),
  /** how many items the whole list holds */
  total: z.number().int().min(0),
  nextOffset: z.number().int().positive().nullable(),
});
export type Page = z.infer<typeof pageSchema>;

export function pageQuerySchema(max: number) {
  return z.object({
    limit: z.coerce.number().int().min(1).max(max, { error: `limit must be at most ${max}` }).nullable().default(null),
    offset: z.coerce.number().int().min(0).default(0),
  });
}
export type PageQuery = { limit: number | null; offset: number };
