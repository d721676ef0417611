import { z } from 'zod';

// Shapes of GET /api/swings/:id (lib/db/swings.ts), checked where a client reads them.

export const eventNames = ['address', 'top', 'transition', 'impact', 'finish'] as const;
export const phaseNames = ['backswing', 'transition', 'downswing', 'follow-through'] as const;

const num = z.number().nullable();

export const swingDetailSchema = z.object({
  id: z.number().int(),
  index: z.number().int(),
  startS: z.number(),
  endS: z.number(),
  impactSource: z.enum(['marker', 'detected']),
  tempoRatio: num,
  hidden: z.boolean(),
  stale: z.boolean(),
  /** a pitch or half swing (less travel toward the lead foot than the golfer's full swings) */
  partial: z.boolean().optional(),
  /** a small shift toward the lead foot right before the takeaway */
  forwardPress: z.object({ timeS: z.number(), sizeMm: z.number() }).nullable().optional(),
  /** a coach counted this rejected candidate as a swing */
  promoted: z.enum(['detected', 'placed']).nullable().optional(),
  recording: z.object({ id: z.number().int(), filename: z.string(), algorithmVersion: z.string().nullable(), parameters: z.record(z.string(), z.unknown()) }),
  session: z.object({ id: z.number().int(), sessionDate: z.string(), context: z.enum(['lesson', 'practice', 'on-course']) }),
  athlete: z.object({ id: z.number().int(), displayName: z.string(), dateOfBirth: z.string().nullable() }),
  events: z.array(
    z.object({
      name: z.enum(eventNames),
      timeS: z.number(),
      source: z.enum(['auto', 'manual']),
      autoTimeS: num,
      misfit: z.boolean(),
      leadPct: num,
      leadHeelPct: num,
      trailHeelPct: num,
      copXMm: num,
      copYMm: num,
    }),
  ),
  phases: z.array(
    z.object({ name: z.enum(phaseNames), durationS: num, copPathMm: num, peakCopSpeedMmS: num, meanLeadPct: num }),
  ),
});

export const swingResponseSchema = z.object({ swing: swingDetailSchema });

export type SwingDetail = z.infer<typeof swingDetailSchema>;

// --- issue 5: the viewer's fields of GET/PATCH /api/swings/:id (additive; the contract in the API notes) ---

export const clubs = ['driver', 'wood', 'hybrid', 'iron-3', 'iron-4', 'iron-5', 'iron-6', 'iron-7', 'iron-8', 'iron-9', 'wedge'] as const;
export const strikes = ['solid', 'fat', 'thin', 'topped'] as const;
export const flights = ['push', 'pull', 'slice', 'hook', 'fade', 'draw', 'straight'] as const;

const nullableSeries = z.array(z.number().nullable());

export const swingLabelsSchema = z.object({
  club: z.enum(clubs).nullable(),
  strike: z.enum(strikes).nullable(),
  flight: z.enum(flights).nullable(),
  tags: z.array(z.string()),
  rating: z.number().int().min(1).max(5).nullable(),
  notASwing: z.boolean(),
});

export const annotationSchema = z.object({
  id: z.number().int(),
  authorName: z.string(),
  authorRole: z.string(),
  body: z.string(),
  timeS: z.number().nullable(),
  phase: z.enum(phaseNames).nullable(),
  visibility: z.enum(['coach', 'shared']),
  createdAt: z.string(),
  updatedAt: z.string(),
});

export const swingViewSchema = swingDetailSchema.extend({
  series: z.object({
    time: z.array(z.number()),
    leadPct: nullableSeries,
    leadHeelPct: nullableSeries,
    trailHeelPct: nullableSeries,
    copX: nullableSeries,
    copY: nullableSeries,
    copSpeed: nullableSeries,
  }),
  overview: z.object({
    time: z.array(z.number()),
    leadPct: nullableSeries,
    copX: nullableSeries,
    /** moves the swing finder looked at and did not count, with the reason in plain words */
    candidates: z.array(z.object({ timeS: z.number(), reason: z.string(), reasonText: z.string() })).optional(),
  }),
  siblings: z.object({
    previousId: z.number().int().nullable(),
    nextId: z.number().int().nullable(),
    sameAthlete: z.array(z.object({ id: z.number().int(), label: z.string() })),
  }),
  layout: z.object({
    id: z.string(),
    name: z.string(),
    foot_length_mm: z.number(),
    sensors: z.array(z.object({ id: z.string(), foot: z.enum(['left', 'right']), x_mm: z.number(), y_mm: z.number(), area_mm2: z.number(), region: z.enum(['heel', 'toe']).optional() })),
  }),
  handedness: z.enum(['right', 'left']),
  stanceWidthMm: z.number(),
  sensorFrames: z.array(z.object({ timeS: z.number(), event: z.enum(eventNames), forcesN: z.record(z.string(), z.number().nullable()) })),
  labels: swingLabelsSchema,
  annotations: z.array(annotationSchema),
  corrections: z.array(z.object({ event: z.enum(eventNames), fromS: z.number(), toS: z.number(), byName: z.string(), at: z.string(), kind: z.enum(['move', 'reset']).optional() })),
  canEdit: z.boolean(),
});

export const swingViewResponseSchema = z.object({ swing: swingViewSchema });
export const annotationResponseSchema = z.object({ annotation: annotationSchema });

export type SwingView = z.infer<typeof swingViewSchema>;
export type SwingLabels = z.infer<typeof swingLabelsSchema>;
export type Annotation = z.infer<typeof annotationSchema>;
