// Reference bands (pure). Each swing's stored full-rate curves are registered at its five events (landmark
// registration, Ramsay & Silverman ch. 8, lib/signal registerCurve) onto a 0-100 % swing axis, address = 0 and
// finish = 100, with the inner events sent to their mean relative positions across the band's swings. The band is
// mean +- k SD per axis point (lib/signal meanSdBand, sample SD).
// A swing is scored against a band on each curve by: insidePct, the % of its registered points inside
// [mean - k SD, mean + k SD]; rms, the root-mean-square difference to the band mean (lib/signal rmsDifference); and
// cmc, the coefficient of multiple correlation (Kadaba et al. 1989, lib/signal cmc) of the swing's curve with the band
// mean taken as two curves: 1 when they coincide, falling as they differ in shape or level (an offset lowers it too).
import { cmc, EVENT_NAMES, meanSdBand, registerCurve, rmsDifference } from '@/lib/signal';

export const BAND_CURVES = ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copX'] as const;
export type BandCurve = (typeof BAND_CURVES)[number];
export const BAND_EVENTS = EVENT_NAMES;
export const BAND_POINTS = 101;

export interface SwingCurves {
  id: number;
  time: ArrayLike<number>;
  /** NaN for samples without a value */
  curves: Record<BandCurve, ArrayLike<number>>;
  /** seconds of address, top, transition, impact, finish */
  eventTimes: number[];
}

export interface BandCurveData {
  mean: number[];
  sd: number[];
  lower: number[];
  upper: number[];
}

export interface BandData {
  axis: number[];
  /** mean position of each event on the 0-100 axis */
  landmarks: Record<(typeof BAND_EVENTS)[number], number>;
  curves: Record<BandCurve, BandCurveData>;
}

/** Why a swing cannot go into a band, or null when it can. */
export function unusableReason(s: SwingCurves): string | null {
  if (s.eventTimes.length !== BAND_EVENTS.length || s.eventTimes.some((t) => !Number.isFinite(t))) return 'it lacks one of the five events';
  for (let i = 1; i < s.eventTimes.length; i++) if (!(s.eventTimes[i] > s.eventTimes[i - 1])) return 'its events are out of order';
  const n = s.time.length;
  if (n < 2 || s.eventTimes[0] < s.time[0] || s.eventTimes[4] > s.time[n - 1]) return 'its events fall outside the stored window';
  return null;
}

/** Relative event positions (%) of one swing: (t_e - t_address) / (t_finish - t_address) * 100. */
export function relativeLandmarks(eventTimes: readonly number[]): number[] {
  const span = eventTimes[eventTimes.length - 1] - eventTimes[0];
  return eventTimes.map((t) => ((t - eventTimes[0]) / span) * 100);
}

export function meanLandmarks(swings: SwingCurves[]): number[] {
  const sums = new Array<number>(BAND_EVENTS.length).fill(0);
  for (const s of swings) relativeLandmarks(s.eventTimes).forEach((p, i) => (sums[i] += p));
  return sums.map((v) => v / swings.length);
}

/** One curve of one swing on the registered axis (its events sent to `landmarks`). */
export function registerSwingCurve(time: ArrayLike<number>, values: ArrayLike<number>, eventTimes: readonly number[], landmarks: readonly number[], nPoints = BAND_POINTS): Float64Array {
  return registerCurve(time, values, eventTimes, landmarks, nPoints).values;
}

const arr = (a: ArrayLike<number>) => Array.from(a, (v) => (Number.isFinite(v) ? v : NaN));

export function buildBand(swings: SwingCurves[], k: number): BandData {
  if (swings.length === 0) throw new RangeError('a band needs at least one swing');
  const landmarks = meanLandmarks(swings);
  const curves = {} as BandData['curves'];
  for (const name of BAND_CURVES) {
    const registered = swings.map((s) => registerSwingCurve(s.time, s.curves[name], s.eventTimes, landmarks));
    const b = meanSdBand(registered, k);
    curves[name] = { mean: arr(b.mean), sd: arr(b.sd), lower: arr(b.lower), upper: arr(b.upper) };
  }
  const axis = Array.from({ length: BAND_POINTS }, (_, i) => (100 * i) / (BAND_POINTS - 1));
  const lm = Object.fromEntries(BAND_EVENTS.map((e, i) => [e, landmarks[i]])) as BandData['landmarks'];
  return { axis, landmarks: lm, curves };
}

export interface CurveScore {
  insidePct: number | null;
  rms: number | null;
  cmc: number | null;
  /** registered points with a value in both the swing and the band */
  points: number;
}

/** Scores one registered curve against one band curve (points where either is missing are left out). */
export function scoreCurve(values: ArrayLike<number>, band: BandCurveData): CurveScore {
  const a: number[] = [];
  const m: number[] = [];
  let inside = 0;
  let withBand = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v) || !Number.isFinite(band.mean[i])) continue;
    a.push(v);
    m.push(band.mean[i]);
    if (Number.isFinite(band.lower[i]) && Number.isFinite(band.upper[i])) {
      withBand++;
      if (v >= band.lower[i] && v <= band.upper[i]) inside++;
    }
  }
  if (a.length < 2) return { insidePct: null, rms: null, cmc: null, points: a.length };
  const c = cmc([a, m]);
  return { insidePct: withBand > 0 ? (100 * inside) / withBand : null, rms: rmsDifference(a, m), cmc: Number.isFinite(c) ? c : null, points: a.length };
}

export function scoreSwingAgainstBand(swing: SwingCurves, band: BandData): Record<BandCurve, CurveScore> {
  const landmarks = BAND_EVENTS.map((e) => band.landmarks[e]);
  const out = {} as Record<BandCurve, CurveScore>;
  for (const name of BAND_CURVES) out[name] = scoreCurve(registerSwingCurve(swing.time, swing.curves[name], swing.eventTimes, landmarks), band.curves[name]);
  return out;
}
