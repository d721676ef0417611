import 'server-only';
import { text } from 'node:stream/consumers';
import { db } from '@/lib/db/client';
import { ConflictError } from '@/lib/http';
import { getStore } from '@/lib/storage';
import { DISTRACTORS, generateSession } from '@/lib/signal/synthetic';
import { acceptChunk } from './ingest';
import type { LiveRow } from './session';

// The "demo bridge": replays one of the student's stored demo recordings into a live session in ~100 ms chunks at
// real speed, through the same acceptChunk as the HTTP ingest, so anyone can see live mode without insoles. It
// starts a few seconds before the recording's first swing so the first card comes soon. Without a processed
// recording of the student it plays a lesson from the demo data's own generator (invented, like all demo data).

const LEAD_IN_S = 4;
const CHUNK_S = 0.1;
const globalForDemo = globalThis as typeof globalThis & { __stancelineDemoBridges?: Set<number> };
const running: Set<number> = (globalForDemo.__stancelineDemoBridges ??= new Set());

export async function startDemoBridge(row: LiveRow): Promise<{ recordingId: number | null; filename: string }> {
  if (running.has(Number(row.id))) throw new ConflictError('The demo bridge is already playing into this live session.');
  if (row.preamble !== null) throw new ConflictError('This live session already receives samples from a bridge.');
  const rec = await db('recordings')
    .where({ athlete_id: row.athlete_id, status: 'ready' })
    .whereNull('binned_at')
    .whereNot('filename', 'like', 'live-lesson-%')
    .orderBy('id')
    .first('id', 'filename', 'storage_key');
  let csv: string;
  let firstSwingS: number | null;
  let source: { recordingId: number | null; filename: string };
  if (rec) {
    const first = await db('swings').where({ recording_id: rec.id }).orderBy('start_s').first('start_s');
    csv = await text(await getStore().read(rec.storage_key));
    firstSwingS = first ? Number(first.start_s) : null;
    source = { recordingId: Number(rec.id), filename: String(rec.filename) };
  } else {
    // no processed recording of this student (a fresh database): the same generator the demo recordings come from
    const athlete = await db('athletes').where({ id: row.athlete_id }).first('handedness', 'stance_width_mm');
    const session = generateSession({
      seed: 1000 + Number(row.athlete_id),
      sampleRateHz: 100,
      sensorsPerFoot: 8,
      units: 'N',
      handedness: athlete?.handedness === 'left' ? 'left' : 'right',
      stanceWidthMm: athlete?.stance_width_mm ? Number(athlete.stance_width_mm) : 400,
      swings: 6,
      withMarker: false,
      distractors: DISTRACTORS,
    });
    csv = session.csv();
    firstSwingS = session.truth.swings[0]?.events.address ?? null;
    source = { recordingId: null, filename: 'generated demo lesson' };
  }
  const lines = csv.split('\n');
  let h = 0;
  while (h < lines.length && (lines[h].trim() === '' || lines[h].startsWith('#'))) h++;
  const preamble = lines.slice(0, h + 1).join('\n') + '\n';
  const rows = lines.slice(h + 1).filter((l) => l.trim() !== '');
  const times = rows.map((r) => Number(r.split(',')[0]));
  const from = Math.max(0, (firstSwingS ?? times[0]) - LEAD_IN_S);
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
  return source;
}
