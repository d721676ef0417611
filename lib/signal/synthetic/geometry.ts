// Where each sensor sits for the generator: lead or trail foot, heel or toe, its share of its region, and the
// noise-free stance-frame COP (the README formulas) used to state the forward press's size.
import type { Handedness, SensorLayout } from '../types';

export interface Geometry {
  ids: string[];
  /** per column: lead foot?, heel?, weight within its foot region, area */
  isLead: boolean[];
  isHeel: boolean[];
  weight: number[];
  area: number[];
  x: number[];
  y: number[];
}

export function geometry(layout: SensorLayout, handedness: Handedness): Geometry {
  const leadFoot = handedness === 'right' ? 'left' : 'right';
  const sensors = [...layout.sensors].sort((a, b) => (a.foot === b.foot ? 0 : a.foot === 'left' ? -1 : 1));
  const heelOf = (s: SensorLayout['sensors'][number]) => (s.region ?? (s.y_mm < layout.foot_length_mm / 2 ? 'heel' : 'toe')) === 'heel';
  // inside a region the load is shared in proportion to sensor area
  const regionArea = new Map<string, number>();
  for (const s of sensors) {
    const key = `${s.foot}:${heelOf(s)}`;
    regionArea.set(key, (regionArea.get(key) ?? 0) + s.area_mm2);
  }
  for (const foot of ['left', 'right']) {
    for (const heel of [true, false]) {
      if (!regionArea.get(`${foot}:${heel}`)) throw new RangeError(`layout "${layout.id}" has no ${heel ? 'heel' : 'toe'} sensor on the ${foot} foot`);
    }
  }
  return {
    ids: sensors.map((s) => s.id),
    isLead: sensors.map((s) => s.foot === leadFoot),
    isHeel: sensors.map(heelOf),
    weight: sensors.map((s) => s.area_mm2 / regionArea.get(`${s.foot}:${heelOf(s)}`)!),
    area: sensors.map((s) => s.area_mm2),
    x: sensors.map((s) => s.x_mm),
    y: sensors.map((s) => s.y_mm),
  };
}

/** Noise-free stance-frame COP X of one sample (+ toward the target), the README formula. */
export function cleanCopX(g: Geometry, f: ArrayLike<number>, stanceWidthMm: number): number {
  const w = stanceWidthMm;
  let total = 0;
  let mx = 0;
  for (let c = 0; c < f.length; c++) {
    total += f[c];
    mx += f[c] * (g.isLead[c] ? w / 2 - g.x[c] : -w / 2 + g.x[c]);
  }
  return mx / total;
}
