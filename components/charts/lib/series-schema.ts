// zod shapes for the display series as JSON carries them: NaN cannot travel in JSON, so a missing value is null,
// turned back into NaN (a gap in the line) here.
import { z } from 'zod';
import type { TraceSeries } from './types';

const values = z.array(z.number().nullable()).transform((a) => Float64Array.from(a, (v) => (v === null ? NaN : v)));

export const traceSeriesSchema = z
  .object({
    time: z.array(z.number()),
    leadPct: values,
    leadHeelPct: values,
    trailHeelPct: values,
    copX: values,
    copY: values,
    copSpeed: values,
  })
  .superRefine((s, ctx) => {
    for (const key of ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copX', 'copY', 'copSpeed'] as const) {
      if (s[key].length !== s.time.length) {
        ctx.addIssue({ code: 'custom', path: [key], message: `${key} has ${s[key].length} values for ${s.time.length} time points` });
      }
    }
    for (let i = 1; i < s.time.length; i++) {
      if (!(s.time[i] > s.time[i - 1])) {
        ctx.addIssue({ code: 'custom', path: ['time', i], message: `time must be strictly increasing (index ${i})` });
        break;
      }
    }
  })
  .transform((s): TraceSeries => ({ ...s, time: Float64Array.from(s.time) }));

export const sensorFramesSchema = z.object({
  timeS: z.array(z.number()),
  forcesN: z.record(z.string(), z.array(z.number().nullable()).transform((a) => a.map((v) => (v === null ? NaN : v)))),
});
