// Shots of a session and their pairing with swings. The functions take the knex instance (the app passes lib/db's
// client, the demo seed its own), so the demo imports shots through the very same code as an upload.
import type { Knex } from 'knex';
import { alignIntervals, pairNearest } from '@/lib/signal/align-intervals';
import type { SessionShots, ShotImportResult, ShotProfile, ShotView, UnitSystem } from '@/lib/contracts/shots';
import type { ParsedShot } from './parse';

/**
 * Largest gap between a shot (after the offset) and an impact that still pairs them, seconds. Our choice, not a
 * published value: a launch monitor stamps the shot within a fraction of a second of contact, and swings at the
 * range are tens of seconds apart, so 1.5 s leaves room for a late stamp without reaching the next swing.
 */
export const PAIR_TOLERANCE_S = 1.5;

export interface SessionImpact {
  swingId: number;
  number: number;
  /** impact on the insoles' clock, epoch seconds (recording start + impact time); null for a swing without impact */
  impactS: number | null;
}

const parseJson = (v: unknown): unknown => (typeof v === 'string' ? JSON.parse(v) : v);

/** When a recording began, epoch ms: its `# recorded_at:` metadata line, else its upload time (as lib/recordings/views). */
function recordingStartMs(row: { metadata: unknown; created_at: unknown }): number {
  const meta = (parseJson(row.metadata) as { metadata?: Record<string, unknown> } | null)?.metadata;
  const t = typeof meta?.recorded_at === 'string' ? Date.parse(meta.recorded_at) : NaN;
  return Number.isFinite(t) ? t : new Date(row.created_at as string).getTime();
}

/**
 * The session's counted swings (not hidden, not stale, recordings not in the bin) in session order, numbered 1..N as
 * the session page numbers them, with each impact on the insoles' clock.
 */
export async function sessionImpacts(knex: Knex, sessionId: number): Promise<SessionImpact[]> {
  const recordings = await knex('recordings').where({ session_id: sessionId }).whereNull('binned_at').select('id', 'metadata', 'created_at');
  const startMs = new Map(recordings.map((r) => [Number(r.id), recordingStartMs(r)]));
  const order = [...recordings].sort((a, b) => startMs.get(Number(a.id))! - startMs.get(Number(b.id))! || Number(a.id) - Number(b.id));
  const rank = new Map(order.map((r, i) => [Number(r.id), i]));
  const rows = await knex('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .leftJoin('swing_events as e', function joinImpact() {
      this.on('e.swing_id', '=', 's.id').andOnVal('e.name', '=', 'impact');
    })
    .where('r.session_id', sessionId)
    .whereNull('r.binned_at')
    .select('s.id', 's.recording_id', 's.start_s', 's.swing_index', 's.hidden', 's.stale', 'e.time_s as impact_s');
  rows.sort((a, b) => rank.get(Number(a.recording_id))! - rank.get(Number(b.recording_id))! || Number(a.start_s) - Number(b.start_s) || Number(a.swing_index) - Number(b.swing_index));
  // numbered like the session page (every swing of the session counts), then only counted swings are offered
  return rows
    .map((r, i) => ({ row: r, number: i + 1 }))
    .filter(({ row }) => !row.hidden && !row.stale)
    .map(({ row, number }) => ({
      swingId: Number(row.id),
      number,
      impactS: row.impact_s === null ? null : startMs.get(Number(row.recording_id))! / 1000 + Number(row.impact_s),
    }));
}

interface ShotRow {
  id: number;
  device_time_s: number;
  swing_id: number | null;
  pairing: 'auto' | 'manual' | 'unpaired';
}

/**
 * New automatic pairs for the shots the coach has not decided on: manual pairs keep their swing (taken out of the
 * pool), 'unpaired' shots stay unpaired, every 'auto' shot is paired afresh by nearest impact within the tolerance.
 */
export function autoPairs(shots: readonly ShotRow[], impacts: readonly SessionImpact[], offsetS: number | null): Map<number, number | null> {
  const out = new Map<number, number | null>();
  const free = shots.filter((s) => s.pairing === 'auto');
  for (const s of free) out.set(s.id, null);
  if (offsetS === null) return out;
  const taken = new Set(shots.filter((s) => s.pairing === 'manual' && s.swing_id !== null).map((s) => s.swing_id));
  const pool = impacts.filter((i) => i.impactS !== null && !taken.has(i.swingId)).sort((a, b) => a.impactS! - b.impactS!);
  const sortedFree = [...free].sort((a, b) => a.device_time_s - b.device_time_s);
  const pairs = pairNearest(
    sortedFree.map((s) => s.device_time_s),
    pool.map((i) => i.impactS!),
    offsetS,
    PAIR_TOLERANCE_S,
  );
  for (const p of pairs) out.set(sortedFree[p.a].id, pool[p.b].swingId);
  return out;
}

/** The clock offset (shot clock minus insole clock) that lines up the shots' intervals with the impacts'. */
export function findOffset(shotTimes: readonly number[], impacts: readonly SessionImpact[]): number | null {
  const times = impacts.map((i) => i.impactS).filter((t): t is number => t !== null).sort((a, b) => a - b);
  const sorted = [...shotTimes].sort((a, b) => a - b);
  return alignIntervals(sorted, times, { toleranceS: PAIR_TOLERANCE_S }).offsetS;
}

async function writePairs(trx: Knex, pairs: Map<number, number | null>): Promise<void> {
  for (const [shotId, swingId] of pairs) await trx('shots').where({ id: shotId }).update({ swing_id: swingId });
}

function counts(pairs: { swing_id: number | null }[], impacts: readonly SessionImpact[]): Pick<ShotImportResult, 'matched' | 'unmatchedShots' | 'unmatchedSwings'> {
  const matched = pairs.filter((s) => s.swing_id !== null).length;
  return { matched, unmatchedShots: pairs.length - matched, unmatchedSwings: impacts.length - matched };
}

export interface NewImport {
  sessionId: number;
  uploadedBy: number | null;
  filename: string;
  byteSize: number;
  sha256: string;
  storageKey: string;
  profile: ShotProfile;
}

/** A refused file: its row keeps the raw file's key and the reason (the raw upload is kept either way). */
export async function recordFailedImport(knex: Knex, input: NewImport, message: string): Promise<number> {
  const [id] = await knex('shot_imports').insert({
    session_id: input.sessionId,
    uploaded_by: input.uploadedBy,
    filename: input.filename,
    byte_size: input.byteSize,
    sha256: input.sha256,
    storage_key: input.storageKey,
    profile: JSON.stringify(input.profile),
    status: 'failed',
    error_message: message.slice(0, 4000),
    tolerance_s: PAIR_TOLERANCE_S,
  });
  return Number(id);
}

/**
 * Stores a parsed shot log and pairs it, all or nothing: the session's earlier imports go to the bin (restorable),
 * the new import and its shots are inserted, the offset found and the shots paired.
 */
export async function saveImport(knex: Knex, input: NewImport, shots: readonly ParsedShot[]): Promise<ShotImportResult & { importId: number }> {
  const impacts = await sessionImpacts(knex, input.sessionId);
  const offset = findOffset(
    shots.map((s) => s.deviceTimeS),
    impacts,
  );
  return knex.transaction(async (trx) => {
    await trx('shot_imports').where({ session_id: input.sessionId, status: 'ready' }).whereNull('binned_at').update({ binned_at: trx.fn.now() });
    const [importId] = await trx('shot_imports').insert({
      session_id: input.sessionId,
      uploaded_by: input.uploadedBy,
      filename: input.filename,
      byte_size: input.byteSize,
      sha256: input.sha256,
      storage_key: input.storageKey,
      profile: JSON.stringify(input.profile),
      status: 'ready',
      offset_s: offset,
      auto_offset_s: offset,
      tolerance_s: PAIR_TOLERANCE_S,
    });
    const rows = shots.map((s, i) => ({
      import_id: Number(importId),
      shot_index: i + 1,
      line: s.line,
      device_time_s: s.deviceTimeS,
      time_text: s.timeText.slice(0, 64),
      club: s.club,
      ball_speed_m_s: s.ballSpeed,
      carry_m: s.carry,
      total_m: s.total,
      launch_angle_deg: s.launchAngle,
      spin_rpm: s.spin,
      offline_m: s.offline,
      pairing: 'auto',
    }));
    for (let i = 0; i < rows.length; i += 500) await trx('shots').insert(rows.slice(i, i + 500));
    const stored: ShotRow[] = (await trx('shots').where({ import_id: Number(importId) }).select('id', 'device_time_s', 'swing_id', 'pairing')).map(shotRow);
    const pairs = autoPairs(stored, impacts, offset);
    await writePairs(trx, pairs);
    const result = counts([...pairs.values()].map((swing_id) => ({ swing_id })), impacts);
    return { importId: Number(importId), imported: shots.length, offsetS: offset, ...result };
  });
}

const shotRow = (r: Record<string, unknown>): ShotRow => ({
  id: Number(r.id),
  device_time_s: Number(r.device_time_s),
  swing_id: r.swing_id === null ? null : Number(r.swing_id),
  pairing: r.pairing as ShotRow['pairing'],
});

/** The session's import in use (the newest read file not in the bin), or null. A refused file never replaces it. */
export async function currentImport(knex: Knex, sessionId: number) {
  return knex('shot_imports').where({ session_id: sessionId, status: 'ready' }).whereNull('binned_at').orderBy('id', 'desc').first();
}

/** Sets the offset (by hand, or the one found again) and pairs the automatic shots afresh. */
export async function setOffset(knex: Knex, sessionId: number, change: { offsetS: number } | { refind: true }): Promise<ShotImportResult | null> {
  const imp = await currentImport(knex, sessionId);
  if (!imp || imp.status !== 'ready') return null;
  const impacts = await sessionImpacts(knex, sessionId);
  return knex.transaction(async (trx) => {
    const shots = (await trx('shots').where({ import_id: imp.id }).forUpdate().select('id', 'device_time_s', 'swing_id', 'pairing')).map(shotRow);
    let offset: number | null;
    if ('refind' in change) {
      offset = findOffset(shots.map((s) => s.device_time_s), impacts);
      await trx('shot_imports').where({ id: imp.id }).update({ offset_s: offset, auto_offset_s: offset });
    } else {
      offset = change.offsetS;
      await trx('shot_imports').where({ id: imp.id }).update({ offset_s: offset });
    }
    const pairs = autoPairs(shots, impacts, offset);
    await writePairs(trx, pairs);
    const after = shots.map((s) => ({ swing_id: pairs.has(s.id) ? pairs.get(s.id)! : s.swing_id }));
    return { imported: shots.length, offsetS: offset, ...counts(after, impacts) };
  });
}

/** The session a shot belongs to (null for an unknown shot or one whose import is in the bin). */
export async function sessionOfShot(knex: Knex, shotId: number): Promise<number | null> {
  const row = await knex('shots as s').join('shot_imports as i', 'i.id', 's.import_id').where('s.id', shotId).whereNull('i.binned_at').first('i.session_id');
  return row ? Number(row.session_id) : null;
}

export class PairingError extends Error {}

/** Pairs a shot with a swing of the same session by hand (that swing's other shot loses it), or unpairs it (null). */
export async function pairShot(knex: Knex, shotId: number, swingId: number | null): Promise<void> {
  await knex.transaction(async (trx) => {
    const shot = await trx('shots as s').join('shot_imports as i', 'i.id', 's.import_id').where('s.id', shotId).forUpdate().first('s.id', 's.import_id', 'i.session_id');
    if (swingId === null) {
      await trx('shots').where({ id: shotId }).update({ swing_id: null, pairing: 'unpaired' });
      return;
    }
    const impacts = await sessionImpacts(trx, Number(shot.session_id));
    if (!impacts.some((i) => i.swingId === swingId)) throw new PairingError('This swing is not a counted swing of the shot’s session.');
    await trx('shots').where({ import_id: shot.import_id, swing_id: swingId }).whereNot({ id: shotId }).update({ swing_id: null, pairing: 'unpaired' });
    await trx('shots').where({ id: shotId }).update({ swing_id: swingId, pairing: 'manual' });
  });
}

/** Everything the pairing view needs, values in SI units. */
export async function sessionShotsView(knex: Knex, sessionId: number, units: UnitSystem): Promise<SessionShots> {
  const imp = await currentImport(knex, sessionId);
  const impacts = await sessionImpacts(knex, sessionId);
  const swings = impacts.map((i) => ({ id: i.swingId, number: i.number, impactS: i.impactS }));
  if (!imp) return { import: null, units, shots: [], swings };
  const rows = await knex('shots').where({ import_id: imp.id }).orderBy('shot_index');
  const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  const shots: ShotView[] = rows.map((r) => ({
    id: Number(r.id),
    index: Number(r.shot_index),
    deviceTimeS: Number(r.device_time_s),
    timeText: r.time_text,
    club: r.club ?? null,
    ballSpeed: num(r.ball_speed_m_s),
    carry: num(r.carry_m),
    total: num(r.total_m),
    launchAngle: num(r.launch_angle_deg),
    spin: num(r.spin_rpm),
    offline: num(r.offline_m),
    swingId: num(r.swing_id),
    pairing: r.pairing,
  }));
  return {
    import: {
      id: Number(imp.id),
      filename: imp.filename,
      status: imp.status,
      errorMessage: imp.error_message ?? null,
      createdAt: new Date(imp.created_at).toISOString(),
      offsetS: num(imp.offset_s),
      autoOffsetS: num(imp.auto_offset_s),
      toleranceS: Number(imp.tolerance_s),
    },
    units,
    shots,
    swings,
  };
}

/** The bin: the session's import in use goes to the bin; the newest binned one comes back on restore. */
export async function binImport(knex: Knex, sessionId: number): Promise<boolean> {
  const imp = await currentImport(knex, sessionId);
  if (!imp) return false;
  await knex('shot_imports').where({ id: imp.id }).update({ binned_at: knex.fn.now() });
  return true;
}

export async function restoreImport(knex: Knex, sessionId: number): Promise<boolean> {
  const imp = await knex('shot_imports').where({ session_id: sessionId, status: 'ready' }).whereNotNull('binned_at').orderBy('binned_at', 'desc').orderBy('id', 'desc').first('id');
  if (!imp) return false;
  await knex.transaction(async (trx) => {
    await trx('shot_imports').where({ session_id: sessionId, status: 'ready' }).whereNull('binned_at').update({ binned_at: trx.fn.now() });
    await trx('shot_imports').where({ id: imp.id }).update({ binned_at: null });
  });
  return true;
}
