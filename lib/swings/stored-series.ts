// The full-rate window of one swing as kept in swing_series.data (JSON): the derived traces the viewer draws and
// the ones phase metrics need, over samples [from, to] of the recording, plus the per-sensor filtered forces.
// Derived traces keep full double precision (JSON round-trips doubles exactly), so re-valuing an event at its
// automatic sample gives back exactly the analyzer's numbers. NaN (no load under a share or COP) is stored as null.
import type { DerivedSeries } from '@/lib/signal';
import { nearestIndex } from '@/lib/signal/nearest';

export const STORED_TRACES = ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copX', 'copY', 'copVx', 'copVy', 'copSpeed', 'totalN'] as const;
export type StoredTrace = (typeof STORED_TRACES)[number];

export interface StoredSwingSeries {
  sampleRateHz: number;
  time: number[];
  traces: Record<StoredTrace, (number | null)[]>;
  sensorIds: string[];
  /** per sensor (order of sensorIds), N rounded to 0.1 */
  sensorForces: number[][];
}

const toJson = (v: number) => (Number.isFinite(v) ? v : null);
const fromJson = (v: number | null) => (v === null ? NaN : v);

export function cutSwingSeries(
  series: DerivedSeries,
  from: number,
  to: number,
  sensors: { sensorIds: string[]; forces: ArrayLike<number>[] },
): StoredSwingSeries {
  if (!(Number.isInteger(from) && Number.isInteger(to) && from >= 0 && to >= from && to < series.time.length)) {
    throw new RangeError(`bad swing window ${from}..${to} for ${series.time.length} samples`);
  }
  const traces = {} as StoredSwingSeries['traces'];
  for (const name of STORED_TRACES) traces[name] = Array.from(series[name].subarray(from, to + 1), toJson);
  return {
    sampleRateHz: series.sampleRateHz,
    time: Array.from(series.time.subarray(from, to + 1)),
    traces,
    sensorIds: sensors.sensorIds,
    sensorForces: sensors.forces.map((f) => Array.from(f, (v) => Math.round(v * 10) / 10 || 0)),
  };
}

const empty = new Float64Array(0);

/**
 * The window as a DerivedSeries for lib/signal's atEvent / phaseStats / tempoRatio. Only the traces those read are
 * filled (time, shares, combined COP and its velocity, total); the per-foot arrays are left empty and must not be read.
 */
export function windowAsDerived(stored: StoredSwingSeries): DerivedSeries {
  const f = (name: StoredTrace) => Float64Array.from(stored.traces[name], fromJson);
  return {
    sampleRateHz: stored.sampleRateHz,
    time: Float64Array.from(stored.time),
    leftN: empty,
    rightN: empty,
    totalN: f('totalN'),
    leadPct: f('leadPct'),
    leadHeelPct: f('leadHeelPct'),
    trailHeelPct: f('trailHeelPct'),
    leadToePct: empty,
    trailToePct: empty,
    leftCopX: empty,
    leftCopY: empty,
    rightCopX: empty,
    rightCopY: empty,
    copX: f('copX'),
    copY: f('copY'),
    copVx: f('copVx'),
    copVy: f('copVy'),
    copSpeed: f('copSpeed'),
  };
}

/** Index of the sample nearest to `t` in a sorted time array (ties go to the earlier sample). */
export function nearestSample(time: ArrayLike<number>, t: number): number {
  if (time.length === 0) throw new RangeError('empty time axis');
  return nearestIndex(time, t);
}

export function parseStoredSeries(data: unknown): StoredSwingSeries {
  return (typeof data === 'string' ? JSON.parse(data) : data) as StoredSwingSeries;
}
