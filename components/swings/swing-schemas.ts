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
