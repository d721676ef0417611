// fili 2.0.3 ships no types. Only the parts Stanceline uses are declared.
declare module 'fili' {
  export interface Biquad {
    /** numerator b0, b1, b2 */
    b: [number, number, number];
    /** denominator a1, a2 (a0 = 1) */
    a: [number, number];
    k: number;
    z?: [number, number];
  }
  export interface CascadeParams {
    order: number; // number of biquad stages; filter order = 2 x order
    characteristic: 'butterworth' | 'bessel';
    Fs: number;
    Fc: number;
    gain?: number;
    preGain?: boolean;
    BW?: number;
  }
  export class CalcCascades {
    lowpass(params: CascadeParams): Biquad[];
    highpass(params: CascadeParams): Biquad[];
  }
  export class IirFilter {
    constructor(coeffs: Biquad[]);
    multiStep(input: ArrayLike<number>, overwrite?: boolean): number[];
    singleStep(input: number): number;
    reinit(): void;
  }
  const Fili: { CalcCascades: typeof CalcCascades; IirFilter: typeof IirFilter };
  export default Fili;
}
