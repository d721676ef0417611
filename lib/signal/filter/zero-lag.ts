// The zero-lag low-pass used on every force channel: a Butterworth run forward and backward (sosfiltfilt), its
// design cutoff corrected so the two passes together are -3.01 dB at the requested cutoff.
import { butterworthSos, correctedCutoff } from './butterworth';
import { defaultPadlen, sosfiltfilt } from './sosfiltfilt';

/** Requested cutoff for ground reaction forces; 20 Hz is common practice for GRF (see docs). */
export const DEFAULT_CUTOFF_HZ = 20;
/** Single-pass order; the zero-lag filter has twice this order. */
export const DEFAULT_FILTER_ORDER = 2;
/** The corrected design cutoff must stay below this fraction of the sample rate. */
export const MAX_DESIGN_FRACTION = 0.45;

/** Samples the zero-lag filter needs (its padding + 1) for a given order. */
export function zeroLagMinSamples(order = DEFAULT_FILTER_ORDER): number {
  return 3 * (order + 1) + 1; // defaultPadlen of order/2 biquads with non-zero b2/a2, plus one
}

export function zeroLagDesign(fs: number, cutoffHz = DEFAULT_CUTOFF_HZ, order = DEFAULT_FILTER_ORDER) {
  const designHz = correctedCutoff(cutoffHz, fs, 2, order);
  if (designHz >= MAX_DESIGN_FRACTION * fs) {
    throw new RangeError(
      `cutoff ${cutoffHz} Hz needs a design cutoff of ${designHz.toFixed(2)} Hz, at or above ${MAX_DESIGN_FRACTION} x fs = ` +
        `${(MAX_DESIGN_FRACTION * fs).toFixed(2)} Hz; lower the cutoff or record at a higher rate`,
    );
  }
  const sos = butterworthSos(order, designHz, fs);
  return { designHz, sos, padlen: defaultPadlen(sos) };
}

/** Zero-phase Butterworth low-pass of x (new array), -3.01 dB at cutoffHz after both passes. */
export function zeroLagLowpass(x: Float64Array, fs: number, cutoffHz = DEFAULT_CUTOFF_HZ, order = DEFAULT_FILTER_ORDER): Float64Array {
  const { sos, padlen } = zeroLagDesign(fs, cutoffHz, order);
  if (x.length <= padlen) {
    throw new RangeError(`the zero-lag filter needs at least ${padlen + 1} samples (it pads ${padlen} at each end), got ${x.length}`);
  }
  return sosfiltfilt(sos, x, padlen);
}
