import 'server-only';
import { db } from '@/lib/db/client';
import { jsonColumn } from '@/lib/db/values';
import type { LiveLabelInput, LiveSwingEvent, LiveView } from '@/lib/contracts/live';
import { NotFoundError } from '@/lib/http';
import type { Viewer } from '@/lib/auth/viewer';
import { getBand, listBands } from '@/lib/bands/store';
import type { LiveRow } from './session';

const BAND_POINTS = 51;

/** The newest band the viewer sees that was built from this player's own swings only: its lead % curve, ~51 points. */
async function playerBand(viewer: Viewer, athleteId: number): Promise<LiveView['band']> {
  for (const b of (await listBands(viewer)).slice(0, 20)) {
    const full = await getBand(viewer, b.id);
    const owners = await db('swings as s').join('recordings as r', 'r.id', 's.recording_id').whereIn('s.id', full.swingIds).distinct('r.athlete_id').pluck('r.athlete_id');
    if (owners.length !== 1 || Number(owners[0]) !== athleteId) continue;
    const c = full.curves.leadPct;
    const pick = (a: number[]) => Array.from({ length: BAND_POINTS }, (_, i) => a[Math.round((i * (a.length - 1)) / (BAND_POINTS - 1))]).map((v) => (Number.isFinite(v) ? Math.round(v * 10) / 10 : 50));
    return { name: full.name, mean: pick(c.mean), lower: pick(c.lower), upper: pick(c.upper) };
  }
  return null;
}

type SwingRow = { id: number; number: number; result: unknown; club: string | null; strike: string | null; not_swing: number | boolean; swing_id: number | null };

function toSwing(r: SwingRow): LiveSwingEvent {
  const body = jsonColumn<Omit<LiveSwingEvent, 'swingId' | 'labels'>>(r.result)!;
  return { swingId: Number(r.id), ...body, labels: { club: (r.club as LiveSwingEvent['labels']['club']) ?? null, strike: (r.strike as LiveSwingEvent['labels']['strike']) ?? null, notSwing: Boolean(r.not_swing) } };
}

/** GET /api/live/:id: what the live page shows on first paint and after a reload. */
export async function liveView(viewer: Viewer, row: LiveRow): Promise<LiveView> {
  const athlete = await db('athletes').where({ id: row.athlete_id }).first('display_name');
  const swings = (await db('live_swings').where({ live_session_id: row.id }).orderBy('number')) as SwingRow[];
  return {
    id: Number(row.id),
    athleteId: Number(row.athlete_id),
    athleteName: athlete?.display_name ?? '',
    sessionId: Number(row.session_id),
    status: row.status,
    drillFocus: row.drill_focus,
    recordingId: row.recording_id === null ? null : Number(row.recording_id),
    swings: swings.map(toSwing),
    band: await playerBand(viewer, Number(row.athlete_id)),
  };
}

/** PATCH /api/live/:id/swings/:number: one-tap labels; after reconciliation they go to the final swing too. */
export async function labelLiveSwing(row: LiveRow, number: number, input: LiveLabelInput): Promise<LiveSwingEvent> {
  const patch: Record<string, unknown> = {};
  if (input.club !== undefined) patch.club = input.club;
  if (input.strike !== undefined) patch.strike = input.strike;
  if (input.notSwing !== undefined) patch.not_swing = input.notSwing;
  const n = await db('live_swings').where({ live_session_id: row.id, number }).update(patch);
  if (n === 0) throw new NotFoundError('No live swing with this number.');
  const r = (await db('live_swings').where({ live_session_id: row.id, number }).first()) as SwingRow;
  if (r.swing_id !== null) {
    if (input.club !== undefined || input.strike !== undefined) {
      await db('swing_labels')
        .insert({ swing_id: r.swing_id, club: r.club, strike: r.strike, tags: '[]' })
        .onConflict('swing_id')
        .merge(['club', 'strike']);
    }
    if (input.notSwing !== undefined) await db('swings').where({ id: r.swing_id }).update({ hidden: input.notSwing });
  }
  return toSwing(r);
}
