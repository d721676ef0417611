// Finish: the first sample after impact from which the COP holds still for settleHoldS: its speed stays below the
// settle threshold AND it drifts less than settleDriftMm over the hold (the means of the first and last 50 ms of the
// hold are compared, so sensor noise does not count as drift). The drift check matters after a short swing, whose
// follow-through is a slow roll onto the lead foot that never reaches the speed threshold.
import type { DerivedSeries } from '../types';
import type { DetectionParams } from './params';

const END_S = 0.05;

/** The finish sample and its hold length, or -1 when the COP does not settle within maxFollowThroughS. */
export function findFinish(s: DerivedSeries, impact: number, settleMmS: number, p: DetectionParams): { finish: number; holdN: number } {
  const fs = s.sampleRateHz;
  const n = s.time.length;
  const holdN = Math.max(1, Math.round(p.settleHoldS * fs));
  const endN = Math.max(1, Math.round(END_S * fs));
  const last = Math.min(n - 1, impact + Math.round((p.maxFollowThroughS + p.settleHoldS) * fs));
  const mean = (v: Float64Array, a: number) => {
    let sum = 0;
    for (let i = a; i < a + endN; i++) sum += v[i];
    return sum / endN;
  };
  const drift = (a: number) => {
    const b = a + holdN - endN;
    return Math.hypot(mean(s.copX, b) - mean(s.copX, a), mean(s.copY, b) - mean(s.copY, a));
  };
  let run = 0;
  for (let i = impact + 1; i <= last; i++) {
    run = s.copSpeed[i] < settleMmS ? run + 1 : 0;
    if (run >= holdN) {
      const finish = i - holdN + 1;
      if (!(drift(finish) <= p.settleDriftMm)) continue; // still rolling: try the hold one sample later
      return { finish: (finish - impact) / fs > p.maxFollowThroughS ? -1 : finish, holdN };
    }
  }
  return { finish: -1, holdN };
}
