// The CPU-heavy half of storing an analysis, done where the analysis ran (a job thread, lib/jobs/tasks): each swing's
// full-rate window as the JSON text of swing_series.data, its viewer parts as JSON text (columnar traces, sensor
// forces at the automatic events), the display series text, and the rejected candidates. What goes back to the
// server's event loop is a few small objects and strings, so the results transaction (lib/jobs/write-results.ts)
// only assembles text and sends statements: no per-sample work and no multi-megabyte structured clone.
// Pure: no database, no store, no clock.
import { EVENT_NAMES, type AnalysisOutput, type AnalysisResult, type ParameterSources } from '@/lib/signal';
import { seriesView, sensorFramesView } from '@/lib/swings/payload-view';
import { cutSwingSeries, nearestSample } from '@/lib/swings/stored-series';
import { displaySeries } from './display-series';

export interface PreparedWindow {
  /** swing_series.sample_rate_hz and .samples */
  sampleRateHz: number;
  samples: number;
  /** swing_series.data: the StoredSwingSeries as JSON */
  data: string;
  /** the viewer payload's `series` (columnar, display precision) as JSON */
  seriesJson: string;
  /** the viewer payload's `sensorFrames` at the automatic event times, as JSON */
  framesJson: string;
}

export interface PreparedAnalysis {
  result: AnalysisResult;
  parameters: ParameterSources;
  /** one per result swing, same order */
  windows: PreparedWindow[];
  display: { method: string; buckets: number; bucketS: number; data: string };
  /** the candidates the finder rejected (not those inside a found swing), for recording_candidates */
  rejected: { timeS: number; reason: string }[];
}

// Event times as the viewer reads them back from swing_events (a DOUBLE column) and rounds them (payload-view.ts).
const r3 = (v: number) => Math.round(v * 1000) / 1000 || 0;

export function prepareResults(out: AnalysisOutput): PreparedAnalysis {
  const t = out.series.time;
  const windows = out.result.swings.map((s, k): PreparedWindow => {
    const stored = cutSwingSeries(out.series, nearestSample(t, s.start_s), nearestSample(t, s.end_s), {
      sensorIds: out.sensorWindows.sensorIds,
      forces: out.sensorWindows.forces[k] ?? [],
    });
    const events = EVENT_NAMES.map((name) => ({ name, timeS: r3(s.events[name]) }));
    return {
      sampleRateHz: stored.sampleRateHz,
      samples: stored.time.length,
      data: JSON.stringify(stored),
      seriesJson: JSON.stringify(seriesView(stored)),
      framesJson: JSON.stringify(sensorFramesView(stored, events)),
    };
  });
  const display = displaySeries(out.series);
  return {
    result: out.result,
    parameters: out.parameters,
    windows,
    display: { method: display.method, buckets: display.buckets, bucketS: display.bucketS, data: JSON.stringify({ t: display.t, traces: display.traces }) },
    rejected: out.candidates
      .filter((c) => !c.accepted && c.reason && c.reason !== 'inside-previous-swing')
      .map((c) => ({ timeS: t[c.peak], reason: String(c.reason) })),
  };
}
