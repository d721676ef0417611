// A reference band (mean +- k SD) on the time axis of this swing. A band made on the registered 0-100 % swing axis
// (lib/signal/registration) is carried onto time through this swing's own event times: position p -> h^-1(p).
import { inverseLandmarkWarp } from '@/lib/signal/registration';
import { EVENT_NAMES } from '@/lib/signal/types';
import type { NumArray, SwingEvents, TimeBand } from './types';

export interface ReferenceBand {
  label: string;
  /** 'time': x holds seconds of this swing; 'swing-pct': x holds registered positions (e.g. 0-100 %) */
  axis: 'time' | 'swing-pct';
  x: NumArray;
  lower: NumArray;
  upper: NumArray;
  mean?: NumArray;
  /** registered position of each event, swing order (address..finish); needed with axis 'swing-pct' */
  landmarks?: NumArray;
}

export function bandOnTime(band: ReferenceBand, events: SwingEvents): TimeBand {
  const n = band.x.length;
  if (band.lower.length !== n || band.upper.length !== n || (band.mean && band.mean.length !== n)) {
    throw new RangeError(`reference band "${band.label}": x, lower, upper and mean must have the same length (${n})`);
  }
  if (band.axis === 'time') return { label: band.label, time: band.x, lower: band.lower, upper: band.upper, mean: band.mean };
  if (!band.landmarks || band.landmarks.length !== EVENT_NAMES.length) {
    throw new RangeError(`reference band "${band.label}": axis 'swing-pct' needs ${EVENT_NAMES.length} landmarks, one per event`);
  }
  const toTime = inverseLandmarkWarp(EVENT_NAMES.map((e) => events[e]), band.landmarks);
  const time = Float64Array.from({ length: n }, (_, i) => toTime(band.x[i]));
  return { label: band.label, time, lower: band.lower, upper: band.upper, mean: band.mean };
}
