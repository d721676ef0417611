import 'server-only';
import { createHash, randomUUID } from 'node:crypto';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { db } from '@/lib/db/client';
import { LIVE_IDLE_MS } from '@/lib/contracts/live';
import { getEnv } from '@/lib/env';
import { ConflictError } from '@/lib/http';
import { enqueueRecording } from '@/lib/jobs/queue';
import { wakeAppWorker } from '@/lib/jobs/start';
import type { RecordingOptions } from '@/lib/recordings/options';
import { getStore } from '@/lib/storage';
import { releaseLive } from './processor';
import { addLiveEvent } from './session';

// Ending a live session (the coach, or 10 idle minutes): the whole stream, preamble then every stored chunk in
// sequence order, becomes a normal recording: raw CSV into storage, then the recording row, its processing job and
// the live session's end in one transaction; the usual worker analyses it. When that analysis is ready, the live
// swings are reconciled with the final ones (reconcileEnded): a live swing's labels go to the final swing at the
// same impact.

/** A live swing and a final swing are the same swing when their impacts are this close, s (two samples at 50 Hz). */
export const RECONCILE_TOLERANCE_S = 0.04;

export async function endLive(liveId: number, reason: 'coach' | 'idle'): Promise<{ recordingId: number }> {
  const live = await db('live_sessions as l').join('athletes as a', 'a.id', 'l.athlete_id').where('l.id', liveId).first('l.*', 'a.handedness as profile_handedness', 'a.stance_width_mm as profile_width');
  if (live.status === 'ended') {
    if (live.recording_id !== null) return { recordingId: Number(live.recording_id) };
    throw new ConflictError('This live session ended without samples; there is no recording.');
  }
  if (live.preamble === null) {
    if (reason === 'idle') {
      await db('live_sessions').where({ id: liveId, status: 'active' }).update({ status: 'ended', end_reason: reason, ended_at: db.raw('CURRENT_TIMESTAMP(3)') });
      await addLiveEvent(liveId, 'status', { status: 'ended', message: 'Ended after 10 idle minutes; no samples had arrived.', recordingId: null });
      await releaseLive(liveId);
    }
    throw new ConflictError('No samples have arrived yet: start the bridge first (nothing to keep).');
  }
  const chunks = await db('live_chunks').where({ live_session_id: liveId }).orderBy('seq').select('body');
  const text = live.preamble + chunks.map((c: { body: string }) => c.body).join('');
  const sha256 = createHash('sha256').update(text).digest('hex');
  const dir = join(getEnv().STORAGE_DIR, '.incoming');
  await mkdir(dir, { recursive: true });
  const spool = join(dir, `live-${liveId}-${randomUUID()}.csv`);
  await writeFile(spool, text);
  const store = getStore();
  const key = `recordings/${live.athlete_id}/${randomUUID()}`;
  const bytes = Buffer.byteLength(text);
  try {
    await store.putFile(key, spool, bytes);
  } finally {
    await rm(spool, { force: true });
  }
  const options: RecordingOptions = {
    layout: null,
    profile: null,
    handedness: null,
    stanceWidthMm: null,
    profileHandedness: live.profile_handedness ?? null,
    profileStanceWidthMm: live.profile_width ? Number(live.profile_width) : null,
    cutoffHz: null,
  };
  const outcome = await db.transaction(async (trx) => {
    const row = await trx('live_sessions').where({ id: liveId }).forUpdate().first('status', 'recording_id');
    if (row.status === 'ended') return { recordingId: Number(row.recording_id), fresh: false };
    // the same bytes already in this session (a demo replayed twice): that recording is the lesson's, as on upload
    const same = await trx('recordings').where({ session_id: live.session_id, sha256 }).first('id');
    if (same) {
      await trx('recordings').where({ id: same.id }).update({ binned_at: null });
      await trx('live_sessions').where({ id: liveId }).update({ status: 'ended', end_reason: reason, ended_at: trx.raw('CURRENT_TIMESTAMP(3)'), recording_id: same.id });
      return { recordingId: Number(same.id), fresh: false, ended: true };
    }
    const [recordingId] = await trx('recordings').insert({
      athlete_id: live.athlete_id,
      session_id: live.session_id,
      uploaded_by: live.coach_user_id,
      filename: `live-lesson-${liveId}.csv`,
      byte_size: bytes,
      sha256,
      storage_key: key,
      status: 'received',
      options: JSON.stringify(options),
    });
    await enqueueRecording(trx, Number(recordingId), getEnv().JOB_MAX_ATTEMPTS);
    await trx('live_sessions').where({ id: liveId }).update({ status: 'ended', end_reason: reason, ended_at: trx.raw('CURRENT_TIMESTAMP(3)'), recording_id: recordingId });
    return { recordingId: Number(recordingId), fresh: true };
  });
  if (!outcome.fresh) {
    await store.remove(key).catch(() => undefined);
    if ('ended' in outcome) {
      await addLiveEvent(liveId, 'status', { status: 'ended', message: 'Lesson ended; the same recording was already in this session.', recordingId: outcome.recordingId });
      await releaseLive(liveId);
    }
    return { recordingId: outcome.recordingId };
  }
  await addLiveEvent(liveId, 'status', {
    status: 'ended',
    message: reason === 'idle' ? 'Ended after 10 idle minutes; the recording is being analysed.' : 'Lesson ended; the recording is being analysed.',
    recordingId: outcome.recordingId,
  });
  await releaseLive(liveId);
  wakeAppWorker();
  return { recordingId: outcome.recordingId };
}

/** Live swings -> the final analysis's swings at the same impact: labels copied, "not a swing" hides it. */
export async function reconcileEnded(liveId: number): Promise<number> {
  const live = await db('live_sessions as l').join('recordings as r', 'r.id', 'l.recording_id').where('l.id', liveId).first('l.recording_id', 'l.coach_user_id', 'r.status', 'l.reconciled_at');
  if (!live || live.status !== 'ready' || live.reconciled_at !== null) return 0;
  const finals = await db('swings as s')
    .join('swing_events as e', function () {
      this.on('e.swing_id', '=', 's.id').andOnVal('e.name', '=', 'impact');
    })
    .where('s.recording_id', live.recording_id)
    .select('s.id', 'e.time_s');
  const lives = await db('live_swings').where({ live_session_id: liveId }).select('id', 'impact_s', 'club', 'strike', 'not_swing');
  let matched = 0;
  await db.transaction(async (trx) => {
    for (const l of lives) {
      const f = finals.find((x: { time_s: number }) => Math.abs(Number(x.time_s) - Number(l.impact_s)) <= RECONCILE_TOLERANCE_S);
      if (!f) continue;
      matched++;
      await trx('live_swings').where({ id: l.id }).update({ swing_id: f.id });
      if (l.club || l.strike) {
        await trx('swing_labels')
          .insert({ swing_id: f.id, club: l.club, strike: l.strike, tags: '[]', updated_by: live.coach_user_id })
          .onConflict('swing_id')
          .merge(['club', 'strike', 'updated_by']);
      }
      if (l.not_swing) await trx('swings').where({ id: f.id }).update({ hidden: true });
    }
    await trx('live_sessions').where({ id: liveId }).update({ reconciled_at: trx.raw('CURRENT_TIMESTAMP(3)') });
  });
  return matched;
}

const SWEEP_MS = 15_000;
const globalForSweep = globalThis as typeof globalThis & { __stancelineLiveSweep?: NodeJS.Timeout };

/** Once per SWEEP_MS on every instance: idle sessions end, orphaned buffers are taken over, ended ones reconciled. */
export async function sweepLive(kick: (id: number) => void): Promise<void> {
  const idle = await db('live_sessions')
    .where({ status: 'active' })
    .andWhere('last_chunk_at', '<', db.raw(`CURRENT_TIMESTAMP(3) - INTERVAL ${Math.round(LIVE_IDLE_MS / 1000)} SECOND`))
    .pluck('id');
  for (const id of idle) await endLive(Number(id), 'idle').catch(() => undefined);
  const orphans = await db('live_sessions as l')
    .leftJoin('live_leases as k', 'k.live_session_id', 'l.id')
    .where('l.status', 'active')
    .whereNotNull('l.preamble')
    .andWhere((w) => w.whereNull('k.owner').orWhere('k.expires_at', '<', db.raw('CURRENT_TIMESTAMP(3)')))
    .pluck('l.id');
  for (const id of orphans) kick(Number(id));
  const ended = await db('live_sessions as l').join('recordings as r', 'r.id', 'l.recording_id').where('r.status', 'ready').whereNull('l.reconciled_at').pluck('l.id');
  for (const id of ended) await reconcileEnded(Number(id));
}

export function startLiveSweeper(kick: (id: number) => void): void {
  if (globalForSweep.__stancelineLiveSweep) return;
  const run = () => void sweepLive(kick).catch((error) => console.error('[stanceline live] sweep failed', error));
  run();
  globalForSweep.__stancelineLiveSweep = setInterval(run, SWEEP_MS);
  globalForSweep.__stancelineLiveSweep.unref();
}
