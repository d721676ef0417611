// Event and phase names on screen derive from lib/signal/types.ts (EVENT_NAMES, PHASES) in the swings contract.
export { eventLabels, phaseLabels } from '@/lib/contracts/swings';

// Names of the processing parameters as lib/signal/analyze.ts records them, with their units.
export const parameterLabels: Record<string, string> = {
  handedness: 'Handedness',
  stance_width_mm: 'Stance width (mm)',
  cutoff_hz: 'Filter cutoff (Hz)',
  filter_order: 'Filter order (zero-lag, applied forward and backward)',
  derivative_window: 'Derivative window (samples)',
  derivative_poly_order: 'Derivative polynomial order',
  max_gap_s: 'Longest gap filled (s)',
  sample_rate_hz: 'Sample rate (Hz)',
  layout: 'Sensor layout',
};

// Swing labels (trade terms for clubs and ball outcomes).
export const clubLabels: Record<string, string> = {
  driver: 'Driver',
  wood: 'Fairway wood',
  hybrid: 'Hybrid',
  'iron-3': '3-iron',
  'iron-4': '4-iron',
  'iron-5': '5-iron',
  'iron-6': '6-iron',
  'iron-7': '7-iron',
  'iron-8': '8-iron',
  'iron-9': '9-iron',
  wedge: 'Wedge',
};
export const strikeLabels: Record<string, string> = { solid: 'Solid', fat: 'Fat', thin: 'Thin', topped: 'Topped' };
export const flightLabels: Record<string, string> = { push: 'Push', pull: 'Pull', slice: 'Slice', hook: 'Hook', fade: 'Fade', draw: 'Draw', straight: 'Straight' };
