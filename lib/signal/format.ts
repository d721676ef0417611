// Output formatting of an analysis: the rounded JSON document (the analyze command and the app's API print the
// same numbers) and the per-sample series CSV.
import { EVENT_NAMES, type AnalysisResult, type DerivedSeries, type EventName } from './types';

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
      partial: s.partial,
      forward_press: s.forward_press ? { time_s: round(s.forward_press.time_s, 3), size_mm: round(s.forward_press.size_mm, 1) } : null,
      ...(s.promoted ? { promoted: s.promoted } : {}),
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
