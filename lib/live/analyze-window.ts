// One live analysis step: the rolling buffer's text through the offline pipeline (parseRecording -> analyzeRecording),
// keeping only the swings whose finish has settled with enough data on both sides for the zero-lag filter.
// Pure and structured-clone-friendly (strings, numbers and plain objects in and out), so it can run on a worker
// thread: lib/live/run-window.ts is its one caller.
import { analyzeRecording, type AnalyzeOptions } from '@/lib/signal/analyze';
import { DETECTION_DEFAULTS } from '@/lib/signal/finder/params';
import { parseRecording } from '@/lib/signal/read';
import type { AtEvent, EventName, PhaseRow, SensorLayout } from '@/lib/signal/types';

export interface AnalyzeWindowInput {
  /** the stream's metadata lines and header row, with their line breaks */
  preamble: string;
  /** the data rows of the window, each ending with a line break, in time order */
  body: string;
  layout: SensorLayout;
  options: Pick<AnalyzeOptions, 'handedness' | 'stanceWidthMm' | 'cutoffHz' | 'fallback'>;
  /** swings whose impact is at or before this time (s) were published already */
  publishedUntilS: number;
  /** data needed before the address and after the finish hold for the zero-lag filter, s (see LIVE_DEFAULTS) */
  padBeforeS: number;
  padAfterS: number;
  /** true when the window starts at the stream's first sample (no padding needed before it) */
  atStreamStart: boolean;
}

export interface LiveSwing {
  events: Record<EventName, number>;
  atEvents: Record<EventName, AtEvent>;
  phases: PhaseRow[];
  tempoRatio: number;
  partial: boolean;
  impactSource: 'marker' | 'detected';
  /** the lead % from 0.5 s before address to the finish, every 20 ms: the card's small trace */
  trace: { t0: number; dt: number; leadPct: number[] };
}

export interface AnalyzeWindowOutput {
  swings: LiveSwing[];
  /** the time (s) of the window's last sample */
  lastS: number;
}

const TRACE_DT_S = 0.02;
/** two impacts closer than this are the same swing seen in two scans (window starts put the grid's times a
 *  rounding error apart); no two real swings are this close */
export const SAME_SWING_S = 0.5;

export function analyzeWindow(input: AnalyzeWindowInput): AnalyzeWindowOutput {
  const raw = parseRecording(input.preamble + input.body);
  const n = raw.time.length;
  const firstS = raw.time[0];
  const lastS = raw.time[n - 1];
  const out = analyzeRecording(raw, input.layout, input.options);
  const s = out.series;
  const swings: LiveSwing[] = [];
  for (const w of out.result.swings) {
    if (w.events.impact <= input.publishedUntilS + SAME_SWING_S) continue;
    // settled: the finish hold plus the filter's padding lie inside the buffer (the finder saw everything it needs)
    if (w.events.finish + DETECTION_DEFAULTS.settleHoldS + input.padAfterS > lastS) continue;
    if (!input.atStreamStart && w.events.address - input.padBeforeS < firstS) continue;
    const from = w.events.address - 0.5;
    const leadPct: number[] = [];
    const i0 = Math.max(0, Math.round((from - s.time[0]) * s.sampleRateHz));
    const step = Math.max(1, Math.round(TRACE_DT_S * s.sampleRateHz));
    for (let i = i0; i < s.time.length && s.time[i] <= w.events.finish; i += step) leadPct.push(Math.round(s.leadPct[i] * 10) / 10);
    swings.push({
      events: w.events,
      atEvents: w.at_events,
      phases: w.phases,
      tempoRatio: w.tempo_ratio,
      partial: w.partial,
      impactSource: w.impact_source,
      trace: { t0: s.time[i0], dt: step / s.sampleRateHz, leadPct },
    });
  }
  return { swings, lastS };
}
