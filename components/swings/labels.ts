// Event and phase names on screen derive from lib/signal/types.ts (EVENT_NAMES, PHASES) in the swings contract.
export { eventLabels, phaseLabels } from '@/lib/contracts/swings';

// Names of the processing parameters as lib/signal/analyze.ts records them, with their units: coach words first;
// the exact technical term (parameterTerms) goes in the tooltip.
export const parameterLabels: Record<string, string> = {
  handedness: 'Handedness',
  stance_width_mm: 'Stance width (mm)',
  cutoff_hz: 'Smoothing: fastest change kept (Hz)',
  filter_order: 'Smoothing strength',
  derivative_window: 'Speed estimate: samples used',
  derivative_poly_order: 'Speed estimate: curve fitted',
  max_gap_s: 'Longest gap filled (s)',
  sample_rate_hz: 'Sample rate (Hz)',
  layout: 'Sensor layout',
};
export const parameterTerms: Record<string, string> = {
  cutoff_hz: 'low-pass filter cutoff frequency (Hz)',
  filter_order: 'Butterworth filter order (zero-lag, applied forward and backward)',
  derivative_window: 'derivative window (Savitzky–Golay, samples)',
  derivative_poly_order: 'derivative polynomial order (Savitzky–Golay)',
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
