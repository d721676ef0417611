import { ZodError } from 'zod';
import { cohortFilterSchema, exportQuerySchema, type CohortFilter, type ExportQuery } from '@/lib/contracts/research';

// The export routes' query string: format and shape, the rest cohort filters. An unknown or repeated parameter is a
// 422 that names it (a typo in a filter must not silently widen the cohort).
export function parseExportQuery(url: string, withFormat = true): { filter: CohortFilter; query: ExportQuery } {
  const params = new URL(url).searchParams;
  const raw: Record<string, string> = {};
  for (const [k, v] of params) {
    if (k in raw) throw new ZodError([{ code: 'custom', path: [k], message: `The parameter ${k} is given more than once.`, input: v }]);
    raw[k] = v;
  }
  if (!withFormat) return { filter: cohortFilterSchema.parse(raw), query: exportQuerySchema.parse({}) };
  const { format, shape, ...rest } = raw;
  return { filter: cohortFilterSchema.parse(rest), query: exportQuerySchema.parse({ format, shape }) };
}
