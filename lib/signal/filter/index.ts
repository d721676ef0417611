export { butterworthSos, correctedCutoff, type Biquad } from './butterworth';
export { sosfilt, sosfiltZi, sosfiltfilt, defaultPadlen } from './sosfiltfilt';
export { magnitudeAt, sosToTf } from './response';
export {
  zeroLagLowpass,
  zeroLagDesign,
  zeroLagMinSamples,
  DEFAULT_CUTOFF_HZ,
  DEFAULT_FILTER_ORDER,
  MAX_DESIGN_FRACTION,
} from './zero-lag';
