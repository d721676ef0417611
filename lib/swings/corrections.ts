import 'server-only';
import type { Knex } from 'knex';
import { ZodError } from 'zod';
import { ConflictError } from '@/lib/http';
import { EVENT_NAMES, type EventName } from '@/lib/signal';
import { storeSwingPayload } from './payload-build';
import { recomputeSwing, type SwingNumbers } from './recompute';
import { nearestSample, parseStoredSeries } from './stored-series';

// Moving and resetting a swing's events. Each change is audited (swing_event_corrections: who, when, from, to,
// move or reset); the automatic time stays in swing_events.auto_time_s and a reset puts it back. The values at the
// events, the phase table and the tempo ratio are then recomputed from the stored full-rate window
// (lib/swings/recompute.ts), so the swing's numbers always match its current events.

export type EventChanges = { moves: Partial<Record<EventName, number>>; resets: EventName[] };

const fieldError = (path: (string | number)[], message: string) => new ZodError([{ code: 'custom', path, message, input: undefined }]);
const fmt = (s: number) => `${Math.round(s * 1000) / 1000} s`;

type EventRow = { name: EventName; time_s: number; auto_time_s: number | null; source: 'auto' | 'manual' };

/** Applies moves and resets to one swing inside `trx`; 422 naming `events.<name>` (or `resetEvents`) when the result is out of order or window. */
export async function applyEventChanges(trx: Knex.Transaction, swingId: number, userId: number, changes: EventChanges): Promise<void> {
  const movedNames = EVENT_NAMES.filter((n) => changes.moves[n] !== undefined);
  if (movedNames.length === 0 && changes.resets.length === 0) return;
  const clash = movedNames.find((n) => changes.resets.includes(n));
  if (clash) throw fieldError(['events', clash], `Move ${clash} or reset it, not both in one request.`);

  const swing = await trx('swings').where({ id: swingId }).forUpdate().first('start_s', 'end_s');
  const rows: EventRow[] = await trx('swing_events').where({ swing_id: swingId }).select('name', 'time_s', 'auto_time_s', 'source');
  const seriesRow = await trx('swing_series').where({ swing_id: swingId }).first('data');
  if (!seriesRow || rows.length !== EVENT_NAMES.length) {
    throw new ConflictError('This swing has no stored series to re-value its events from; reprocess the recording first.');
  }
  const stored = parseStoredSeries(seriesRow.data);
  const start = Number(swing.start_s);
  const end = Number(swing.end_s);
  const row = (name: EventName) => rows.find((r) => r.name === name)!;

  const times = {} as Record<EventName, number>;
  for (const name of EVENT_NAMES) times[name] = Number(row(name).time_s);
  for (const name of changes.resets) times[name] = Number(row(name).auto_time_s ?? row(name).time_s);
  for (const name of movedNames) {
    const t = changes.moves[name]!;
    if (t < start || t > end) throw fieldError(['events', name], `${name} must stay inside the swing (${fmt(start)} to ${fmt(end)}); got ${fmt(t)}.`);
    times[name] = t;
  }
  // Order, blamed on the event this request changed (else on the resets that caused it).
  const blame = (a: EventName, b: EventName): (string | number)[] =>
    changes.moves[b] !== undefined ? ['events', b] : changes.moves[a] !== undefined ? ['events', a] : ['resetEvents'];
  for (let k = 1; k < EVENT_NAMES.length; k++) {
    const a = EVENT_NAMES[k - 1];
    const b = EVENT_NAMES[k];
    if (!(times[b] > times[a])) throw fieldError(blame(a, b), `${b} (${fmt(times[b])}) must come after ${a} (${fmt(times[a])}).`);
  }
  let numbers: SwingNumbers;
  try {
    numbers = recomputeSwing(stored, times);
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    const k = EVENT_NAMES.findIndex((n, i) => i > 0 && !(nearestSample(stored.time, times[n]) > nearestSample(stored.time, times[EVENT_NAMES[i - 1]])));
    throw fieldError(blame(EVENT_NAMES[k - 1], EVENT_NAMES[k]), `${EVENT_NAMES[k]} and ${EVENT_NAMES[k - 1]} fall on the same sample; move them further apart.`);
  }

  const audit: Record<string, unknown>[] = [];
  for (const name of EVENT_NAMES) {
    const r = row(name);
    const before = Number(r.time_s);
    const isReset = changes.resets.includes(name);
    const isMove = changes.moves[name] !== undefined;
    if (!isReset && !isMove) continue;
    const after = isReset ? Number(r.auto_time_s ?? r.time_s) : numbers.times[name];
    const source = isReset ? 'auto' : 'manual';
    if (after === before && (isMove || source === r.source)) continue; // nothing changes: no audit row
    await trx('swing_events').where({ swing_id: swingId, name }).update({ time_s: after, source, misfit: false });
    audit.push({ swing_id: swingId, event: name, from_s: before, to_s: after, kind: isReset ? 'reset' : 'move', user_id: userId });
  }
  if (audit.length) await trx('swing_event_corrections').insert(audit);
  // All five are now in order and inside the swing, so no carried correction is out of place any more.
  await trx('swing_events').where({ swing_id: swingId }).update({ misfit: false });

  await trx('swing_event_values').where({ swing_id: swingId }).delete();
  await trx('swing_event_values').insert(
    EVENT_NAMES.map((name) => {
      const at = numbers.atEvents[name];
      return { swing_id: swingId, event: name, lead_pct: fin(at.lead_pct), lead_heel_pct: fin(at.lead_heel_pct), trail_heel_pct: fin(at.trail_heel_pct), cop_x_mm: fin(at.cop_x_mm), cop_y_mm: fin(at.cop_y_mm) };
    }),
  );
  await trx('swing_phase_metrics').where({ swing_id: swingId }).delete();
  await trx('swing_phase_metrics').insert(
    numbers.phases.map((p) => ({ swing_id: swingId, phase: p.name, duration_s: fin(p.duration_s), cop_path_mm: fin(p.cop_path_mm), peak_cop_speed_mm_s: fin(p.peak_cop_speed_mm_s), mean_lead_pct: fin(p.mean_lead_pct) })),
  );
  await trx('swings').where({ id: swingId }).update({ tempo_ratio: fin(numbers.tempoRatio) });
  await storeSwingPayload(trx, swingId); // the forces at the events moved with them
}

const fin = (v: number) => (Number.isFinite(v) ? v : null);

