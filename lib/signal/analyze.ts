// The whole analysis of one recording: regularise -> derive -> find swings -> events -> phases.
// Options override the file's metadata; every result carries the processing parameters it was made with.
import { derive, DEFAULT_DERIVE, derivativeWindowFor } from './derive';
import { detectionParams, type DetectionParams } from './events';
import { atEvents, phaseRows, tempoRatio } from './phases';
import { DEFAULT_MAX_GAP_S, regularise } from './regularise';
import { sensorForceWindows, type SensorWindows } from './sensor-forces';
import { nearestIndex } from './nearest';
import { findSwings, promoteSwing, type DetectedSwing, type FindSwingsOptions, type SwingCandidate } from './swings';
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
  /** used only where the file's own metadata says nothing (e.g. the athlete's profile): options > file > these >
   *  ANALYSIS_FALLBACKS; the file is never silently overridden */
  fallback?: { handedness?: Handedness; stanceWidthMm?: number };
  /** times (s) where a coach asked for a swing the finder rejected (promoteSwing) */
  promote?: readonly number[];
  /**
   * raw's channel arrays may be reused for the regularised forces (regularise's reuseChannels), and with
   * sensorWindows false those for the derived series too (derive's consumeForces): for a caller that reads a
   * recording only to analyse it once, such as the analyze command. The results are the same.
   */
  reuseChannels?: boolean;
  /** false: no per-sensor windows (sensorWindows.forces stays empty), for a caller that does not use them */
  sensorWindows?: boolean;
}

export type ParameterSource = 'option' | 'file' | 'fallback' | 'default';

/** Where each of the golfer's parameters came from, and what the file itself said. */
export interface ParameterSources {
  handedness: { used: Handedness; source: ParameterSource; file: Handedness | null; fallback: Handedness | null };
  stanceWidthMm: { used: number; source: ParameterSource; file: number | null; fallback: number | null };
}

export interface AnalysisOutput {
  result: AnalysisResult;
  series: DerivedSeries;
  /** every candidate the swing finder looked at, accepted or with its rejection reason */
  candidates: SwingCandidate[];
  /** per-sensor filtered forces over each swing's window [start_s, end_s] (same order as result.swings; none with
   *  the sensorWindows option false) */
  sensorWindows: SensorWindows;
  parameters: ParameterSources;
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
  const metaWidth = metaNumber(meta, 'stance_width_mm');
  const pick = <T>(option: T | undefined, file: T | undefined, fallback: T | undefined, def: T): [T, ParameterSource] =>
    option !== undefined ? [option, 'option'] : file !== undefined ? [file, 'file'] : fallback !== undefined ? [fallback, 'fallback'] : [def, 'default'];
  const [handedness, handSource] = pick(opts.handedness, metaHand, opts.fallback?.handedness, ANALYSIS_FALLBACKS.handedness);
  if (handedness !== 'right' && handedness !== 'left') throw new RangeError(`handedness must be right or left, got ${handedness}`);
  const [stanceWidthMm, widthSource] = pick(opts.stanceWidthMm, metaWidth, opts.fallback?.stanceWidthMm, ANALYSIS_FALLBACKS.stanceWidthMm);
  if (!(stanceWidthMm > 0 && Number.isFinite(stanceWidthMm))) throw new RangeError(`stanceWidthMm must be a positive number, got ${stanceWidthMm}`);
  const maxGapS = opts.maxGapS ?? DEFAULT_MAX_GAP_S;
  const cutoffHz = opts.cutoffHz ?? DEFAULT_DERIVE.cutoffHz;

  const u = regularise(raw, layout, { sampleRateHz: opts.sampleRateHz, maxGapS, reuseChannels: opts.reuseChannels });
  const fs = u.sampleRateHz;
  const derivativeWindow = derivativeWindowFor(fs, DEFAULT_DERIVE.derivativeWindowS, DEFAULT_DERIVE.derivativePolyOrder);
  const series = derive(u, layout, {
    handedness,
    stanceWidthMm,
    cutoffHz,
    filterOrder: DEFAULT_DERIVE.filterOrder,
    derivativeWindow,
    derivativePolyOrder: DEFAULT_DERIVE.derivativePolyOrder,
    // the forces' memory serves the series when raw is ours to reuse and nothing reads the forces afterwards
    consumeForces: opts.reuseChannels === true && opts.sensorWindows === false,
  });
  detectionParams(stanceWidthMm, opts.detection); // validates overrides before the search
  const finderOpts = { stanceWidthMm, impact: u.impact, params: opts.detection };
  const found = findSwings(series, finderOpts);
  const { swings, candidates } = withPromoted(series, found, opts.promote ?? [], finderOpts);

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
      ...(sw.promoted ? { promoted: sw.promoted } : {}),
    };
  });

  const windows = opts.sensorWindows === false ? [] : swings.map((sw) => ({ from: sw.start, to: sw.end }));
  const sensorWindows = sensorForceWindows(u, layout, cutoffHz, DEFAULT_DERIVE.filterOrder, windows);

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
  const parameters: ParameterSources = {
    handedness: { used: handedness, source: handSource, file: metaHand ?? null, fallback: opts.fallback?.handedness ?? null },
    stanceWidthMm: { used: stanceWidthMm, source: widthSource, file: metaWidth ?? null, fallback: opts.fallback?.stanceWidthMm ?? null },
  };
  return { result, series, candidates, sensorWindows, parameters };
}

type PromotedSwing = DetectedSwing & { promoted?: 'detected' | 'placed' };

/**
 * The finder's swings plus the ones a coach asked for: each promoted time not already inside a found swing becomes a
 * swing (promoteSwing: relaxed detection, else placed events), unless it would overlap one; its candidate is then
 * marked accepted. Swings come back in time order.
 */
function withPromoted(
  series: DerivedSeries,
  found: { swings: DetectedSwing[]; candidates: SwingCandidate[] },
  promote: readonly number[],
  opts: FindSwingsOptions,
): { swings: PromotedSwing[]; candidates: SwingCandidate[] } {
  if (promote.length === 0) return found;
  const swings: PromotedSwing[] = [...found.swings];
  const candidates = found.candidates.map((c) => ({ ...c }));
  const t = series.time;
  for (const timeS of promote) {
    if (!Number.isFinite(timeS)) throw new RangeError(`promoted time must be a finite number, got ${timeS}`);
    if (timeS < t[0] || timeS > t[t.length - 1]) continue; // outside this recording's time axis
    const at = nearestIndex(t, timeS);
    if (swings.some((w) => at >= w.events.address && at <= w.events.finish)) continue;
    const p = promoteSwing(series, at, opts);
    if (swings.some((w) => p.events.address <= w.events.finish && p.events.finish >= w.events.address)) continue;
    swings.push({ ...p, promoted: p.placed ? 'placed' : 'detected' });
    for (const c of candidates) if (!c.accepted && c.peak >= p.events.top && c.peak <= p.events.finish) Object.assign(c, { accepted: true, reason: null });
  }
  swings.sort((a, b) => a.events.address - b.events.address);
  return { swings, candidates };
}

export { roundAnalysis, seriesCsvChunks, seriesToCsv, SERIES_COLUMNS, type AnalysisJson, type JsonNumbers } from './format';
