// A synthetic swing for the render tests and the screenshot script: the project's seeded generator of invented
// sessions, read and analysed by the signal core, then cut to what the viewer takes as props.
import { analyzeRecording } from '@/lib/signal/analyze';
import { parseRecording } from '@/lib/signal/read';
import { regularise } from '@/lib/signal/regularise';
import { generateSession } from '@/lib/signal/synthetic';
import { EVENT_NAMES, type EventName } from '@/lib/signal/types';
import type { SensorFrames } from '@/components/charts/stance-path-chart';
import type { SwingEvents, TraceSeries } from '@/components/charts/lib/types';

export function syntheticSwings(seed = 7, swings = 2) {
  const s = generateSession({ seed, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 400, swings, withMarker: false });
  const raw = parseRecording(s.csv());
  const { result, series } = analyzeRecording(raw, s.layout);
  const u = regularise(raw, s.layout, {});
  const traces: TraceSeries = series;
  return {
    layout: s.layout,
    series: traces,
    swings: result.swings.map((sw) => {
      const events = sw.events as SwingEvents;
      const idx = EVENT_NAMES.map((n: EventName) => Math.round((events[n] - u.time[0]) * u.sampleRateHz));
      const frames: SensorFrames = {
        timeS: idx.map((i) => u.time[i]),
        forcesN: Object.fromEntries(u.sensorIds.map((id, k) => [id, idx.map((i) => u.forces[k][i])])),
      };
      return { window: { startS: sw.start_s, endS: sw.end_s }, events, frames };
    }),
  };
}
