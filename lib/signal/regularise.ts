// From samples as read to a uniform grid in newtons: nominal rate, missing cells and short time gaps filled by
// linear interpolation, linear resampling onto t0 + i / fs, kPa turned into N, the impact marker moved to the grid.
import { SignalInputError } from './errors';
import { medianInPlace } from './select';
import type { Gap, RawRecording, SensorLayout, UniformRecording } from './types';

/** Longest stretch (s) filled by interpolation: 0.1 s is 10 samples at 100 Hz, shorter than any swing phase. */
export const DEFAULT_MAX_GAP_S = 0.1;
/** Metadata sample_rate_hz is used only when it is within 2 % of the rate the time column shows. */
export const RATE_TOLERANCE = 0.02;
/** 1 kPa = 0.001 N/mm^2, so force (N) = pressure (kPa) x area (mm^2) x 0.001. */
export const KPA_MM2_TO_N = 0.001;

const EPS = 1e-9;

export interface NominalRate {
  hz: number;
  source: 'option' | 'metadata' | 'time-column';
}

/** Median of the time steps (s). `scratch`: an array of at least time.length - 1 values to work in (else a new one). */
export function medianStep(time: Float64Array, scratch?: Float64Array): number {
  if (time.length < 2) throw new RangeError('need at least two time values');
  const steps = scratch && scratch.length >= time.length - 1 ? scratch.subarray(0, time.length - 1) : new Float64Array(time.length - 1);
  for (let i = 1; i < time.length; i++) steps[i - 1] = time[i] - time[i - 1];
  return medianInPlace(steps);
}

/**
 * Nominal rate: the option, else the metadata value when it agrees with the time column to 2 %, else the time
 * column's median step (the spec: the time column rules). A median rate within 1e-6 of an integer is snapped to it,
 * so printed times like 0.0100 give exactly 100 Hz.
 */
export function nominalRate(raw: RawRecording, sampleRateHz?: number, scratch?: Float64Array): NominalRate {
  if (sampleRateHz !== undefined) {
    if (!(Number.isFinite(sampleRateHz) && sampleRateHz > 0)) {
      throw new RangeError(`sampleRateHz must be a positive number, got ${sampleRateHz}`);
    }
    return { hz: sampleRateHz, source: 'option' };
  }
  let fromTime = 1 / medianStep(raw.time, scratch);
  const rounded = Math.round(fromTime);
  if (rounded > 0 && Math.abs(fromTime - rounded) <= 1e-6 * fromTime) fromTime = rounded;
  const meta = raw.metadata.sample_rate_hz !== undefined ? Number(raw.metadata.sample_rate_hz) : NaN;
  if (meta > 0 && Math.abs(meta - fromTime) <= RATE_TOLERANCE * fromTime) return { hz: meta, source: 'metadata' };
  return { hz: fromTime, source: 'time-column' };
}

function checkSensors(raw: RawRecording, layout: SensorLayout): void {
  const known = new Set(layout.sensors.map((s) => s.id));
  raw.sensorIds.forEach((id, i) => {
    if (!known.has(id)) {
      throw new SignalInputError('sensor-not-in-layout', `column ${id} is not a sensor of layout "${layout.id}"`, {
        line: raw.headerLine ?? null,
        column: raw.sensorColumns?.[i] ?? null,
      });
    }
  });
  const present = new Set(raw.sensorIds);
  const missing = layout.sensors.filter((s) => !present.has(s.id)).map((s) => s.id);
  if (missing.length) {
    throw new SignalInputError('sensor-missing', `layout "${layout.id}" has sensors the file lacks: ${missing.join(', ')}`, {
      line: raw.headerLine ?? null,
      column: raw.headerLine != null ? 1 : null, // the header row as a whole lacks them
    });
  }
}

/**
 * One channel with its NaN runs linearly interpolated in time (a copy; the channel itself when it has none, as it is
 * only read); pushes each filled run onto `gaps`.
 */
function fillChannel(raw: RawRecording, c: number, maxGapS: number, gaps: Gap[]): Float64Array {
  const { time, lines } = raw;
  const channel = raw.channels[c];
  let i = 0;
  const n = channel.length;
  while (i < n && channel[i] === channel[i]) i++;
  if (i === n) return channel;
  const x = channel.slice();
  while (i < n) {
    if (!Number.isNaN(x[i])) {
      i++;
      continue;
    }
    const first = i;
    while (i < n && Number.isNaN(x[i])) i++;
    const a = first - 1; // last valid before the run, or -1
    const b = i; // first valid after the run, or n
    if (a < 0 && b >= n) {
      throw new SignalInputError('channel-empty', `sensor ${raw.sensorIds[c]} has no values`, {
        line: lines[0],
        column: raw.sensorColumns?.[c] ?? null,
      });
    }
    const start = a >= 0 ? time[a] : time[0];
    const end = b < n ? time[b] : time[n - 1];
    if (end - start > maxGapS + EPS) {
      throw new SignalInputError(
        'gap-too-long',
        `sensor ${raw.sensorIds[c]} is missing from ${fmt(time[first])} s to ${fmt(time[b - 1])} s ` +
          `(${fmt(end - start)} s; at most ${maxGapS} s is filled)`,
        { line: lines[first], column: raw.sensorColumns?.[c] ?? null },
      );
    }
    for (let k = first; k < b; k++) {
      if (a < 0) x[k] = x[b];
      else if (b >= n) x[k] = x[a];
      else x[k] = x[a] + ((x[b] - x[a]) * (time[k] - time[a])) / (time[b] - time[a]);
    }
    gaps.push({ start_s: start, end_s: end, filled: true });
  }
  return x;
}

const fmt = (v: number) => String(Math.round(v * 1e6) / 1e6);

/**
 * Regularises a recording read from a file. Gaps are reported by the valid samples around them
 * (start_s = last sample before, end_s = first sample after); a gap longer than maxGapS is an error.
 */
export function regularise(
  raw: RawRecording,
  layout: SensorLayout,
  opts: {
    sampleRateHz?: number;
    maxGapS?: number;
    /**
     * The forces may be written over raw's channel arrays (the same numbers; a caller that reads a recording only
     * to analyse it once saves a copy of every channel). raw's channels are then no longer the file's values.
     */
    reuseChannels?: boolean;
  } = {},
): UniformRecording {
  const maxGapS = opts.maxGapS ?? DEFAULT_MAX_GAP_S;
  if (!(Number.isFinite(maxGapS) && maxGapS >= 0)) throw new RangeError(`maxGapS must be a non-negative number, got ${maxGapS}`);
  const { time, lines } = raw;
  const m = time.length;
  if (m < 2) throw new SignalInputError('too-few-samples', 'at least two samples are needed', { line: lines[0] ?? null });
  checkSensors(raw, layout);
  // the median step's working copy becomes the grid when the grid fits in it (a uniform recording: n = m)
  const scratch = new Float64Array(m);
  const fs = nominalRate(raw, opts.sampleRateHz, scratch).hz;
  const gaps: Gap[] = [];

  for (let i = 1; i < m; i++) {
    const dt = time[i] - time[i - 1];
    if (dt > maxGapS + EPS) {
      throw new SignalInputError(
        'gap-too-long',
        `no samples from ${fmt(time[i - 1])} s to ${fmt(time[i])} s (${fmt(dt)} s; at most ${maxGapS} s is filled)`,
        { line: lines[i], column: 1 },
      );
    }
    if (dt > 1.5 / fs) gaps.push({ start_s: time[i - 1], end_s: time[i], filled: true });
  }
  const areaById = new Map(layout.sensors.map((s) => [s.id, s.area_mm2]));
  const filled = raw.channels.map((_, c) => fillChannel(raw, c, maxGapS, gaps));

  // Grid t0 + i / fs up to the last original time; bracket and weight computed once for all channels.
  const t0 = time[0];
  const n = Math.floor((time[m - 1] - t0) * fs + 1e-6) + 1;
  const grid = n <= m ? scratch.subarray(0, n) : new Float64Array(n);
  const left = new Int32Array(n);
  const weight = new Float64Array(n);
  let j = 0;
  // In place (reuseChannels) when no grid point but the last reads a sample before its own index: the loop below
  // then never reads a value it has already replaced; the last point is worked out before the loop.
  let ahead = n <= m;
  for (let i = 0; i < n; i++) {
    const t = t0 + i / fs;
    grid[i] = t;
    while (j < m - 2 && time[j + 1] <= t) j++;
    left[i] = j;
    weight[i] = Math.min(1, Math.max(0, (t - time[j]) / (time[j + 1] - time[j])));
    if (j < i && i < n - 1) ahead = false;
  }
  const forces = filled.map((x, c) => {
    const scale = raw.units === 'kPa' ? areaById.get(raw.sensorIds[c])! * KPA_MM2_TO_N : 1;
    const inPlace = opts.reuseChannels === true && ahead;
    const out = inPlace ? x : new Float64Array(n);
    const k = left[n - 1];
    const last = (x[k] + (x[k + 1] - x[k]) * weight[n - 1]) * scale;
    for (let i = 0; i < n - 1; i++) {
      const k = left[i];
      out[i] = (x[k] + (x[k + 1] - x[k]) * weight[i]) * scale;
    }
    out[n - 1] = last;
    return inPlace && n < m ? out.subarray(0, n) : out;
  });

  let impact: Uint8Array | null = null;
  if (raw.impact) {
    impact = new Uint8Array(n);
    for (let i = 0; i < m; i++) {
      if (raw.impact[i]) impact[Math.min(n - 1, Math.max(0, Math.round((time[i] - t0) * fs)))] = 1;
    }
  }
  return { sampleRateHz: fs, time: grid, sensorIds: raw.sensorIds.slice(), forces, impact, gaps: mergeGaps(gaps) };
}

/** Sorted by start, identical intervals (the same run in several channels) listed once. */
function mergeGaps(gaps: Gap[]): Gap[] {
  const sorted = gaps.slice().sort((a, b) => a.start_s - b.start_s || a.end_s - b.end_s);
  return sorted.filter((g, i) => i === 0 || g.start_s !== sorted[i - 1].start_s || g.end_s !== sorted[i - 1].end_s);
}
