import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { ConflictError, NotFoundError } from '@/lib/http';
import { restorableUntil, withinBin } from '@/lib/sessions/store';
import { BIN_DAYS, type BinnedRef } from '@/lib/contracts/sessions';
import { requireBand, requireSwingsToUse } from '@/lib/auth/access';
import { parseStoredSeries } from '@/lib/swings/stored-series';
import { MIN_BAND_SWINGS, type BandDetail, type BandInput, type BandPatch, type BandSummary } from '@/lib/contracts/bands';
import { ZodError } from 'zod';
import { BAND_CURVES, BAND_EVENTS, BAND_POINTS, buildBand, unusableReason, type BandData, type SwingCurves } from './build';
import { jsonColumnOf } from '@/lib/db/values';

// Bands in the database. A coach builds bands from swings of athletes on their roster and sees their own bands and
// the ones shared within the academy; a student sees the bands made by their coaches (to overlay on their swings).
// Provenance kept with each band: swing ids, parameters (registration, points, curves, k), created_at.

export { MIN_BAND_SWINGS };

const nanOf = (v: number | null) => (v === null ? NaN : v);

/** Loads the registration input of the given swings; missing series or events come back with a reason. */
export async function loadSwingCurves(swingIds: number[], opts: { includePartial?: boolean } = {}): Promise<{ usable: SwingCurves[]; unusable: { id: number; reason: string }[] }> {
  const [series, events, swings] = await Promise.all([
    db('swing_series').whereIn('swing_id', swingIds).select('swing_id', 'data'),
    db('swing_events').whereIn('swing_id', swingIds).select('swing_id', 'name', 'time_s'),
    db('swings').whereIn('id', swingIds).select('id', 'hidden', 'partial'),
  ]);
  const usable: SwingCurves[] = [];
  const unusable: { id: number; reason: string }[] = [];
  for (const id of swingIds) {
    const swing = swings.find((s) => Number(s.id) === id);
    const row = series.find((s) => Number(s.swing_id) === id);
    if (!swing) unusable.push({ id, reason: 'no swing with this id' });
    else if (swing.hidden) unusable.push({ id, reason: 'it is marked "not a swing"' });
    else if (swing.partial && !opts.includePartial) unusable.push({ id, reason: 'it is a partial swing (pitch or half swing); bands leave these out' });
    else if (!row) unusable.push({ id, reason: 'its full-rate series is not stored (reprocess the recording)' });
    else {
      const stored = parseStoredSeries(row.data);
      const ev = events.filter((e) => Number(e.swing_id) === id);
      const eventTimes = BAND_EVENTS.map((name) => Number(ev.find((e) => e.name === name)?.time_s ?? NaN));
      const curves = Object.fromEntries(BAND_CURVES.map((c) => [c, Float64Array.from(stored.traces[c], nanOf)])) as unknown as SwingCurves['curves'];
      const s: SwingCurves = { id, time: Float64Array.from(stored.time), curves, eventTimes };
      const reason = unusableReason(s);
      if (reason) unusable.push({ id, reason });
      else usable.push(s);
    }
  }
  return { usable, unusable };
}

function tooFew(message: string): ZodError {
  return new ZodError([{ code: 'custom', path: ['swingIds'], message, input: undefined }]);
}

export async function createBand(viewer: Viewer, input: BandInput): Promise<{ id: number; swingCount: number }> {
  const ids = [...new Set(input.swingIds)];
  await requireSwingsToUse(viewer, ids);
  const { usable, unusable } = await loadSwingCurves(ids);
  if (usable.length < MIN_BAND_SWINGS) {
    const why = unusable.map((u) => `swing ${u.id}: ${u.reason}`).join('; ');
    throw tooFew(`A band needs at least ${MIN_BAND_SWINGS} usable swings; ${usable.length} usable of ${ids.length}${why ? ` (${why})` : ''}.`);
  }
  const data = buildBand(usable, input.k);
  const parameters = {
    registration: 'piecewise-linear landmark warp at address, top, transition, impact, finish onto 0-100 % (mean event positions)',
    points: BAND_POINTS,
    curves: BAND_CURVES,
    sd: 'sample (n - 1)',
    excluded: unusable,
  };
  const [id] = await db('bands').insert({
    academy_id: viewer.academyId,
    owner_user_id: viewer.id,
    name: input.name,
    swing_ids: JSON.stringify(usable.map((s) => s.id)),
    parameters: JSON.stringify(parameters),
    k: input.k,
    shared: input.shared,
    data: JSON.stringify(data),
  });
  return { id: Number(id), swingCount: usable.length };
}

const parse = jsonColumnOf;

function visibleQuery(viewer: Viewer) {
  const q = db('bands as b').join('users as u', 'u.id', 'b.owner_user_id').where('b.academy_id', viewer.academyId).whereNull('b.binned_at');
  if (viewer.role === 'coach') q.andWhere((w) => w.where('b.owner_user_id', viewer.id).orWhere('b.shared', true));
  else {
    const coaches = db('coach_athletes as c').join('athletes as a', 'a.id', 'c.athlete_id').where('a.user_id', viewer.id).select('c.coach_user_id');
    q.whereIn('b.owner_user_id', coaches);
  }
  return q;
}

const SUMMARY_COLUMNS = ['b.id', 'b.name', 'b.swing_ids', 'b.k', 'b.shared', 'b.created_at', 'b.owner_user_id', 'u.name as owner_name'];

export async function listBands(viewer: Viewer): Promise<BandSummary[]> {
  const rows = await visibleQuery(viewer).select(SUMMARY_COLUMNS).orderBy('b.id', 'desc');
  return rows.map(toSummary);
}

async function bandSummary(viewer: Viewer, id: number): Promise<BandSummary> {
  const row = await visibleQuery(viewer).where('b.id', id).first(SUMMARY_COLUMNS);
  if (!row) throw new NotFoundError('No band with this id.');
  return toSummary(row);
}

/** a row of SUMMARY_COLUMNS (an aliased join: knex types only plain tables) */
type SummaryRow = { id: number; name: string; swing_ids: string; k: number; shared: boolean; created_at: Date; owner_user_id: number; owner_name: string };

function toSummary(r: SummaryRow): BandSummary {
  return ({
    id: Number(r.id),
    name: r.name,
    swingCount: parse<number[]>(r.swing_ids).length,
    k: Number(r.k),
    shared: Boolean(r.shared),
    ownerUserId: Number(r.owner_user_id),
    ownerName: r.owner_name,
    createdAt: new Date(r.created_at).toISOString(),
  });
}

export interface BandView extends BandData {
  id: number;
  name: string;
  k: number;
  shared: boolean;
  swingIds: number[];
  parameters: Record<string, unknown>;
  ownerName: string;
  createdAt: string;
}

/** 404 for an unknown band and for one the viewer does not see (lib/auth/access.ts requireBand). */
export async function getBand(viewer: Viewer, id: number): Promise<BandView> {
  await requireBand(viewer, id, 'read');
  const r = await visibleQuery(viewer).where('b.id', id).first('b.*', 'u.name as owner_name');
  if (!r) throw new NotFoundError('No band with this id.');
  const data = parse<BandData>(r.data);
  const fix = (a: (number | null)[]) => a.map((v) => (v === null ? NaN : v));
  for (const c of BAND_CURVES) {
    const curve = data.curves[c];
    curve.mean = fix(curve.mean);
    curve.sd = fix(curve.sd);
    curve.lower = fix(curve.lower);
    curve.upper = fix(curve.upper);
  }
  return {
    id: Number(r.id),
    name: r.name,
    k: Number(r.k),
    shared: Boolean(r.shared),
    swingIds: parse<number[]>(r.swing_ids),
    parameters: parse(r.parameters),
    ownerName: r.owner_name,
    createdAt: new Date(r.created_at).toISOString(),
    ...data,
  };
}

/** JSON has no NaN: missing points go out as null. */
export function bandJson(b: BandView): BandDetail {
  const out = (a: number[]) => a.map((v) => (Number.isFinite(v) ? v : null));
  const curves = Object.fromEntries(BAND_CURVES.map((c) => [c, { mean: out(b.curves[c].mean), sd: out(b.curves[c].sd), lower: out(b.curves[c].lower), upper: out(b.curves[c].upper) }]));
  return { ...b, curves };
}

/** Rename, share or stop sharing: the coach who built it. */
export async function updateBand(viewer: Viewer, id: number, patch: BandPatch): Promise<BandSummary> {
  await requireBand(viewer, id, 'write');
  const columns: Record<string, unknown> = {};
  if (patch.name !== undefined) columns.name = patch.name;
  if (patch.shared !== undefined) columns.shared = patch.shared;
  await db('bands').where({ id }).update(columns);
  return bandSummary(viewer, id);
}

/** To the bin (restorable for BIN_DAYS days; the sweep removes it after that). */
export async function deleteBand(viewer: Viewer, id: number): Promise<BinnedRef> {
  await requireBand(viewer, id, 'write');
  await db('bands').where({ id }).whereNull('binned_at').update({ binned_at: db.raw('NOW(3)') });
  const row = await db('bands').where({ id }).first('id', 'name', 'binned_at');
  if (!row) throw new NotFoundError('No band with this id.');
  return { id: Number(row.id), name: row.name, binnedAt: row.binned_at ? new Date(row.binned_at).toISOString() : null, restorableUntil: restorableUntil(row.binned_at) };
}

export async function restoreBand(viewer: Viewer, id: number, now = new Date()): Promise<BandSummary> {
  await requireBand(viewer, id, 'write', { binned: true });
  const row = await db('bands').where({ id }).first('binned_at');
  if (!row || !row.binned_at) throw new NotFoundError('No band with this id in the bin.');
  if (!withinBin(row.binned_at, now)) throw new ConflictError(`This band was deleted more than ${BIN_DAYS} days ago and can no longer be restored.`);
  await db('bands').where({ id }).update({ binned_at: null });
  return bandSummary(viewer, id);
}
