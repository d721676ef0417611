// Processing of queued videos. The videos row is its own job: claimed with SELECT ... FOR UPDATE SKIP LOCKED (so
// several app instances never take the same video), processed with ffmpeg child processes (lib/videos/process.ts),
// results written in one update. A bad file fails with its reason and keeps its original; a failure outside the
// file (store down, ffmpeg killed) is retried up to MAX_ATTEMPTS times.
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Knex } from 'knex';
import type { RawFileStore } from '@/lib/storage/types';
import { VideoInputError } from './ffmpeg';
import { processVideoFile } from './process';

export const MAX_ATTEMPTS = 3;
/** a processing video whose heartbeat is older than this was left by a dead worker */
const LOCK_TIMEOUT_S = 120;

export async function claimVideo(db: Knex, workerId: string): Promise<{ id: number; recordingId: number; originalKey: string; attempts: number } | null> {
  return db.transaction(async (trx) => {
    const [rows] = (await trx.raw(
      `SELECT id, recording_id, original_key, attempts FROM videos
        WHERE status = 'queued' OR (status = 'processing' AND heartbeat_at < NOW(3) - INTERVAL ? SECOND)
        ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED`,
      [LOCK_TIMEOUT_S],
    )) as [{ id: number; recording_id: number; original_key: string; attempts: number }[]];
    const row = rows[0];
    if (!row) return null;
    await trx('videos').where({ id: row.id }).update({ status: 'processing', attempts: row.attempts + 1, locked_by: workerId, heartbeat_at: trx.raw('NOW(3)') });
    return { id: Number(row.id), recordingId: Number(row.recording_id), originalKey: String(row.original_key), attempts: row.attempts + 1 };
  });
}

/** The impacts of the recording's swings, recording clock, in order. */
export async function impactTimes(db: Knex, recordingId: number): Promise<number[]> {
  const rows = await db('swing_events as e').join('swings as s', 's.id', 'e.swing_id').where({ 's.recording_id': recordingId, 'e.name': 'impact' }).orderBy('e.time_s').select('e.time_s');
  return rows.map((r) => Number(r.time_s));
}

/** Claims and processes one video; null when none was due. */
export async function runOneVideo(db: Knex, store: RawFileStore, workerId: string): Promise<{ id: number; status: 'ready' | 'failed' | 'queued' } | null> {
  const job = await claimVideo(db, workerId);
  if (!job) return null;
  const dir = await mkdtemp(join(tmpdir(), 'stanceline-video-'));
  const timer = setInterval(() => void db('videos').where({ id: job.id, locked_by: workerId }).update({ heartbeat_at: db.raw('NOW(3)') }).catch(() => undefined), 20_000);
  try {
    const original = join(dir, 'original');
    await pipeline(await store.read(job.originalKey), createWriteStream(original));
    const playable = join(dir, 'playable.mp4');
    const poster = join(dir, 'poster.jpg');
    const result = await processVideoFile(original, playable, poster, await impactTimes(db, job.recordingId));
    const base = job.originalKey.replace(/\.[a-z0-9]+$/, '');
    const playableKey = `${base}.playable.mp4`;
    const posterKey = `${base}.poster.jpg`;
    const playableBytes = (await stat(playable)).size;
    await store.putFile(playableKey, playable, playableBytes);
    await store.putFile(posterKey, poster, (await stat(poster)).size);
    // A coach who already synced by hand keeps that offset when the video is processed again.
    const current = await db('videos').where({ id: job.id }).first('sync_source');
    const keepManual = current?.sync_source === 'manual';
    await db('videos')
      .where({ id: job.id, locked_by: workerId })
      .update({
        status: 'ready',
        error: null,
        locked_by: null,
        playable_key: playableKey,
        poster_key: posterKey,
        playable_bytes: playableBytes,
        fps: result.probe.fps,
        duration_s: result.probe.durationS,
        rotation: result.probe.rotation,
        width: result.probe.width,
        height: result.probe.height,
        ...(keepManual ? {} : { offset_s: result.offsetS, sync_source: result.syncSource, sync_note: result.syncNote }),
      });
    return { id: job.id, status: 'ready' };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const final = error instanceof VideoInputError || job.attempts >= MAX_ATTEMPTS;
    await db('videos')
      .where({ id: job.id })
      .update({ status: final ? 'failed' : 'queued', error: final ? message.slice(0, 500) : null, locked_by: null });
    return { id: job.id, status: final ? 'failed' : 'queued' };
  } finally {
    clearInterval(timer);
    await rm(dir, { recursive: true, force: true });
  }
}

/** Runs video jobs until none is due (tests, scripts). */
export async function drainVideos(db: Knex, store: RawFileStore, workerId = 'drain'): Promise<number> {
  let n = 0;
  while (await runOneVideo(db, store, workerId)) n++;
  return n;
}
