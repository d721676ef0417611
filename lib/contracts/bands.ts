// The bands API's contract: GET/POST /api/bands, GET/DELETE /api/bands/:id. lib/bands returns these types, the routes
// send them, the client parses them through lib/fetcher.ts; the band builder's form uses bandInputSchema.
import { z } from 'zod';
import { EVENT_NAMES, type EventName } from '@/lib/signal/types';
import { binnedRefSchema } from './sessions';

/** fewer swings say nothing about spread */
export const MIN_BAND_SWINGS = 3;

// --- request bodies ---
// POST /api/bands: a name and the swings to build from (at least 3 usable ones; fewer is a 422 from the builder).
export const bandInputSchema = z.strictObject({
  name: z.string({ error: 'Give the band a name.' }).trim().min(1, { error: 'Give the band a name.' }).max(120, { error: 'At most 120 characters.' }),
  swingIds: z.array(z.number().int().positive(), { error: 'Give swingIds as a list of swing ids.' }).min(MIN_BAND_SWINGS, { error: `A band needs at least ${MIN_BAND_SWINGS} usable swings: pick at least ${MIN_BAND_SWINGS}.` }).max(200, { error: 'At most 200 swings.' }),
  k: z.number({ error: 'k must be a number.' }).positive({ error: 'k must be above 0.' }).max(4, { error: 'k must be at most 4.' }).default(1),
  shared: z.boolean().default(false),
});
export type BandInput = z.infer<typeof bandInputSchema>;
/** PATCH /api/bands/:id: rename, share or stop sharing (the swings and k stay: build a new band for those). */
export const bandPatchSchema = z
  .strictObject({ name: bandInputSchema.shape.name.optional(), shared: z.boolean({ error: 'shared is true or false.' }).optional() })
  .refine((v) => Object.keys(v).length > 0, { error: 'Change at least one field.' });
export type BandPatch = z.infer<typeof bandPatchSchema>;

// --- responses ---
export const bandSummarySchema = z.object({
  id: z.number(),
  name: z.string(),
  swingCount: z.number(),
  k: z.number(),
  shared: z.boolean(),
  ownerUserId: z.number(),
  ownerName: z.string(),
  createdAt: z.string(),
});
export type BandSummary = z.infer<typeof bandSummarySchema>;
export const bandsResponseSchema = z.object({ bands: z.array(bandSummarySchema) });
export const bandResponseSchema = z.object({ band: bandSummarySchema });
/** DELETE /api/bands/:id: the band went to the bin; POST .../restore answers bandResponseSchema */
export const bandBinnedResponseSchema = z.object({ band: binnedRefSchema });
export const bandCreatedSchema = z.object({ id: z.number(), swingCount: z.number() });

/** JSON has no NaN: a point where no swing had a value goes out as null. */
const curvePoints = z.array(z.number().nullable());
export const bandCurvesSchema = z.object({ mean: curvePoints, sd: curvePoints, lower: curvePoints, upper: curvePoints });
/** registered curves on the 0-100 % swing axis, with each event's mean position on it */
export const bandCurveSetSchema = z.object({
  axis: z.array(z.number()),
  landmarks: z.object(Object.fromEntries(EVENT_NAMES.map((e) => [e, z.number()])) as Record<EventName, z.ZodNumber>),
  curves: z.record(z.string(), bandCurvesSchema),
});
export type BandCurveSet = z.infer<typeof bandCurveSetSchema>;
export const bandDetailSchema = z.object({
  band: bandCurveSetSchema.extend({
    id: z.number(),
    name: z.string(),
    k: z.number(),
    shared: z.boolean(),
    swingIds: z.array(z.number()),
    parameters: z.record(z.string(), z.unknown()),
    ownerName: z.string(),
    createdAt: z.string(),
  }),
});
export type BandDetail = z.infer<typeof bandDetailSchema>['band'];

/** The swings a coach can pick for a band (the band builder's list, rendered on the server): per athlete, per session. */
export interface SwingChoice {
  id: number;
  index: number;
  leadPctAtImpact: number | null;
  tempoRatio: number | null;
}
export interface SessionChoice {
  id: number;
  date: string;
  context: string;
  swings: SwingChoice[];
}
export interface AthleteChoice {
  id: number;
  displayName: string;
  sessions: SessionChoice[];
}
