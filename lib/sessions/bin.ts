import type { Knex } from 'knex';
import type { RawFileStore } from '@/lib/storage/types';
import { BIN_DAYS } from '@/lib/contracts/sessions';

// The sweep of the bin: sessions and recordings deleted more than BIN_DAYS days ago are removed for good, rows first
// (one transaction; the foreign keys cascade to swings, events, series, labels, notes, jobs and shots), then their raw
// files. A file left behind by a crash between the two is harmless; a row without its file would not be.

// Drills (with their assignments), bands and drill assignments binned more than BIN_DAYS days ago go in the same
// transaction; they have no files. `library` counts those rows. Shares a coach removed (shares.binned_at) go there too,
// counted in `shares` (shares of a swept session or swing cascade with it and are not counted), and so do removed swing
// notes (swing_annotations.binned_at), counted in `notes`.
export type SweepResult = { sessions: number; recordings: number; files: number; library: number; notes: number; shares: number };

export async function sweepBin(db: Knex, store: RawFileStore, now = new Date()): Promise<SweepResult> {
  const cutoff = new Date(now.getTime() - BIN_DAYS * 24 * 60 * 60 * 1000);
  const keys: string[] = [];
  const counts = await db.transaction(async (trx) => {
    const sessions = (await trx('practice_sessions').whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff).forUpdate().select('id')).map((r) => Number(r.id));
    const recordings = await trx('recordings')
      .where((q) => {
        q.where((b) => b.whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff));
        if (sessions.length > 0) q.orWhereIn('session_id', sessions);
      })
      .forUpdate()
      .select('id', 'storage_key');
    keys.push(...recordings.map((r) => String(r.storage_key)));
    // their videos: the original, the playable mp4 and the poster (rows cascade with the recording)
    if (recordings.length > 0) {
      const videos = await trx('videos').whereIn('recording_id', recordings.map((r) => Number(r.id))).select('original_key', 'playable_key', 'poster_key');
      for (const v of videos) for (const k of [v.original_key, v.playable_key, v.poster_key]) if (k) keys.push(String(k));
    }
    // shot logs: those of swept sessions (refused files included) and those binned on their own (lib/shots)
    const shotImports = await trx('shot_imports')
      .where((q) => {
        q.where((b) => b.whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff));
        if (sessions.length > 0) q.orWhereIn('session_id', sessions);
      })
      .forUpdate()
      .select('id', 'storage_key');
    keys.push(...shotImports.map((r) => String(r.storage_key)));
    // videos binned on their own (those of swept recordings were collected above and cascade with them)
    const binnedVideos = await trx('videos').whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff).forUpdate().select('id', 'original_key', 'playable_key', 'poster_key');
    for (const v of binnedVideos) for (const k of [v.original_key, v.playable_key, v.poster_key]) if (k) keys.push(String(k));
    if (binnedVideos.length > 0) await trx('videos').whereIn('id', binnedVideos.map((v) => Number(v.id))).delete();
    if (shotImports.length > 0) await trx('shot_imports').whereIn('id', shotImports.map((r) => Number(r.id))).delete();
    if (recordings.length > 0) await trx('recordings').whereIn('id', recordings.map((r) => Number(r.id))).delete();
    if (sessions.length > 0) await trx('practice_sessions').whereIn('id', sessions).delete();
    let library = 0;
    for (const table of ['drill_assignments', 'drills', 'bands'] as const) {
      library += await trx(table).whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff).delete();
    }
    const shares = await trx('shares').whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff).delete();
    const notes = await trx('swing_annotations').whereNotNull('binned_at').andWhere('binned_at', '<=', cutoff).delete();
    return { sessions: sessions.length, recordings: recordings.length, library, shares, notes };
  });
  let files = 0;
  for (const key of keys) {
    await store.remove(key);
    files += 1;
  }
  return { ...counts, files };
}
