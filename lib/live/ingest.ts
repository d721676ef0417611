import 'server-only';
import { db } from '@/lib/db/client';
import { BadInputAtError, PayloadTooLargeError } from '@/lib/http';
import { resolveLayout } from '@/lib/recordings/options';
import { SignalInputError } from '@/lib/signal/errors';
import { checkChunk, metadataOf } from './validate';
import { addLiveEvent, type LiveRow } from './session';
import { kickLive } from './processor';

// POST /api/live/:id/samples. Persist first: the chunk is in live_chunks (primary key: live session, sequence
// number) before the 202, so an acknowledged sample survives a crash. A repeated sequence number is ignored; a
// chunk that arrives past a missing one is stored and the gap reported to the coach's screen; the processor reads
// the chunks in sequence order and waits at a gap. A malformed chunk is refused (400, line and column from the
// start of the stream) and nothing of it is kept; the live session goes on.

export const MAX_CHUNK_BYTES = 2 * 1024 * 1024;

export function parseSeq(raw: string | null): number {
  if (raw === null || !/^\d{1,9}$/.test(raw.trim())) throw new BadInputAtError('Send X-Chunk-Seq: 0, 1, 2, … (a whole number) with every chunk.', null, null);
  return Number(raw.trim());
}

export async function acceptChunk(row: LiveRow, seq: number, text: string): Promise<{ seq: number; duplicate: boolean }> {
  const liveId = Number(row.id);
  const seen = await db('live_chunks').where({ live_session_id: liveId, seq }).first('seq');
  if (seen) return { seq, duplicate: true };

  let checked;
  if (seq === 0) {
    checked = checkChunk(text, { first: true });
    // the layout must be known before anything can be analysed: the same rule as an upload
    try {
      resolveLayout({ layout: null, profile: null, handedness: null, stanceWidthMm: null, cutoffHz: null }, metadataOf(checked.preamble ?? ''));
    } catch (error) {
      if (error instanceof SignalInputError && (error.code === 'no-layout' || error.code === 'unknown-layout')) throw new BadInputAtError(`line 1, column 1: ${error.message}`, 1, 1);
      if (!(error instanceof SignalInputError)) throw error;
    }
  } else {
    if (row.preamble === null) throw new BadInputAtError('Chunk 0 (the metadata lines and the header row) has not arrived yet; send it first.', null, null);
    const before = await db('live_chunks').where({ live_session_id: liveId }).andWhere('seq', '<', seq).sum({ n: 'line_count' }).first();
    const prev = await db('live_chunks').where({ live_session_id: liveId, seq: seq - 1 }).first('last_time_s');
    checked = checkChunk(text, {
      first: false,
      preamble: row.preamble,
      preambleLines: Number(row.preamble_lines),
      linesBefore: Number(row.preamble_lines) + Number(before?.n ?? 0),
      prevLastS: prev?.last_time_s ?? null,
    });
  }

  const maxBefore = await db('live_chunks').where({ live_session_id: liveId }).max({ m: 'seq' }).first();
  const expected = maxBefore?.m === null || maxBefore?.m === undefined ? 0 : Number(maxBefore.m) + 1;
  try {
    // the session row first (its exclusive lock orders concurrent chunks), then the chunk (whose foreign key would
    // otherwise take a shared lock on the same row first: two chunks at once deadlocked)
    await db.transaction(async (trx) => {
      const patch: Record<string, unknown> = { last_chunk_at: trx.raw('CURRENT_TIMESTAMP(3)') };
      if (checked.preamble !== null) Object.assign(patch, { preamble: checked.preamble, preamble_lines: checked.preambleLines });
      await trx('live_sessions').where({ id: liveId }).update(patch);
      await trx('live_chunks').insert({
        live_session_id: liveId,
        seq,
        body: checked.body,
        line_count: checked.lineCount,
        first_time_s: checked.firstS,
        last_time_s: checked.lastS,
      });
    });
  } catch (error) {
    if ((error as { code?: string })?.code === 'ER_DUP_ENTRY') return { seq, duplicate: true };
    throw error;
  }
  if (seq > expected) {
    const missing = Array.from({ length: Math.min(seq - expected, 1000) }, (_, k) => expected + k);
    await addLiveEvent(liveId, 'gap', { missing, at: new Date().toISOString() });
  }
  if (seq === 0) await addLiveEvent(liveId, 'status', { status: 'streaming', message: 'Insoles connected.', recordingId: null });
  kickLive(liveId);
  return { seq, duplicate: false };
}

/** The chunk's text, at most MAX_CHUNK_BYTES (413 past that). */
export async function readChunkText(request: Request): Promise<string> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^text\/(csv|plain)\b/i.test(type)) throw new BadInputAtError('Send the chunk as Content-Type: text/csv.', null, null);
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > MAX_CHUNK_BYTES) throw new PayloadTooLargeError('A chunk is limited to 2 MB; send about 100 ms of samples per chunk.');
  const buf = await request.arrayBuffer();
  if (buf.byteLength > MAX_CHUNK_BYTES) throw new PayloadTooLargeError('A chunk is limited to 2 MB; send about 100 ms of samples per chunk.');
  return new TextDecoder('utf-8', { fatal: false }).decode(buf);
}
