// Sensor layouts the product knows by id (the `layout` metadata key). Positions are in the foot-local frame of
// the README (origin heel centre, +y toward the toes, +x medial), for a 260 mm insole.
import pair16 from './layouts/pair-16.json';
import pair8 from './layouts/pair-8.json';
import { parseLayout } from './read/schemas';
import type { SensorLayout } from './types';

/** Frozen all the way down: callers share these objects, so nobody may change them. */
function frozen(layout: SensorLayout): SensorLayout {
  layout.sensors.forEach((s) => Object.freeze(s));
  Object.freeze(layout.sensors);
  return Object.freeze(layout);
}

export const BUILTIN_LAYOUTS: Readonly<Record<string, SensorLayout>> = Object.freeze({
  'pair-8': frozen(parseLayout(pair8)),
  'pair-16': frozen(parseLayout(pair16)),
});

/** The built-in layout with this id, or undefined. */
export function builtinLayout(id: string): SensorLayout | undefined {
  return Object.prototype.hasOwnProperty.call(BUILTIN_LAYOUTS, id) ? BUILTIN_LAYOUTS[id] : undefined;
}
