import 'server-only';
import { ZodError } from 'zod';
import { db } from '@/lib/db/client';
import { getEnv } from '@/lib/env';
import { ConflictError, NotFoundError } from '@/lib/http';
import { enqueueRecording } from '@/lib/jobs/queue';
import { wakeAppWorker } from '@/lib/jobs/start';
import type { PromoteInput } from '@/lib/contracts/recordings';

// A coach's "count this as a swing" on a candidate the finder rejected. The promotion is stored (who, when, which
// candidate and why it was rejected: the audit) and the recording is queued for analysis; every analysis from then
// on, including later reprocessing, runs event detection at that candidate with relaxed checks or, failing that,
// places the events for the coach to drag (lib/signal promoteSwing). Withdrawing deletes the row and re-analyses.

/** POST /api/recordings/:id/candidates/promote */

/** a candidate is named by its time as GET /api/recordings/:id lists it (3 decimals); this much slack, s */
const MATCH_S = 0.005;

export interface PromotionView {
  id: number;
  timeS: number;
  reason: string;
  userId: number | null;
  at: string;
}

async function queue(trx: Parameters<Parameters<typeof db.transaction>[0]>[0], recordingId: number): Promise<void> {
  await trx('recordings').where({ id: recordingId }).update({ status: 'received' });
  const waiting = await trx('processing_jobs').where({ recording_id: recordingId, state: 'queued' }).first('id');
  if (!waiting) await enqueueRecording(trx, recordingId, getEnv().JOB_MAX_ATTEMPTS);
}

export async function promoteCandidate(recordingId: number, userId: number, input: PromoteInput): Promise<{ recording: { id: number; status: 'received' }; promotion: PromotionView }> {
  const promotion = await db.transaction(async (trx) => {
    const row = await trx('recordings').where({ id: recordingId }).forUpdate().first('status');
    if (!row) throw new NotFoundError('No recording with this id.');
    if (row.status !== 'ready') throw new ConflictError('This recording is being analysed; promote a candidate once it is ready.');
    const already = await trx('candidate_promotions').where({ recording_id: recordingId }).andWhereBetween('time_s', [input.timeS - MATCH_S, input.timeS + MATCH_S]).first('id');
    if (already) throw new ConflictError('This candidate is already counted as a swing.');
    const candidate = await trx('recording_candidates')
      .where({ recording_id: recordingId })
      .andWhereBetween('time_s', [input.timeS - MATCH_S, input.timeS + MATCH_S])
      .first('time_s', 'reason');
    if (!candidate) {
      throw new ZodError([{ code: 'custom', path: ['timeS'], message: `No rejected candidate at ${input.timeS} s; GET /api/recordings/${recordingId} lists them under "candidates".`, input: input.timeS }]);
    }
    const timeS = Number(candidate.time_s);
    const [id] = await trx('candidate_promotions').insert({ recording_id: recordingId, time_s: timeS, reason: candidate.reason, user_id: userId });
    await queue(trx, recordingId);
    const saved = await trx('candidate_promotions').where({ id }).first('id', 'time_s', 'reason', 'user_id', 'at');
    return toView(saved);
  });
  wakeAppWorker();
  return { recording: { id: recordingId, status: 'received' }, promotion };
}

function toView(r: { id: number; time_s: number; reason: string; user_id: number | null; at: Date }): PromotionView {
  return { id: Number(r.id), timeS: Math.round(Number(r.time_s) * 1000) / 1000, reason: r.reason, userId: r.user_id === null ? null : Number(r.user_id), at: new Date(r.at).toISOString() };
}

export async function listPromotions(recordingId: number): Promise<PromotionView[]> {
  const rows = await db('candidate_promotions').where({ recording_id: recordingId }).orderBy('id').select('id', 'time_s', 'reason', 'user_id', 'at');
  return rows.map(toView);
}

/** Withdraws a promotion: the row goes and the recording is analysed again without it. */
export async function withdrawPromotion(recordingId: number, promotionId: number): Promise<{ recording: { id: number; status: 'received' } }> {
  await db.transaction(async (trx) => {
    await trx('recordings').where({ id: recordingId }).forUpdate().first('id');
    const deleted = await trx('candidate_promotions').where({ id: promotionId, recording_id: recordingId }).delete();
    if (!deleted) throw new NotFoundError('No such promotion on this recording.');
    await queue(trx, recordingId);
  });
  wakeAppWorker();
  return { recording: { id: recordingId, status: 'received' } };
}
