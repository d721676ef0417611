import 'server-only';
import { db } from '@/lib/db/client';
import { getEnv } from '@/lib/env';
import { enqueueRecording } from '@/lib/jobs/queue';
import { wakeAppWorker } from '@/lib/jobs/start';
import type { ReprocessInput } from './fields';
import { recordingOptionsSchema, type RecordingOptions } from './options';
import { jsonColumn } from '@/lib/db/values';

/**
 * Queues a new analysis of a stored recording with changed parameters. The current results stay visible until the
 * worker replaces them in one transaction; a job still waiting in the queue simply picks up the new options.
 */
export async function requestReprocess(recordingId: number, input: ReprocessInput): Promise<{ id: number; status: 'received' }> {
  await db.transaction(async (trx) => {
    const row = await trx('recordings').where({ id: recordingId }).forUpdate().first('options');
    const current = recordingOptionsSchema.parse(jsonColumn(row.options));
    const next: RecordingOptions = recordingOptionsSchema.parse({
      layout: input.layout === undefined ? current.layout : input.layout,
      profile: input.profile === undefined ? current.profile : input.profile,
      handedness: input.handedness ?? current.handedness,
      stanceWidthMm: input.stanceWidthMm ?? current.stanceWidthMm,
      cutoffHz: input.cutoffHz === undefined ? current.cutoffHz : input.cutoffHz,
      profileHandedness: current.profileHandedness ?? null,
      profileStanceWidthMm: current.profileStanceWidthMm ?? null,
    });
    await trx('recordings').where({ id: recordingId }).update({ options: JSON.stringify(next), status: 'received' });
    const waiting = await trx('processing_jobs').where({ recording_id: recordingId, state: 'queued' }).first('id');
    if (!waiting) await enqueueRecording(trx, recordingId, getEnv().JOB_MAX_ATTEMPTS);
  });
  wakeAppWorker();
  return { id: recordingId, status: 'received' };
}
