// Shared types of the signal core. Pure data: no I/O, no clock.
// Field names in snake_case mirror the public formats in the README (recording CSV, layout JSON,
// import profile JSON, analyze JSON); camelCase names are internal.

export type Foot = 'left' | 'right';
export type Handedness = 'right' | 'left';
export type Units = 'N' | 'kPa';
export type Region = 'heel' | 'toe';

/** Sensor layout JSON (README "Sensor layout"). Foot-local frame: origin heel centre, +y to toes, +x medial. */
export interface SensorSpec {
  id: string;
  foot: Foot;
  x_mm: number;
  y_mm: number;
  area_mm2: number;
  region?: Region;
}
export interface SensorLayout {
  id: string;
  name: string;
  foot_length_mm: number;
  sensors: SensorSpec[];
}

/** Import profile JSON for files that are not in recording format 1. Columns are 1-based or header names. */
export interface ImportProfile {
  delimiter?: string;
  header: boolean;
  time: { column: number | string; unit: 's' | 'ms' };
  units: Units;
  sensors: Record<string, number | string>;
  impact?: number | string;
}

/** What the reader produces: samples as read, before regularisation. */
export interface RawRecording {
  /** every `# key: value` metadata line, keys lower-cased */
  metadata: Record<string, string>;
  /** sensor ids in column order, e.g. L1..L8, R1..R8 */
  sensorIds: string[];
  units: Units;
  /** seconds, strictly increasing */
  time: Float64Array;
  /** one array per sensor id (same order as sensorIds), values as read (N or kPa); NaN = missing cell */
  channels: Float64Array[];
  /** 1 where the impact trigger fired, else 0; null when the file has no impact column */
  impact: Uint8Array | null;
  /** 1-based file line number of each sample, for error messages */
  lines: Uint32Array;
  /** 1-based file column of each sensor (same order as sensorIds), for error messages; absent when built by hand */
  sensorColumns?: number[];
  /** 1-based line of the header row, or null for a headerless import profile */
  headerLine?: number | null;
}

/** A gap in the time column or in a channel that regularisation filled or refused. */
export interface Gap {
  start_s: number;
  end_s: number;
  filled: boolean;
}

/** Uniformly sampled forces in newtons. */
export interface UniformRecording {
  sampleRateHz: number;
  /** time of sample i = t0 + i / sampleRateHz, on the recording's own time axis */
  time: Float64Array;
  sensorIds: string[];
  /** newtons per sensor, same order as sensorIds */
  forces: Float64Array[];
  /** impact marker moved onto the uniform grid (nearest sample), or null */
  impact: Uint8Array | null;
  gaps: Gap[];
}

/** Per-sample derived series. Percentages are 0..100 (NaN when the divisor force is ~0). mm in the frames of the README. */
export interface DerivedSeries {
  sampleRateHz: number;
  time: Float64Array;
  leftN: Float64Array;
  rightN: Float64Array;
  totalN: Float64Array;
  /** lead-foot force / total force x 100 (lead = left for a right-handed golfer) */
  leadPct: Float64Array;
  leadHeelPct: Float64Array;
  trailHeelPct: Float64Array;
  leadToePct: Float64Array;
  trailToePct: Float64Array;
  /** per-foot COP in the foot-local frame */
  leftCopX: Float64Array;
  leftCopY: Float64Array;
  rightCopX: Float64Array;
  rightCopY: Float64Array;
  /** combined COP in the stance frame: X toward the target (lead foot at +w/2), Y toward the toes from mid-foot */
  copX: Float64Array;
  copY: Float64Array;
  /** smoothed derivatives of copX / copY, mm/s, and speed sqrt(vx^2+vy^2) */
  copVx: Float64Array;
  copVy: Float64Array;
  copSpeed: Float64Array;
}

export interface ProcessingParams {
  handedness: Handedness;
  stance_width_mm: number;
  /** requested cutoff of the zero-lag filter (after the two-pass correction), Hz */
  cutoff_hz: number;
  /** order of the single-pass Butterworth; the zero-lag filter has twice the order */
  filter_order: number;
  /** Savitzky-Golay window (samples, odd) and polynomial order for the COP derivative */
  derivative_window: number;
  derivative_poly_order: number;
  /** longest gap (s) filled by interpolation; longer is an error */
  max_gap_s: number;
  sample_rate_hz: number;
}

/** The five swing events, in time order: the one list every enum, table column and label derives from. */
export const EVENT_NAMES = ['address', 'top', 'transition', 'impact', 'finish'] as const;
export type EventName = (typeof EVENT_NAMES)[number];

/** The four phases between consecutive events, in time order. */
export const PHASE_NAMES = ['backswing', 'transition', 'downswing', 'follow-through'] as const;
export type PhaseName = (typeof PHASE_NAMES)[number];

export const PHASES: readonly { name: PhaseName; from: EventName; to: EventName }[] = [
  { name: 'backswing', from: 'address', to: 'top' },
  { name: 'transition', from: 'top', to: 'transition' },
  { name: 'downswing', from: 'transition', to: 'impact' },
  { name: 'follow-through', from: 'impact', to: 'finish' },
];

export interface AtEvent {
  lead_pct: number;
  lead_heel_pct: number;
  trail_heel_pct: number;
  cop_x_mm: number;
  cop_y_mm: number;
}

export interface PhaseRow {
  name: PhaseName;
  from: EventName;
  to: EventName;
  duration_s: number;
  cop_path_mm: number;
  peak_cop_speed_mm_s: number;
  mean_lead_pct: number;
}

export interface SwingResult {
  index: number;
  start_s: number;
  end_s: number;
  events: Record<EventName, number>;
  impact_source: 'marker' | 'detected';
  at_events: Record<EventName, AtEvent>;
  phases: PhaseRow[];
  /** backswing duration / (transition + downswing) duration, i.e. (top-address)/(impact-top) */
  tempo_ratio: number;
  /** a swing with the shape of a full one but clearly less travel toward the lead foot (a pitch, a half swing) */
  partial: boolean;
  /** a small shift toward the lead foot right before the takeaway: its start (s) and lead-ward COP X travel (mm) */
  forward_press: { time_s: number; size_mm: number } | null;
  /** present when a coach asked for this swing: 'detected' (relaxed checks) or 'placed' (events to adjust) */
  promoted?: 'detected' | 'placed';
}

export interface AnalysisResult {
  recording: { samples: number; duration_s: number; sample_rate_hz: number; sensors: number; metadata: Record<string, string> };
  processing: ProcessingParams & { algorithm_version: string };
  gaps: Gap[];
  swings: SwingResult[];
}
