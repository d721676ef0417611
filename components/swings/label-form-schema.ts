// The labels form's values (strings as the controls hold them), checked by turning them into the PATCH body's
// `labels` and running the route's own schema (lib/validations/swing.ts) on that, so both sides agree.
import { z } from 'zod';
import { swingLabelsInputSchema } from '@/lib/contracts/swings';
import { clubs, flights, strikes, type SwingLabels } from '@/lib/contracts/swings';

const orNone = <T extends readonly [string, ...string[]]>(values: T) => z.union([z.enum(values), z.literal('')]);

export function splitTags(s: string): string[] {
  return [...new Set(s.split(',').map((t) => t.trim()).filter(Boolean))];
}

export const labelFormSchema = z
  .object({
    club: orNone(clubs),
    strike: orNone(strikes),
    flight: orNone(flights),
    /** comma-separated */
    tags: z.string(),
    rating: z.union([z.literal(''), z.enum(['1', '2', '3', '4', '5'])]),
    notASwing: z.boolean(),
  })
  .superRefine((v, ctx) => {
    const r = swingLabelsInputSchema.safeParse(toLabels(v));
    if (r.success) return;
    // tags.3 -> the tags field; the message names the limit
    for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', path: [String(issue.path[0] ?? 'tags')], message: issue.message });
  });

export type LabelFormValues = z.infer<typeof labelFormSchema>;

export function toFormValues(l: SwingLabels): LabelFormValues {
  return { club: l.club ?? '', strike: l.strike ?? '', flight: l.flight ?? '', tags: l.tags.join(', '), rating: l.rating ? (String(l.rating) as LabelFormValues['rating']) : '', notASwing: l.notASwing };
}

export function toLabels(v: LabelFormValues): SwingLabels {
  return {
    club: v.club || null,
    strike: v.strike || null,
    flight: v.flight || null,
    tags: splitTags(v.tags),
    rating: v.rating ? Number(v.rating) : null,
    notASwing: v.notASwing,
  };
}
