// A second swing drawn over this one: its time axis is shifted so that both impacts line up (impact is the event
// detected most sharply, COP-velocity half-peak or the trigger marker, so it is the steadiest anchor).
import type { SwingEvents, TraceSeries } from './types';

export interface OverlayTrace {
  label: string;
  series: TraceSeries;
  events: SwingEvents;
}

export function alignOverlay(overlay: OverlayTrace, events: SwingEvents): TraceSeries {
  const shift = events.impact - overlay.events.impact;
  if (!Number.isFinite(shift)) throw new RangeError(`overlay "${overlay.label}": both swings need a finite impact time`);
  return { ...overlay.series, time: Float64Array.from(overlay.series.time, (t) => t + shift) };
}
