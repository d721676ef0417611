// The compare and progress API's contract: GET /api/athletes/:id/compare and GET /api/athletes/:id/progress.
// lib/compare returns these types, the routes send them, the client parses them through lib/fetcher.ts.
import { z } from 'zod';
import { bandCurveSetSchema } from './bands';

export const metricDifferenceSchema = z.object({
  metric: z.string(),
  meanA: z.number().nullable(),
  meanB: z.number().nullable(),
  diff: z.number().nullable(),
  ci95: z.tuple([z.number(), z.number()]).nullable(),
  df: z.number().nullable(),
  method: z.literal('welch'),
  note: z.string().nullable(),
});
export type MetricDifference = z.infer<typeof metricDifferenceSchema>;

const compareSetSchema = z.object({
  label: z.string(),
  n: z.number(),
  sessionIds: z.array(z.number()),
  values: z.record(z.string(), z.array(z.number())),
  /** mean curve +- 1 SD of the set; null below 2 usable swings */
  meanCurve: bandCurveSetSchema.nullable(),
});
export const compareResponseSchema = z.object({ a: compareSetSchema, b: compareSetSchema, differences: z.array(metricDifferenceSchema) });
export type CompareResponse = z.infer<typeof compareResponseSchema>;

export const metricStatSchema = z.object({ mean: z.number().nullable(), sd: z.number().nullable(), n: z.number() });
export const progressSessionSchema = z.object({
  id: z.number(),
  date: z.string(),
  context: z.string(),
  n: z.number(),
  metrics: z.record(z.string(), metricStatSchema),
  targetScore: z.object({ passed: z.number(), total: z.number() }).nullable(),
});
export const progressResponseSchema = z.object({ sessions: z.array(progressSessionSchema) });
export type ProgressResponse = z.infer<typeof progressResponseSchema>;
