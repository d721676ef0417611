import { z } from 'zod';
import { handednessValues, sessionContextValues } from './athletes';
import { CLUB_GROUPS } from './targets';

// Research: consent per player, personal API tokens, the phase-table export's cohort filters, the cohort summary
// with its preview, and the export audit. The export's own rows are CSV or JSON described by its codebook
// (lib/research/phase-table.ts), not by a zod schema: their columns depend on the shape.

// ---- consent (PUT/GET /api/athletes/:id/consent)
export const consentInputSchema = z.strictObject({
  research: z.boolean({ error: 'Say yes or no to research use.' }),
  guardianConsent: z.boolean({ error: 'Say yes or no to the guardian’s consent.' }).optional(),
});

export const consentEntrySchema = z.object({
  id: z.number().int(),
  research: z.boolean(),
  guardianConsent: z.boolean(),
  scope: z.literal('research'),
  recordedAt: z.string(),
  recordedBy: z.string().nullable(),
  recordedByRole: z.enum(['admin', 'coach', 'student']),
});

export const consentResponseSchema = z.object({
  athleteId: z.number().int(),
  research: z.boolean(),
  guardianConsent: z.boolean(),
  /** a session before the adult age, or no date of birth: a guardian's consent is needed for those sessions */
  guardianNeeded: z.boolean(),
  /** the age below which a guardian's consent is needed (a local-rule setting) */
  adultAge: z.number().int(),
  /** how many of the player's sessions a research export may hold now */
  sessionsIncluded: z.number().int(),
  sessionsTotal: z.number().int(),
  history: z.array(consentEntrySchema),
});

export type ConsentInput = z.infer<typeof consentInputSchema>;
export type ConsentResponse = z.infer<typeof consentResponseSchema>;

// ---- personal API tokens (POST/GET /api/tokens, DELETE /api/tokens/:id)
export const tokenInputSchema = z.strictObject({
  name: z.string({ error: 'Name the token.' }).trim().min(1, { error: 'Name the token.' }).max(80, { error: 'Use at most 80 characters.' }),
});
export const tokenCreatedSchema = z.object({ id: z.number().int(), token: z.string() });
export const tokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export const tokenListSchema = z.object({ tokens: z.array(tokenSchema) });
export const tokenRevokedSchema = z.object({ id: z.number().int(), revokedAt: z.string() });
export type TokenInput = z.infer<typeof tokenInputSchema>;
export type TokenCreated = z.infer<typeof tokenCreatedSchema>;
export type TokenView = z.infer<typeof tokenSchema>;

// ---- cohort filters (query string of GET /api/exports/phase-table and /api/exports/cohort)
const isoDate = z.iso.date({ error: 'Use the date format YYYY-MM-DD.' });
const optionalNumber = z.preprocess((v) => (v === '' || v === undefined ? undefined : v), z.coerce.number({ error: 'Enter a number.' }).min(0).max(100).optional());
const blankToUndefined = (v: unknown) => (v === '' ? undefined : v);

export const cohortFilterSchema = z
  .strictObject({
    clubGroup: z.preprocess(blankToUndefined, z.enum(CLUB_GROUPS, { error: 'Choose driver, woods-hybrids, irons or wedges.' }).optional()),
    context: z.preprocess(blankToUndefined, z.enum(sessionContextValues, { error: 'Choose lesson, practice or on-course.' }).optional()),
    from: z.preprocess(blankToUndefined, isoDate.optional()),
    to: z.preprocess(blankToUndefined, isoDate.optional()),
    handedness: z.preprocess(blankToUndefined, z.enum(handednessValues, { error: 'Choose right or left.' }).optional()),
    partial: z.preprocess(blankToUndefined, z.enum(['include', 'exclude', 'only'], { error: 'Choose include, exclude or only.' }).default('include')),
    algorithmVersion: z.preprocess(blankToUndefined, z.string().max(64).optional()),
    scoreMin: optionalNumber,
    scoreMax: optionalNumber,
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { path: ['to'], error: 'The end date is before the start date.' })
  .refine((f) => f.scoreMin === undefined || f.scoreMax === undefined || f.scoreMin <= f.scoreMax, { path: ['scoreMax'], error: 'The highest score is below the lowest.' });
export type CohortFilter = z.infer<typeof cohortFilterSchema>;

export const exportQuerySchema = z.strictObject({
  format: z.enum(['csv', 'json'], { error: 'format is csv or json.' }).default('csv'),
  shape: z.enum(['long', 'wide'], { error: 'shape is long or wide.' }).default('long'),
});
export type ExportQuery = z.infer<typeof exportQuerySchema>;

export const codebookQuerySchema = z.strictObject({
  format: z.enum(['csv', 'json'], { error: 'format is csv or json.' }).default('json'),
  shape: z.enum(['long', 'wide'], { error: 'shape is long or wide.' }).default('long'),
});

/** Fewer players than this in a cohort: the page says plainly that people may be recognisable (common practice). */
export const SMALL_COHORT_PLAYERS = 5;

export const codebookEntrySchema = z.object({
  column: z.string(),
  type: z.enum(['string', 'integer', 'number']),
  unit: z.string().nullable(),
  meaning: z.string(),
  computed: z.string(),
});

export const cohortSummarySchema = z.object({
  players: z.number().int(),
  swings: z.number().int(),
  rowsLong: z.number().int(),
  smallCohort: z.boolean(),
  identified: z.boolean(),
  algorithmVersions: z.array(z.string()),
  /** the first swings of the cohort in the wide shape (at most 25), for the preview table */
  preview: z.object({
    columns: z.array(z.string()),
    rows: z.array(z.record(z.string(), z.union([z.string(), z.number(), z.null()]))),
  }),
});
export type CohortSummary = z.infer<typeof cohortSummarySchema>;

export const exportAuditEntrySchema = z.object({
  id: z.number().int(),
  createdAt: z.string(),
  completedAt: z.string().nullable(),
  who: z.string().nullable(),
  role: z.string(),
  token: z.string().nullable(),
  format: z.enum(['csv', 'json']),
  shape: z.enum(['long', 'wide']),
  identified: z.boolean(),
  filters: z.record(z.string(), z.union([z.string(), z.number()])),
  players: z.number().int(),
  swings: z.number().int(),
  rows: z.number().int().nullable(),
  status: z.enum(['started', 'completed', 'failed']),
});
export const exportAuditSchema = z.object({ entries: z.array(exportAuditEntrySchema) });
export type ExportAuditEntry = z.infer<typeof exportAuditEntrySchema>;
