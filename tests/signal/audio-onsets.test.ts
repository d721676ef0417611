import { describe, expect, it } from 'vitest';
import { detectOnsets, syncByAudio } from '@/lib/signal/audio-onsets';

// Onsets of clicks placed at chosen sample indexes (the truth is the construction, not a threshold), and the sync's
// choices. The clips made with ffmpeg are in tests/lib/video-process.test.ts.
const RATE = 16000;

function lcg(seed: number) {
  let s = seed >>> 0;
  // Numerical Recipes' LCG constants (common practice for a reproducible test noise, not a quality generator)
  return () => ((s = (1664525 * s + 1013904223) >>> 0) / 2 ** 32) * 2 - 1;
}

function clip(seconds: number, clicks: number[], noise = 0.01): Float32Array {
  const r = lcg(7);
  const x = new Float32Array(seconds * RATE).map(() => noise * r());
  for (const c of clicks) {
    const i0 = Math.round(c * RATE);
    for (let k = 0; k < 0.03 * RATE && i0 + k < x.length; k++) x[i0 + k] += 0.5 * Math.sin((2 * Math.PI * 2000 * k) / RATE) * Math.exp(-k / (0.006 * RATE));
  }
  return x;
}

describe('detectOnsets', () => {
  it('finds each click within 1 ms of its first sample and one onset per click', () => {
    const clicks = [0.5, 1.25, 2.0];
    const { onsets } = detectOnsets(clip(3, clicks), RATE);
    expect(onsets.map((o) => o.timeS)).toHaveLength(3);
    onsets.forEach((o, i) => expect(Math.abs(o.timeS - clicks[i])).toBeLessThan(0.001));
  });

  it('rejects bad parameters', () => {
    expect(() => detectOnsets(new Float32Array(10), 0)).toThrow(RangeError);
  });
});

describe('syncByAudio', () => {
  it('one impact: the loudest onset', () => {
    expect(syncByAudio([1, 2, 3], [10, 30, 20], [12]).offsetS).toBeCloseTo(2 - 12, 12);
  });
  it('no onsets or no impacts: null with a reason', () => {
    expect(syncByAudio([], [], [1, 2]).reason).toMatch(/No impact sound/);
    expect(syncByAudio([1], [10], []).reason).toMatch(/no swings/);
  });
  it('several impacts: the interval pattern wins over an extra louder click', () => {
    const impacts = [10, 11.3, 13.1];
    const onsets = [0.4, 1.8, 3.1, 4.9];
    const out = syncByAudio(onsets, [40, 20, 20, 20], impacts);
    expect(out.offsetS).toBeCloseTo(-8.2, 9);
    expect(out.matched).toBe(3);
  });
});
