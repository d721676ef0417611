// Which field holds what: from a format-1 header row, or from an import profile.
import { SignalInputError } from '../errors';
import type { ImportProfile } from '../types';
import { quote } from './cells';

export interface ColumnPlan {
  /** 0-based field indexes */
  time: number;
  /** seconds per unit of the time column */
  timeScale: number;
  sensorIds: string[];
  sensors: number[];
  impact: number;
  /** exact number of fields every data row must have; null = taken from the first data row */
  fieldCount: number | null;
  /** smallest field count a row needs to hold every referenced column */
  minFields: number;
}

const SENSOR = /^[LR][1-9][0-9]*$/;

/** Format 1: `time_s`, `L<n>`/`R<n>` sensor columns, optional `impact`. Names are matched case-insensitively. */
export function planFromHeader(fields: string[], line: number): ColumnPlan {
  const names = fields.map((f) => f.trim());
  if (names[0]?.toLowerCase() !== 'time_s') {
    throw new SignalInputError('missing-header', `expected a header row starting with time_s, got ${quote(names[0] ?? '')}`, {
      line,
      column: 1,
    });
  }
  const sensorIds: string[] = [];
  const sensors: number[] = [];
  let impact = -1;
  const seen = new Set<string>();
  for (let i = 1; i < names.length; i++) {
    const name = names[i];
    const upper = name.toUpperCase();
    const where = { line, column: i + 1 };
    if (seen.has(upper)) throw new SignalInputError('duplicate-column', `column ${quote(name)} appears twice`, where);
    seen.add(upper);
    if (upper === 'IMPACT') impact = i;
    else if (SENSOR.test(upper)) {
      sensorIds.push(upper);
      sensors.push(i);
    } else if (upper === 'TIME_S') {
      throw new SignalInputError('duplicate-column', 'column "time_s" appears twice', where);
    } else {
      throw new SignalInputError(
        'unknown-column',
        `unknown column ${quote(name)}: expected time_s, L<n>, R<n> or impact`,
        where,
      );
    }
  }
  if (sensors.length === 0) throw new SignalInputError('no-sensors', 'the header names no L<n>/R<n> sensor column', { line, column: 1 });
  return { time: 0, timeScale: 1, sensorIds, sensors, impact, fieldCount: names.length, minFields: names.length };
}

/**
 * Import profile: 1-based indexes, or header names when the profile has a header (then `headerFields` is that row).
 * Sensor ids keep the profile's order sorted L before R and by number, so channels come out in a stable order.
 */
export function planFromProfile(profile: ImportProfile, headerFields: string[] | null, line: number | null): ColumnPlan {
  const names = headerFields?.map((f) => f.trim());
  const resolve = (ref: number | string, what: string): number => {
    if (typeof ref === 'number') return ref - 1;
    const i = names ? names.indexOf(ref) : -1;
    if (i < 0) {
      throw new SignalInputError('missing-column', `the header has no column ${quote(String(ref))} (import profile ${what})`, { line });
    }
    return i;
  };
  const ids = Object.keys(profile.sensors).sort(compareSensorIds);
  const sensors = ids.map((id) => resolve(profile.sensors[id], `sensors.${id}`));
  const time = resolve(profile.time.column, 'time.column');
  const impact = profile.impact !== undefined ? resolve(profile.impact, 'impact') : -1;
  const minFields = Math.max(time, impact, ...sensors) + 1;
  return {
    time,
    timeScale: profile.time.unit === 'ms' ? 1e-3 : 1,
    sensorIds: ids,
    sensors,
    impact,
    fieldCount: names ? names.length : null,
    minFields,
  };
}

/** L before R, then by sensor number: L1, L2, ..., L10, R1, ... */
export function compareSensorIds(a: string, b: string): number {
  if (a[0] !== b[0]) return a[0] < b[0] ? -1 : 1;
  return Number(a.slice(1)) - Number(b.slice(1));
}
