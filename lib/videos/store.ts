import 'server-only';
// The videos table: views for the API, the list of a recording, sync updates.
import { ZodError } from 'zod';
import type { VideoBinned, VideoList, VideoPatch, VideoView } from '@/lib/contracts/videos';
import { BIN_DAYS } from '@/lib/contracts/sessions';
import { restorableUntil, withinBin } from '@/lib/sessions/store';
import { db } from '@/lib/db/client';
import { ConflictError, NotFoundError } from '@/lib/http';

export type VideoRow = {
  id: number;
  recording_id: number;
  filename: string;
  status: VideoView['status'];
  error: string | null;
  fps: number | null;
  duration_s: number | null;
  offset_s: number | null;
  sync_source: 'audio' | 'manual' | null;
  sync_note: string | null;
  playable_key: string | null;
  poster_key: string | null;
  playable_bytes: number | null;
  original_key: string;
};

const COLUMNS = ['id', 'recording_id', 'filename', 'status', 'error', 'fps', 'duration_s', 'offset_s', 'sync_source', 'sync_note', 'playable_key', 'poster_key', 'playable_bytes', 'original_key'];

/** A video row; one in the bin only with `binned: true` (the restore route), like recordings. */
export async function videoRow(id: number, opts: { binned?: boolean } = {}): Promise<VideoRow | undefined> {
  const q = db('videos').where({ id });
  const row = await (opts.binned ? q.whereNotNull('binned_at') : q.whereNull('binned_at')).first(COLUMNS);
  return row ? normalise(row) : undefined;
}

function normalise(row: Record<string, unknown>): VideoRow {
  const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  return { ...(row as VideoRow), id: Number(row.id), recording_id: Number(row.recording_id), fps: num(row.fps), duration_s: num(row.duration_s), offset_s: num(row.offset_s), playable_bytes: num(row.playable_bytes) };
}

export function toVideoView(row: VideoRow): VideoView {
  return {
    id: row.id,
    status: row.status,
    fps: row.fps,
    durationS: row.duration_s,
    offsetS: row.offset_s,
    syncSource: row.sync_source,
    posterUrl: row.poster_key ? `/api/videos/${row.id}/poster` : null,
  };
}

export async function listVideos(recordingId: number): Promise<VideoList> {
  const rows = (await db('videos').where({ recording_id: recordingId }).whereNull('binned_at').orderBy('id').select(COLUMNS)).map(normalise);
  return {
    videos: rows.map((r) => ({
      ...toVideoView(r),
      recordingId: r.recording_id,
      filename: r.filename,
      error: r.error,
      syncNote: r.sync_note,
      streamUrl: r.playable_key ? `/api/videos/${r.id}/stream` : null,
    })),
  };
}

/** PATCH: "this is impact", a frame nudge or an offset; every one of them is the coach's hand (manual). */
export async function updateSync(row: VideoRow, patch: VideoPatch): Promise<VideoView> {
  if (row.status !== 'ready') throw new ConflictError('The video is not ready yet: sync it once it has been processed.');
  let offset: number;
  if ('impact' in patch) {
    const impact = await db('swing_events as e')
      .join('swings as s', 's.id', 'e.swing_id')
      .where({ 'e.swing_id': patch.impact.swingId, 'e.name': 'impact', 's.recording_id': row.recording_id })
      .first('e.time_s');
    if (!impact) {
      throw new ZodError([{ code: 'custom', path: ['impact', 'swingId'], message: 'This swing is not in the video’s recording, or has no impact.', input: patch.impact.swingId }]);
    }
    offset = patch.impact.videoTimeS - Number(impact.time_s);
  } else if ('nudgeFrames' in patch) {
    if (row.offset_s === null) throw new ConflictError('There is no offset to nudge yet: press “This is impact” first.');
    offset = row.offset_s + patch.nudgeFrames / (row.fps ?? 30);
  } else offset = patch.offsetS;
  await db('videos').where({ id: row.id }).update({ offset_s: offset, sync_source: 'manual', sync_note: null });
  const updated = await videoRow(row.id);
  if (!updated) throw new NotFoundError('No video with this id.');
  return toVideoView(updated);
}

/** DELETE /api/videos/:id: into the bin (restorable for BIN_DAYS days; the sweep then removes its files). */
export async function binVideo(row: VideoRow): Promise<VideoBinned> {
  await db('videos').where({ id: row.id }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  const after = await db('videos').where({ id: row.id }).first('binned_at');
  return { id: row.id, binnedAt: new Date(after.binned_at).toISOString(), restorableUntil: restorableUntil(after.binned_at) };
}

/** POST /api/videos/:id/restore within BIN_DAYS days of the delete. */
export async function restoreVideo(row: VideoRow, now = new Date()): Promise<VideoView> {
  const b = await db('videos').where({ id: row.id }).first('binned_at');
  if (!b || b.binned_at === null) throw new NotFoundError('No video with this id in the bin.');
  if (!withinBin(b.binned_at, now)) throw new ConflictError(`This video was deleted more than ${BIN_DAYS} days ago and can no longer be restored.`);
  await db('videos').where({ id: row.id }).update({ binned_at: null });
  return toVideoView(row);
}
