// zod schemas of the two JSON inputs (README "Sensor layout" and "Import profile"), and their parsers.
// Validation errors become SignalInputError naming the JSON path, so a bad file reads like a bad CSV cell.
import { z } from 'zod';
import { SignalInputError } from '../errors';
import type { ImportProfile, SensorLayout } from '../types';

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const positive = finite.refine((v) => v > 0, 'must be greater than 0');

export const sensorSpecSchema = z.object({
  id: z.string().regex(/^[LR][1-9][0-9]*$/, 'sensor id must be L<n> or R<n>'),
  foot: z.enum(['left', 'right']),
  x_mm: finite,
  y_mm: finite,
  area_mm2: positive,
  region: z.enum(['heel', 'toe']).optional(),
});

export const sensorLayoutSchema = z
  .object({
    id: z.string().min(1),
    name: z.string().min(1),
    foot_length_mm: positive,
    sensors: z.array(sensorSpecSchema).min(1),
  })
  .superRefine((layout, ctx) => {
    const seen = new Set<string>();
    layout.sensors.forEach((s, i) => {
      if (seen.has(s.id)) ctx.addIssue({ code: 'custom', message: `duplicate sensor id ${s.id}`, path: ['sensors', i, 'id'] });
      seen.add(s.id);
      const foot = s.id.startsWith('L') ? 'left' : 'right';
      if (s.foot !== foot) ctx.addIssue({ code: 'custom', message: `${s.id} must be on the ${foot} foot`, path: ['sensors', i, 'foot'] });
    });
    for (const foot of ['left', 'right'] as const) {
      if (!layout.sensors.some((s) => s.foot === foot)) {
        ctx.addIssue({ code: 'custom', message: `no sensor on the ${foot} foot`, path: ['sensors'] });
      }
    }
  });

const columnRef = z.union([z.number().int().min(1), z.string().min(1)]);

export const importProfileSchema = z
  .strictObject({
    delimiter: z.enum([',', '\t', ';', '|', ' ']).optional(),
    header: z.boolean(),
    time: z.strictObject({ column: columnRef, unit: z.enum(['s', 'ms']) }),
    units: z.enum(['N', 'kPa']),
    sensors: z
      .record(z.string().regex(/^[LR][1-9][0-9]*$/, 'sensor id must be L<n> or R<n>'), columnRef)
      .refine((m) => Object.keys(m).length > 0, 'at least one sensor column is needed'),
    impact: columnRef.optional(),
  })
  .superRefine((p, ctx) => {
    // Column references must all be indexes (header: false) or may be names (header: true).
    const refs: [string[], number | string][] = [
      [['time', 'column'], p.time.column],
      ...Object.entries(p.sensors).map(([id, c]): [string[], number | string] => [['sensors', id], c]),
      ...(p.impact !== undefined ? [[['impact'], p.impact] as [string[], number | string]] : []),
    ];
    const used = new Map<string, string>();
    for (const [path, ref] of refs) {
      if (!p.header && typeof ref === 'string') {
        ctx.addIssue({ code: 'custom', message: 'column names need "header": true; use a 1-based index', path });
      }
      const key = String(ref);
      if (used.has(key)) ctx.addIssue({ code: 'custom', message: `column ${key} is already used by ${used.get(key)}`, path });
      used.set(key, path.join('.'));
    }
  });

function toInputError(kind: string, error: z.ZodError): SignalInputError {
  const issue = error.issues[0];
  const path = issue.path.length ? issue.path.map(String).join('.') : '(root)';
  return new SignalInputError(`bad-${kind}`, `${kind} JSON: ${path}: ${issue.message}`);
}

/** Validates a sensor layout JSON value; throws SignalInputError with the JSON path of the first problem. */
export function parseLayout(json: unknown): SensorLayout {
  const r = sensorLayoutSchema.safeParse(json);
  if (!r.success) throw toInputError('layout', r.error);
  return r.data;
}

/** Validates an import profile JSON value; throws SignalInputError with the JSON path of the first problem. */
export function parseProfile(json: unknown): ImportProfile {
  const r = importProfileSchema.safeParse(json);
  if (!r.success) throw toInputError('profile', r.error);
  return r.data;
}
