// The props of TimeSeriesChart, in their own module so the chart and its layers (time-chart-layers.tsx) both import
// them without importing each other.
import type { EventName } from '@/lib/signal/types';
import type { LineSpec, NumArray, SwingEvents, TimeBand } from './lib/types';

export interface EventDragHandlers {
  onEventDragStart?: (name: EventName) => void;
  onEventDrag?: (name: EventName, t: number) => void;
  onEventDragEnd?: (name: EventName) => void;
  /** a focused marker moved by the keyboard, one sample per press */
  onEventNudge?: (name: EventName, direction: -1 | 1) => void;
}

export interface TimeSeriesChartProps extends EventDragHandlers {
  /** unique per page: used for element ids */
  id: string;
  title: string;
  /** one-sentence summary for screen readers */
  description?: string;
  time: NumArray;
  lines: LineSpec[];
  /** shared x domain, s */
  domain: [number, number];
  yDomain: [number, number];
  yTicks?: number[];
  unit: string;
  width: number;
  height: number;
  events?: SwingEvents;
  /** which markers to draw (default all five) */
  eventNames?: readonly EventName[];
  /** events to mark with a dot on the first line (e.g. the COP-velocity events) */
  emphasisEvents?: readonly EventName[];
  corrected?: Partial<Record<EventName, boolean>>;
  showEventLabels?: boolean;
  showPhases?: boolean;
  showPhaseLabels?: boolean;
  /** horizontal guides, e.g. 50 % */
  guides?: { value: number; label: string }[];
  band?: TimeBand | null;
  cursorTime?: number | null;
  /** labels of the time axis are written relative to this time (s) */
  timeZero?: number;
  showTimeAxis?: boolean;
  editable?: boolean;
  /** markers take keyboard focus (one chart per viewer, so the tab order stays short) */
  focusableMarkers?: boolean;
  draggingEvent?: EventName | null;
  onCursor?: (t: number) => void;
}
