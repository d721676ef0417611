// A simple insole outline of our own, in the foot-local frame of the README (origin at the back of the heel on the
// centreline, +y toward the toes, +x medial), as fractions of the foot length; then placed in the stance frame
// with the same transform the signal core uses for the COP.
import { line, curveCatmullRomClosed, type ScaleLinear } from 'd3';
import { toStanceFrame } from '@/lib/signal/stance-frame';
import type { Foot, Handedness, SensorLayout } from '@/lib/signal/types';

// Heel narrow and round, a slight medial arch waist, widest across the ball (~70 % of the length), toe box rounded.
const OUTLINE: readonly [number, number][] = [
  [0, 0], [0.09, 0.02], [0.125, 0.09], [0.12, 0.25], [0.105, 0.4], [0.13, 0.55], [0.17, 0.7], [0.165, 0.82],
  [0.12, 0.93], [0.05, 0.995], [-0.02, 1], [-0.09, 0.97], [-0.15, 0.88], [-0.19, 0.74], [-0.18, 0.6],
  [-0.15, 0.42], [-0.13, 0.25], [-0.125, 0.09], [-0.09, 0.02],
];

/** Lead foot = left for a right-handed golfer, right for a left-handed one. */
export const isLeadFoot = (foot: Foot, handedness: Handedness) => (handedness === 'right' ? foot === 'left' : foot === 'right');

/** Outline points of one insole in the stance frame, mm. */
export function insoleOutline(layout: SensorLayout, isLead: boolean, stanceWidthMm: number): [number, number][] {
  const L = layout.foot_length_mm;
  if (!(L > 0)) throw new RangeError(`layout "${layout.id}": foot_length_mm must be positive, got ${L}`);
  return OUTLINE.map(([fx, fy]) => {
    const p = toStanceFrame(fx * L, fy * L, isLead, stanceWidthMm, L);
    return [p.x, p.y];
  });
}

export function outlinePath(points: [number, number][], x: ScaleLinear<number, number>, y: ScaleLinear<number, number>): string {
  return line<[number, number]>().x((p) => x(p[0])).y((p) => y(p[1])).curve(curveCatmullRomClosed).digits(1)(points) ?? '';
}

/** Every sensor of the layout in the stance frame, with whether it sits under the lead foot. */
export function sensorsInStance(layout: SensorLayout, handedness: Handedness, stanceWidthMm: number) {
  return layout.sensors.map((s) => {
    const lead = isLeadFoot(s.foot, handedness);
    const p = toStanceFrame(s.x_mm, s.y_mm, lead, stanceWidthMm, layout.foot_length_mm);
    return { id: s.id, lead, x: p.x, y: p.y };
  });
}

/** Dot radius with area proportional to force: r = rMin + (rMax - rMin) sqrt(f / fMax); 0-force dots keep rMin. */
export function forceRadius(f: number, fMax: number, rMin = 2.5, rMax = 11): number {
  if (!(fMax > 0) || !Number.isFinite(f) || f <= 0) return rMin;
  return rMin + (rMax - rMin) * Math.sqrt(Math.min(1, f / fMax));
}
