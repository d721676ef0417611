// Finish: the first sample after impact from which the COP speed stays below the settle threshold for settleHoldS.
import type { DerivedSeries } from '../types';
import type { DetectionParams } from './params';

/** The finish sample and its hold length, or -1 when the COP does not settle within maxFollowThroughS. */
export function findFinish(s: DerivedSeries, impact: number, settleMmS: number, p: DetectionParams): { finish: number; holdN: number } {
  const fs = s.sampleRateHz;
  const n = s.time.length;
  const holdN = Math.max(1, Math.round(p.settleHoldS * fs));
  const last = Math.min(n - 1, impact + Math.round((p.maxFollowThroughS + p.settleHoldS) * fs));
  let run = 0;
  for (let i = impact + 1; i <= last; i++) {
    run = s.copSpeed[i] < settleMmS ? run + 1 : 0;
    if (run === holdN) {
      const finish = i - holdN + 1;
      return { finish: (finish - impact) / fs > p.maxFollowThroughS ? -1 : finish, holdN };
    }
  }
  return { finish: -1, holdN };
}
