// Shapes the chart components share. Arrays are ArrayLike so both typed arrays (DerivedSeries) and plain
// number[] from JSON fit; NaN marks a missing value (no load, lifted foot).
import type { EventName } from '@/lib/signal/types';

export type NumArray = ArrayLike<number>;

/** The per-sample series the swing charts draw, all on one time axis (s). DerivedSeries fits this shape. */
export interface TraceSeries {
  time: NumArray;
  leadPct: NumArray;
  leadHeelPct: NumArray;
  trailHeelPct: NumArray;
  /** combined COP in the stance frame, mm (X toward the target, Y toward the toes from mid-foot) */
  copX: NumArray;
  copY: NumArray;
  /** mm/s */
  copSpeed: NumArray;
}

export type SwingEvents = Record<EventName, number>;

/** The swing's own time window, s: every event must stay strictly inside [startS, endS]. */
export interface TimeWindow {
  startS: number;
  endS: number;
}

/** How a line is told apart: a palette colour AND a dash pattern AND a label, never colour alone. */
export type LineTone = 'lead' | 'trail' | 'neutral';

export interface LineSpec {
  id: string;
  label: string;
  values: NumArray;
  tone: LineTone;
  /** second-swing overlay: thinner, dotted, faded */
  overlay?: boolean;
  /** time axis of this line when it differs from the chart's (overlays) */
  time?: NumArray;
}

/** Mean +- k SD band already placed on the time axis. */
export interface TimeBand {
  label: string;
  time: NumArray;
  lower: NumArray;
  upper: NumArray;
  mean?: NumArray;
}
