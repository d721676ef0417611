import 'server-only';
import { text } from 'node:stream/consumers';
import { db } from '@/lib/db/client';
import { ConflictError } from '@/lib/http';
import { getStore } from '@/lib/storage';
import { acceptChunk } from './ingest';
import type { LiveRow } from './session';

// The "demo bridge": replays one of the student's stored demo recordings into a live session in ~100 ms chunks at
// real speed, through the same acceptChunk as the HTTP ingest, so anyone can see live mode without insoles. It
// starts a few seconds before the recording's first swing so the first card comes soon.

const LEAD_IN_S = 4;
const CHUNK_S = 0.1;
const globalForDemo = globalThis as typeof globalThis & { __stancelineDemoBridges?: Set<number> };
const running: Set<number> = (globalForDemo.__stancelineDemoBridges ??= new Set());

export async function startDemoBridge(row: LiveRow): Promise<{ recordingId: number; filename: string }> {
  if (running.has(Number(row.id))) throw new ConflictError('The demo bridge is already playing into this live session.');
  if (row.preamble !== null) throw new ConflictError('This live session already receives samples from a bridge.');
  const rec = await db('recordings')
    .where({ athlete_id: row.athlete_id, status: 'ready' })
    .whereNull('binned_at')
    .whereNot('filename', 'like', 'live-lesson-%')
    .orderBy('id')
    .first('id', 'filename', 'storage_key');
  const fallback = rec ?? (await db('recordings').where({ status: 'ready' }).whereNull('binned_at').whereNot('filename', 'like', 'live-lesson-%').orderBy('id').first('id', 'filename', 'storage_key'));
  if (!fallback) throw new ConflictError('No demo recording is available to replay.');
  const first = await db('swings').where({ recording_id: fallback.id }).orderBy('start_s').first('start_s');
  const csv = await text(await getStore().read(fallback.storage_key));
  const lines = csv.split('\n');
  let h = 0;
  while (h < lines.length && (lines[h].trim() === '' || lines[h].startsWith('#'))) h++;
  const preamble = lines.slice(0, h + 1).join('\n') + '\n';
  const rows = lines.slice(h + 1).filter((l) => l.trim() !== '');
  const times = rows.map((r) => Number(r.split(',')[0]));
  const from = Math.max(0, (first ? Number(first.start_s) : times[0]) - LEAD_IN_S);
  let i = times.findIndex((t) => t >= from);
  if (i < 0) i = 0;
  const liveId = Number(row.id);
  running.add(liveId);
  void (async () => {
    let seq = 0;
    const t0 = Date.now();
    const s0 = times[i];
    try {
      while (i < rows.length) {
        let j = i;
        while (j < rows.length && times[j] < times[i] + CHUNK_S - 1e-9) j++;
        const body = rows.slice(i, j).map((r) => `${r}\n`).join('');
        const wait = t0 + (times[j - 1] - s0) * 1000 - Date.now();
        if (wait > 0) await new Promise((r) => setTimeout(r, wait));
        const current = (await db('live_sessions').where({ id: liveId }).first()) as LiveRow;
        if (!current || current.status !== 'active') break;
        await acceptChunk(current, seq, seq === 0 ? preamble + body : body);
        seq++;
        i = j;
      }
    } catch (error) {
      console.error(`[stanceline live] demo bridge ${liveId}:`, error);
    } finally {
      running.delete(liveId);
    }
  })();
  return { recordingId: Number(fallback.id), filename: String(fallback.filename) };
}
