// The whole analysis of one recording: regularise -> derive -> find swings -> events -> phases.
// Options override the file's metadata; every result carries the processing parameters it was made with.
import { derive, DEFAULT_DERIVE, derivativeWindowFor } from './derive';
import { detectionParams, type DetectionParams } from './events';
import { atEvents, phaseRows, tempoRatio } from './phases';
import { DEFAULT_MAX_GAP_S, regularise } from './regularise';
import { sensorForceWindows, type SensorWindows } from './sensor-forces';
import { findSwings, type SwingCandidate } from './swings';
import {
  EVENT_NAMES,
  type AnalysisResult,
  type DerivedSeries,
  type EventName,
  type Handedness,
  type RawRecording,
  type SensorLayout,
  type SwingResult,
} from './types';

/** Changes whenever a default or a definition changes, so stored results can be told apart. */
export const ALGORITHM_VERSION = 'stanceline-signal/2.0.0';

/** Used when neither the options nor the file say (common practice: a shoulder-width stance, right-handed). */
export const ANALYSIS_FALLBACKS = { handedness: 'right' as Handedness, stanceWidthMm: 400 };

export interface AnalyzeOptions {
  handedness?: Handedness;
  stanceWidthMm?: number;
  cutoffHz?: number;
  sampleRateHz?: number;
  maxGapS?: number;
  detection?: Partial<DetectionParams>;
}

export interface AnalysisOutput {
  result: AnalysisResult;
  series: DerivedSeries;
  /** every candidate the swing finder looked at, accepted or with its rejection reason */
  candidates: SwingCandidate[];
  /** per-sensor filtered forces over each swing's window [start_s, end_s] (same order as result.swings) */
  sensorWindows: SensorWindows;
}

function metaNumber(meta: Record<string, string>, key: string): number | undefined {
  const v = meta[key];
  if (v === undefined) return undefined;
  const n = Number(v);
  return Number.isFinite(n) && n > 0 ? n : undefined;
}

export function analyzeRecording(raw: RawRecording, layout: SensorLayout, opts: AnalyzeOptions = {}): AnalysisOutput {
  const meta = raw.metadata;
  const metaHand = meta.handedness === 'left' || meta.handedness === 'right' ? meta.handedness : undefined;
  const handedness = opts.handedness ?? metaHand ?? ANALYSIS_FALLBACKS.handedness;
  if (handedness !== 'right' && handedness !== 'left') throw new RangeError(`handedness must be right or left, got ${handedness}`);
  const stanceWidthMm = opts.stanceWidthMm ?? metaNumber(meta, 'stance_width_mm') ?? ANALYSIS_FALLBACKS.stanceWidthMm;
  if (!(stanceWidthMm > 0 && Number.isFinite(stanceWidthMm))) throw new RangeError(`stanceWidthMm must be a positive number, got ${stanceWidthMm}`);
  const maxGapS = opts.maxGapS ?? DEFAULT_MAX_GAP_S;
  const cutoffHz = opts.cutoffHz ?? DEFAULT_DERIVE.cutoffHz;

  const u = regularise(raw, layout, { sampleRateHz: opts.sampleRateHz, maxGapS });
  const fs = u.sampleRateHz;
  const derivativeWindow = derivativeWindowFor(fs, DEFAULT_DERIVE.derivativeWindowS, DEFAULT_DERIVE.derivativePolyOrder);
  const series = derive(u, layout, {
    handedness,
    stanceWidthMm,
    cutoffHz,
    filterOrder: DEFAULT_DERIVE.filterOrder,
    derivativeWindow,
    derivativePolyOrder: DEFAULT_DERIVE.derivativePolyOrder,
  });
  detectionParams(stanceWidthMm, opts.detection); // validates overrides before the search
  const { swings, candidates } = findSwings(series, { stanceWidthMm, impact: u.impact, params: opts.detection });

  const t = series.time;
  const results: SwingResult[] = swings.map((sw, k) => {
    const events = {} as Record<EventName, number>;
    for (const name of EVENT_NAMES) events[name] = t[sw.events[name]];
    return {
      index: k + 1,
      start_s: t[sw.start],
      end_s: t[sw.end],
      events,
      impact_source: sw.impactSource,
      at_events: atEvents(series, sw.events),
      phases: phaseRows(series, sw.events),
      tempo_ratio: tempoRatio(series, sw.events),
      partial: sw.partial,
      forward_press: sw.forwardPress ? { time_s: t[sw.forwardPress.index], size_mm: sw.forwardPress.sizeMm } : null,
    };
  });

  const sensorWindows = sensorForceWindows(u, layout, cutoffHz, DEFAULT_DERIVE.filterOrder, swings.map((sw) => ({ from: sw.start, to: sw.end })));

  const n = t.length;
  const result: AnalysisResult = {
    recording: {
      samples: n,
      duration_s: n > 1 ? t[n - 1] - t[0] : 0,
      sample_rate_hz: fs,
      sensors: raw.sensorIds.length,
      metadata: { ...meta },
    },
    processing: {
      handedness,
      stance_width_mm: stanceWidthMm,
      cutoff_hz: cutoffHz,
      filter_order: DEFAULT_DERIVE.filterOrder,
      derivative_window: derivativeWindow,
      derivative_poly_order: DEFAULT_DERIVE.derivativePolyOrder,
      max_gap_s: maxGapS,
      sample_rate_hz: fs,
      algorithm_version: ALGORITHM_VERSION,
    },
    gaps: u.gaps,
    swings: results,
  };
  return { result, series, candidates, sensorWindows };
}

export { roundAnalysis, seriesCsvChunks, seriesToCsv, SERIES_COLUMNS, type AnalysisJson, type JsonNumbers } from './format';
