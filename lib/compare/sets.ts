import { z } from 'zod';
import { METRICS, DEFAULT_METRICS } from './metrics';
import type { SwingFacts } from '@/lib/targets/swing-facts';

// A set of one athlete's swings: all swings of sessions in one context ('context:practice') or one month ('month:2026-02').
export const setSchema = z
  .string({ error: 'Give a set as context:<lesson|practice|on-course> or month:YYYY-MM.' })
  .regex(/^(context:(lesson|practice|on-course)|month:\d{4}-(0[1-9]|1[0-2]))$/, { error: 'Give a set as context:<lesson|practice|on-course> or month:YYYY-MM.' });

export const metricsParamSchema = z
  .string()
  .optional()
  .transform((s) => (s ? s.split(',').map((m) => m.trim()).filter(Boolean) : DEFAULT_METRICS))
  .pipe(z.array(z.enum(METRICS as [string, ...string[]], { error: `Unknown metric; use one of ${METRICS.join(', ')}.` })).min(1).max(20));

export const compareQuerySchema = z.strictObject({ a: setSchema, b: setSchema, metrics: metricsParamSchema });
export const progressQuerySchema = z.strictObject({ metrics: metricsParamSchema });

export function setLabel(set: string): string {
  const [kind, value] = set.split(':');
  return kind === 'context' ? `${value} sessions` : `month ${value}`;
}

export function inSet(s: SwingFacts, set: string): boolean {
  const [kind, value] = set.split(':');
  return kind === 'context' ? s.context === value : s.sessionDate.startsWith(`${value}-`);
}
