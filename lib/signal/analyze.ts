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
export const ALGORITHM_VERSION = 'stanceline-signal/1.0.0';

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

const round = (v: number, d: number) => {
  if (!Number.isFinite(v)) return null;
  const p = 10 ** d;
  const r = Math.round(v * p) / p;
  return r === 0 ? 0 : r; // no -0 in JSON
};

/** A type with every number also allowed to be null (JSON has no NaN). */
export type JsonNumbers<T> = T extends number
  ? number | null
  : T extends (infer U)[]
    ? JsonNumbers<U>[]
    : T extends object
      ? { [K in keyof T]: JsonNumbers<T[K]> }
      : T;
export type AnalysisJson = JsonNumbers<AnalysisResult>;

/**
 * The result as written to JSON: seconds to 3 decimals, % and mm to 1, mm/s to 0, tempo to 2; NaN -> null.
 * Everything else unchanged.
 */
export function roundAnalysis(r: AnalysisResult): AnalysisJson {
  return {
    recording: { ...r.recording, duration_s: round(r.recording.duration_s, 3), sample_rate_hz: round(r.recording.sample_rate_hz, 6) },
    processing: { ...r.processing, sample_rate_hz: round(r.processing.sample_rate_hz, 6) },
    gaps: r.gaps.map((g) => ({ start_s: round(g.start_s, 3), end_s: round(g.end_s, 3), filled: g.filled })),
    swings: r.swings.map((s) => ({
      index: s.index,
      start_s: round(s.start_s, 3),
      end_s: round(s.end_s, 3),
      events: Object.fromEntries(EVENT_NAMES.map((e) => [e, round(s.events[e], 3)])) as Record<EventName, number | null>,
      impact_source: s.impact_source,
      at_events: Object.fromEntries(
        EVENT_NAMES.map((e) => {
          const a = s.at_events[e];
          return [
            e,
            {
              lead_pct: round(a.lead_pct, 1),
              lead_heel_pct: round(a.lead_heel_pct, 1),
              trail_heel_pct: round(a.trail_heel_pct, 1),
              cop_x_mm: round(a.cop_x_mm, 1),
              cop_y_mm: round(a.cop_y_mm, 1),
            },
          ];
        }),
      ) as AnalysisJson['swings'][number]['at_events'],
      phases: s.phases.map((p) => ({
        name: p.name,
        from: p.from,
        to: p.to,
        duration_s: round(p.duration_s, 3),
        cop_path_mm: round(p.cop_path_mm, 1),
        peak_cop_speed_mm_s: round(p.peak_cop_speed_mm_s, 0),
        mean_lead_pct: round(p.mean_lead_pct, 1),
      })),
      tempo_ratio: round(s.tempo_ratio, 2),
    })),
  };
}

/** Columns of the --series CSV: the README's required ones first, then extras. */
export const SERIES_COLUMNS = [
  'time_s',
  'left_n',
  'right_n',
  'lead_pct',
  'cop_x_mm',
  'cop_y_mm',
  'cop_speed_mm_s',
  'total_n',
  'lead_heel_pct',
  'trail_heel_pct',
  'cop_vx_mm_s',
  'cop_vy_mm_s',
] as const;

const cell = (v: number, d: number) => (Number.isFinite(v) ? (Math.round(v * 10 ** d) / 10 ** d).toString() : '');

/** The per-sample series as CSV text, in pieces of `rows` rows (the first piece starts with the header). */
export function* seriesCsvChunks(s: DerivedSeries, rows = 5000): Generator<string> {
  if (!(Number.isInteger(rows) && rows > 0)) throw new RangeError(`rows must be a positive integer, got ${rows}`);
  const cols: [Float64Array, number][] = [
    [s.time, 4],
    [s.leftN, 2],
    [s.rightN, 2],
    [s.leadPct, 2],
    [s.copX, 2],
    [s.copY, 2],
    [s.copSpeed, 1],
    [s.totalN, 2],
    [s.leadHeelPct, 2],
    [s.trailHeelPct, 2],
    [s.copVx, 1],
    [s.copVy, 1],
  ];
  let out = `${SERIES_COLUMNS.join(',')}\n`;
  const n = s.time.length;
  for (let i = 0; i < n; i++) {
    out += cols.map(([a, d]) => cell(a[i], d)).join(',') + '\n';
    if ((i + 1) % rows === 0) {
      yield out;
      out = '';
    }
  }
  if (out) yield out;
}

/** Empty cells stand for NaN (a share with no load under it). */
export function seriesToCsv(s: DerivedSeries): string {
  return Array.from(seriesCsvChunks(s)).join('');
}
