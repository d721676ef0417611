// The zero-lag low-pass used on every force channel: a Butterworth run forward and backward (sosfiltfilt), its
// design cutoff corrected so the two passes together are -3.01 dB at the requested cutoff.
import { butterworthSos, correctedCutoff, type Biquad } from './butterworth';
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

type ZeroLagDesign = { designHz: number; sos: Biquad[]; padlen: number };

/** The last few designs: sensorForceWindows filters thousands of short windows with the same one. */
const designs = new Map<string, ZeroLagDesign>();
const MAX_CACHED_DESIGNS = 8;

export function zeroLagDesign(fs: number, cutoffHz = DEFAULT_CUTOFF_HZ, order = DEFAULT_FILTER_ORDER): ZeroLagDesign {
  const key = `${fs} ${cutoffHz} ${order}`;
  let d = designs.get(key);
  if (!d) {
    d = designZeroLag(fs, cutoffHz, order);
    if (designs.size >= MAX_CACHED_DESIGNS) designs.delete(designs.keys().next().value!);
    designs.set(key, d);
  }
  // copies: the caller may change what it gets
  return { designHz: d.designHz, sos: d.sos.map((s) => s.slice() as Biquad), padlen: d.padlen };
}

function designZeroLag(fs: number, cutoffHz: number, order: number): ZeroLagDesign {
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

/**
 * Zero-phase Butterworth low-pass of x, -3.01 dB at cutoffHz after both passes: a new array, or `out` when given
 * (x.length values; see sosfiltfilt).
 */
export function zeroLagLowpass(
  x: Float64Array,
  fs: number,
  cutoffHz = DEFAULT_CUTOFF_HZ,
  order = DEFAULT_FILTER_ORDER,
  out?: Float64Array,
): Float64Array {
  const { sos, padlen } = zeroLagDesign(fs, cutoffHz, order);
  if (x.length <= padlen) {
    throw new RangeError(`the zero-lag filter needs at least ${padlen + 1} samples (it pads ${padlen} at each end), got ${x.length}`);
  }
  return sosfiltfilt(sos, x, padlen, out);
}
