import { z } from 'zod';

// Shots from a launch monitor's log, matched to swings: POST/GET/PATCH/DELETE /api/sessions/:id/shots,
// PATCH /api/shots/:id (pair or unpair by hand), /api/shot-profiles (a coach's saved shot profiles) and
// GET /api/athletes/:id/outcomes (+ /ranking): which pressure measures go with which results.

export const SHOT_FIELDS = ['club', 'ball_speed', 'carry', 'total', 'launch_angle', 'spin', 'offline'] as const;
export type ShotField = (typeof SHOT_FIELDS)[number];
export const OUTCOMES = ['ball_speed', 'carry', 'total', 'launch_angle', 'spin', 'offline'] as const;
export type Outcome = (typeof OUTCOMES)[number];

export const SPEED_UNITS = ['mph', 'm/s', 'km/h'] as const;
export const DISTANCE_UNITS = ['yd', 'm'] as const;
export type SpeedUnit = (typeof SPEED_UNITS)[number];
export type DistanceUnit = (typeof DISTANCE_UNITS)[number];

/** The coach's display preference; values are always stored in SI units (m/s, m, degrees, rpm). */
export const UNIT_SYSTEMS = ['metric', 'imperial'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

const header = z.string().trim().min(1, { error: 'Give the header name of the column.' }).max(120);

/** How a shot log's columns map onto ours (README "Shot logs"). Values of `columns` are the file's header names. */
export const shotProfileSchema = z.strictObject({
  delimiter: z.enum([',', ';', '\t'], { error: 'The delimiter must be a comma, a semicolon or a tab.' }).optional(),
  decimal: z.enum(['.', ','], { error: 'The decimal mark must be "." or ",".' }).optional(),
  columns: z.strictObject({
    time: header,
    club: header.optional(),
    ball_speed: header.optional(),
    carry: header.optional(),
    total: header.optional(),
    launch_angle: header.optional(),
    spin: header.optional(),
    offline: header.optional(),
  }),
  units: z
    .strictObject({
      ball_speed: z.enum(SPEED_UNITS, { error: 'Ball speed is in mph, m/s or km/h.' }).optional(),
      carry: z.enum(DISTANCE_UNITS, { error: 'Carry is in yd or m.' }).optional(),
      total: z.enum(DISTANCE_UNITS, { error: 'Total is in yd or m.' }).optional(),
      offline: z.enum(DISTANCE_UNITS, { error: 'Offline is in yd or m.' }).optional(),
      launch_angle: z.literal('deg', { error: 'Launch angle is in degrees (deg).' }).optional(),
      spin: z.literal('rpm', { error: 'Spin is in revolutions per minute (rpm).' }).optional(),
    })
    .default({}),
});
export type ShotProfile = z.infer<typeof shotProfileSchema>;

/** Our own plain layout: these header names, comma-separated, decimal point, SI units (README "Shot logs"). */
export const DEFAULT_SHOT_PROFILE: ShotProfile = {
  delimiter: ',',
  decimal: '.',
  columns: {
    time: 'shot_time',
    club: 'club',
    ball_speed: 'ball_speed_m_s',
    carry: 'carry_m',
    total: 'total_m',
    launch_angle: 'launch_deg',
    spin: 'spin_rpm',
    offline: 'offline_m',
  },
  units: { ball_speed: 'm/s', carry: 'm', total: 'm', offline: 'm', launch_angle: 'deg', spin: 'rpm' },
};

export const shotProfileInputSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'Give the profile a name.' }).max(80, { error: 'Use at most 80 characters.' }),
  profile: shotProfileSchema,
});
export const savedShotProfileSchema = z.object({ id: z.number().int(), name: z.string(), profile: shotProfileSchema });
export const shotProfilesResponseSchema = z.object({ profiles: z.array(savedShotProfileSchema) });
export const shotProfileCreatedSchema = z.object({ profile: z.object({ id: z.number().int(), name: z.string() }) });
export type SavedShotProfile = z.infer<typeof savedShotProfileSchema>;

/** 201 of POST /api/sessions/:id/shots (the names the issue fixes). */
export const shotImportResultSchema = z.object({
  imported: z.number().int(),
  matched: z.number().int(),
  unmatchedShots: z.number().int(),
  unmatchedSwings: z.number().int(),
  offsetS: z.number().nullable(),
});
export type ShotImportResult = z.infer<typeof shotImportResultSchema>;

export const shotSchema = z.object({
  id: z.number().int(),
  index: z.number().int(),
  /** seconds on the device's clock (epoch seconds when the file gave dates) */
  deviceTimeS: z.number(),
  timeText: z.string(),
  club: z.string().nullable(),
  /** SI units: m/s, m, degrees, rpm */
  ballSpeed: z.number().nullable(),
  carry: z.number().nullable(),
  total: z.number().nullable(),
  launchAngle: z.number().nullable(),
  spin: z.number().nullable(),
  offline: z.number().nullable(),
  swingId: z.number().int().nullable(),
  /** auto: paired by the offset; manual: paired by the coach; unpaired: the coach took the pairing away */
  pairing: z.enum(['auto', 'manual', 'unpaired']),
});
export type ShotView = z.infer<typeof shotSchema>;

export const pairableSwingSchema = z.object({
  id: z.number().int(),
  number: z.number().int(),
  /** the impact on the insoles' clock (epoch seconds), null without an impact */
  impactS: z.number().nullable(),
});

export const sessionShotsSchema = z.object({
  import: z
    .object({
      id: z.number().int(),
      filename: z.string(),
      status: z.enum(['ready', 'failed']),
      errorMessage: z.string().nullable(),
      createdAt: z.string(),
      offsetS: z.number().nullable(),
      autoOffsetS: z.number().nullable(),
      toleranceS: z.number(),
    })
    .nullable(),
  units: z.enum(UNIT_SYSTEMS),
  shots: z.array(shotSchema),
  swings: z.array(pairableSwingSchema),
});
export type SessionShots = z.infer<typeof sessionShotsSchema>;

/** PATCH /api/sessions/:id/shots: shift the offset by hand (re-pairs the automatic pairs) or find it again. */
export const shotOffsetPatchSchema = z.union([
  z.strictObject({ offsetS: z.number({ error: 'The offset must be a number of seconds.' }).min(-1e9).max(1e9) }),
  z.strictObject({ refind: z.literal(true) }),
]);

/** PATCH /api/me/shot-units: the units the signed-in user reads shot values in. */
export const shotUnitsInputSchema = z.strictObject({ units: z.enum(UNIT_SYSTEMS, { error: 'Units are metric or imperial.' }) });
export const shotUnitsResponseSchema = shotUnitsInputSchema;

/** PATCH /api/shots/:id: pair with a swing of the same session, or unpair (null). */
export const shotPairPatchSchema = z.strictObject({ swingId: z.number().int().positive().nullable() });

export const METRIC_IDS = [
  'lead_pct_at_address',
  'lead_pct_at_top',
  'lead_pct_at_transition',
  'lead_pct_at_impact',
  'lead_pct_at_finish',
  'trail_heel_pct_at_top',
  'lead_heel_pct_at_finish',
  'tempo_ratio',
  'backswing_s',
  'downswing_s',
  'peak_cop_speed',
  'forward_press_mm',
] as const;
export type MetricId = (typeof METRIC_IDS)[number];

const optionalDate = z.preprocess((v) => (v === '' ? undefined : v), z.iso.date({ error: 'Use the date format YYYY-MM-DD.' }).optional());

export const outcomesQuerySchema = z.strictObject({
  metric: z.enum(METRIC_IDS, { error: `metric is one of ${METRIC_IDS.join(', ')}.` }),
  outcome: z.enum(OUTCOMES, { error: `outcome is one of ${OUTCOMES.join(', ')}.` }),
  club: z.preprocess((v) => (v === '' ? undefined : v), z.string().max(40).optional()),
  from: optionalDate,
  to: optionalDate,
});
export const rankingQuerySchema = outcomesQuerySchema.omit({ metric: true });

export const outcomesResponseSchema = z.object({
  n: z.number().int(),
  r: z.number().nullable(),
  rLow: z.number().nullable(),
  rHigh: z.number().nullable(),
  rho: z.number().nullable(),
  slope: z.number().nullable(),
  intercept: z.number().nullable(),
  points: z.array(z.object({ swingId: z.number().int(), x: z.number(), y: z.number() })),
});
export type OutcomesResponse = z.infer<typeof outcomesResponseSchema>;

export const rankingResponseSchema = z.object({
  outcome: z.enum(OUTCOMES),
  club: z.string().nullable(),
  rows: z.array(
    z.object({
      metric: z.enum(METRIC_IDS),
      n: z.number().int(),
      r: z.number().nullable(),
      rLow: z.number().nullable(),
      rHigh: z.number().nullable(),
      rho: z.number().nullable(),
      p: z.number().nullable(),
      /** Benjamini-Hochberg adjusted across the metrics with a p value */
      pAdjusted: z.number().nullable(),
    }),
  ),
  /** clubs with paired shots for this player (for the picker) */
  clubs: z.array(z.string()),
});
export type RankingResponse = z.infer<typeof rankingResponseSchema>;

export const shotProfileDeletedSchema = z.object({ deleted: z.number().int() });

/** GET /api/athletes/:id/outcomes/sessions: per session, the means of the results next to key pressure measures. */
export const outcomeSessionsQuerySchema = rankingQuerySchema.omit({ outcome: true });
export const outcomeSessionsResponseSchema = z.object({
  sessions: z.array(
    z.object({
      sessionId: z.number().int(),
      date: z.string(),
      context: z.string(),
      shots: z.number().int(),
      /** means over the paired shots (SI units) and their swings; null when none has the value */
      ballSpeed: z.number().nullable(),
      carry: z.number().nullable(),
      leadPctAtImpact: z.number().nullable(),
      tempoRatio: z.number().nullable(),
    }),
  ),
});
export type OutcomeSessionsResponse = z.infer<typeof outcomeSessionsResponseSchema>;
