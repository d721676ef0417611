// Per-sensor filtered forces over sample windows, for the foot view of a swing. The same filter and clamp as
// derive() (zeroLagLowpass, then max(0, f)), run on each window with WINDOW_MARGIN_S of signal either side instead
// of on the whole recording: the zero-lag Butterworth's start-up transient dies out within a fraction of a second,
// so inside the window the result equals the whole-recording filter to well under 1e-6 N (tests/lib/swings-recompute),
// at a fifth of the cost of filtering every sensor again over a full lesson.
import { zeroLagLowpass } from './filter';
import type { SensorLayout, UniformRecording } from './types';

/** seconds of signal kept on each side of a window while filtering it */
export const WINDOW_MARGIN_S = 2;

export interface SensorWindows {
  sensorIds: string[];
  /** per window (same order as `windows`), per sensor (same order as sensorIds): newtons, samples from..to included */
  forces: Float64Array[][];
}

export function sensorForceWindows(
  u: UniformRecording,
  layout: SensorLayout,
  cutoffHz: number,
  order: number,
  windows: readonly { from: number; to: number }[],
): SensorWindows {
  const n = u.time.length;
  for (const w of windows) {
    if (!(Number.isInteger(w.from) && Number.isInteger(w.to) && w.from >= 0 && w.to >= w.from && w.to < n)) {
      throw new RangeError(`bad window ${w.from}..${w.to} for ${n} samples`);
    }
  }
  const sensorIds = layout.sensors.map((s) => s.id);
  const forces: Float64Array[][] = windows.map(() => []);
  if (windows.length === 0) return { sensorIds, forces };
  const margin = Math.round(WINDOW_MARGIN_S * u.sampleRateHz);
  for (const sensor of layout.sensors) {
    const idx = u.sensorIds.indexOf(sensor.id);
    if (idx < 0) throw new RangeError(`sensor ${sensor.id} of layout "${layout.id}" is not in the recording`);
    windows.forEach((w, k) => {
      const lo = Math.max(0, w.from - margin);
      const hi = Math.min(n - 1, w.to + margin);
      const f = zeroLagLowpass(u.forces[idx].subarray(lo, hi + 1), u.sampleRateHz, cutoffHz, order);
      const out = f.slice(w.from - lo, w.to - lo + 1);
      for (let i = 0; i < out.length; i++) if (!(out[i] > 0)) out[i] = 0;
      forces[k].push(out);
    });
  }
  return { sensorIds, forces };
}
