export const eventLabels = { address: 'Address', top: 'Top', transition: 'Transition', impact: 'Impact', finish: 'Finish' } as const;

// Each phase runs from one event to the next (lib/signal/types.ts PHASES).
export const phaseLabels = {
  backswing: { name: 'Backswing', span: 'address → top' },
  transition: { name: 'Transition', span: 'top → transition' },
  downswing: { name: 'Downswing', span: 'transition → impact' },
  'follow-through': { name: 'Follow-through', span: 'impact → finish' },
} as const;

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
