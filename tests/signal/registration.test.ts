import { describe, expect, it } from 'vitest';
import { inverseLandmarkWarp, landmarkWarp, registerCurve } from '@/lib/signal/registration';

// Worked example of landmark registration (Ramsay & Silverman, Functional Data Analysis, 2nd ed., ch. 8), computed by
// piecewise-linear interpolation
const events = [0, 0.8, 1.05, 1.9];
const targets = [0, 75, 100, 150];

describe('landmarkWarp(eventTimes, targetPositions)', () => {
  const h = landmarkWarp(events, targets);
  it('maps the worked example', () => {
    expect(h(0.4)).toBeCloseTo(37.5, 12); // Ramsay & Silverman ch. 8: 0.4 s -> 37.5
    expect(h(0.925)).toBeCloseTo(87.5, 12); // Ramsay & Silverman ch. 8: 0.925 s -> 87.5
  });
  it('sends every event onto its target', () => {
    events.forEach((t, i) => expect(h(t)).toBeCloseTo(targets[i], 12)); // definition of landmark registration
  });
  it('extends the end segments linearly', () => {
    expect(h(-0.4)).toBeCloseTo(-37.5, 12);
    expect(h(2.75)).toBeCloseTo(200, 12);
  });
  it('has an inverse', () => {
    const g = inverseLandmarkWarp(events, targets);
    expect(g(87.5)).toBeCloseTo(0.925, 12); // inverse of the worked example
  });
  it('rejects bad landmarks with RangeError', () => {
    expect(() => landmarkWarp([0, 1], [0])).toThrow(RangeError);
    expect(() => landmarkWarp([0, 0], [0, 1])).toThrow(RangeError);
    expect(() => landmarkWarp([0, 1], [1, 0])).toThrow(RangeError);
    expect(() => landmarkWarp([0], [0])).toThrow(RangeError);
  });
});

describe('registerCurve(time, values, eventTimes, targetPositions, nPoints)', () => {
  it('resamples a curve linear in time so it is linear in registered position per segment', () => {
    const time = Float64Array.from({ length: 191 }, (_, i) => i / 100);
    const values = Float64Array.from(time); // the curve is time itself
    const r = registerCurve(time, values, events, targets, 151);
    expect(r.axis[0]).toBe(0);
    expect(r.axis[150]).toBe(150);
    expect(r.values[75]).toBeCloseTo(0.8, 12); // at 75 % the time is the second event, 0.8 s
    expect(r.values[87]).toBeCloseTo(0.8 + (12 / 25) * 0.25, 12); // inverse of the worked example's segment
    expect(r.values[150]).toBeCloseTo(1.9, 12);
  });
  it('gives NaN outside the sampled time range', () => {
    const r = registerCurve([0.5, 1], [1, 2], [0, 1], [0, 100], 3);
    expect(Number.isNaN(r.values[0])).toBe(true);
    expect(r.values[2]).toBe(2);
  });
  it('throws RangeError on mismatched input', () => {
    expect(() => registerCurve([0, 1], [1], events, targets)).toThrow(RangeError);
    expect(() => registerCurve([0, 1], [1, 2], events, targets, 1)).toThrow(RangeError);
  });
});
