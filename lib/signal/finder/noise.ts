// The recording's own quiet-stance noise floor. A still golfer's COP speed is sensor noise plus postural sway; its
// level depends on the insoles, the body weight and the sample rate. The floor is a low percentile (10th) of the
// medians of the COP speed over 0.25 s blocks: most blocks of a session are someone standing, and the block median
// ignores single noisy samples. Thresholds derived from it never go below the fixed floors of DETECTION_DEFAULTS.
import type { DetectionParams } from './params';

export interface StillnessThresholds {
  /** the noise floor, mm/s */
  floorMmS: number;
  /** COP speed below which the golfer is still, mm/s */
  quietMmS: number;
  /** COP speed below which the finish is settled, mm/s */
  settleMmS: number;
}

const BLOCK_S = 0.25;
const PERCENTILE = 0.1;

export function noiseFloor(speed: Float64Array, fs: number): number {
  const block = Math.max(3, Math.round(BLOCK_S * fs));
  const medians: number[] = [];
  const finite = new Float64Array(block); // one block's finite values, reused for every block
  for (let a = 0; a + block <= speed.length; a += block) {
    let k = 0;
    for (let i = a; i < a + block; i++) if (Number.isFinite(speed[i])) finite[k++] = speed[i];
    // the upper median of the block's finite values (none: no median)
    const m = k ? finite.subarray(0, k).sort()[k >> 1] : NaN;
    if (Number.isFinite(m)) medians.push(m);
  }
  if (medians.length === 0) return 0;
  medians.sort((x, y) => x - y);
  return medians[Math.floor(PERCENTILE * (medians.length - 1))];
}

export function stillnessThresholds(speed: Float64Array, fs: number, p: DetectionParams): StillnessThresholds {
  const floorMmS = noiseFloor(speed, fs);
  const quietMmS = Math.max(p.quietSpeedMmS, p.noiseFloorFactor * floorMmS);
  return { floorMmS, quietMmS, settleMmS: Math.max(p.settleSpeedMmS, 1.5 * quietMmS) };
}
