import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { medianInPlace, selectInPlace } from '@/lib/signal/select';

// Selection against the outside reference it replaces: Float64Array.prototype.sort (ECMAScript's numeric order for
// typed arrays, -0 before +0 and NaN last), the value at index k of the sorted copy; the median as a sorted copy's
// middle value (mean of the two middle ones for an even count). Compared bit for bit (Object.is).
const sortedAt = (a: Float64Array, k: number) => a.slice().sort()[k];
function sortedMedian(a: Float64Array): number {
  const s = a.slice().sort();
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

const values = fc.array(fc.oneof(fc.double({ noNaN: true }), fc.integer({ min: -3, max: 3 }), fc.constantFrom(0, -0, NaN, 1.5)), {
  minLength: 1,
  maxLength: 200,
});

describe('selectInPlace and medianInPlace give what sorting gives', () => {
  it('any k of random arrays with repeats, zeros of both signs and NaN', () => {
    fc.assert(
      fc.property(values, fc.nat(), (xs, kSeed) => {
        const a = Float64Array.from(xs);
        const k = kSeed % a.length;
        expect(Object.is(selectInPlace(a.slice(), k), sortedAt(a, k))).toBe(true);
        expect(Object.is(medianInPlace(a.slice()), sortedMedian(a))).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  it('long arrays: sorted, reversed, constant, a lesson-sized random one', () => {
    const n = 100_001;
    const random = new Float64Array(n).map((_, i) => Math.sin(i * 12.9898) * 43758.5453 - Math.floor(Math.sin(i * 12.9898) * 43758.5453));
    for (const a of [Float64Array.from({ length: n }, (_, i) => i), Float64Array.from({ length: n }, (_, i) => n - i), new Float64Array(n).fill(2.5), random]) {
      for (const k of [0, 1, n >> 1, n - 2, n - 1]) expect(selectInPlace(a.slice(), k)).toBe(sortedAt(a, k));
      expect(medianInPlace(a.slice())).toBe(sortedMedian(a));
      expect(medianInPlace(a.slice(1))).toBe(sortedMedian(a.slice(1)));
    }
  });

  it('refuses an index outside the array', () => {
    expect(() => selectInPlace(new Float64Array(3), 3)).toThrow(RangeError);
    expect(() => selectInPlace(new Float64Array(0), 0)).toThrow(RangeError);
  });
});
