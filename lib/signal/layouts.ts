// Sensor layouts the product knows by id (the `layout` metadata key). Positions are in the foot-local frame of
// the README (origin heel centre, +y toward the toes, +x medial), for a 260 mm insole.
// The files are the product's own and are not run through parseLayout here: tests/signal/derive.test.ts checks that
// parseLayout gives each back unchanged, and importing this module stays free of the schema library (the analyze
// command starts without loading it).
import pair16 from './layouts/pair-16.json';
import pair8 from './layouts/pair-8.json';
import type { SensorLayout } from './types';

/** A copy frozen all the way down: callers share these objects, so nobody may change them. */
function frozen(json: unknown): SensorLayout {
  const layout = structuredClone(json) as SensorLayout;
  layout.sensors.forEach((s) => Object.freeze(s));
  Object.freeze(layout.sensors);
  return Object.freeze(layout);
}

export const BUILTIN_LAYOUTS: Readonly<Record<string, SensorLayout>> = Object.freeze({
  'pair-8': frozen(pair8),
  'pair-16': frozen(pair16),
});

/** The layout files themselves (for the check that they are valid layouts). */
export const BUILTIN_LAYOUT_FILES: Readonly<Record<string, unknown>> = { 'pair-8': pair8, 'pair-16': pair16 };

/** The built-in layout with this id, or undefined. */
export function builtinLayout(id: string): SensorLayout | undefined {
  return Object.prototype.hasOwnProperty.call(BUILTIN_LAYOUTS, id) ? BUILTIN_LAYOUTS[id] : undefined;
}
