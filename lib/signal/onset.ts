// Onset detection: runs of samples at or above a threshold, the way biomechanics commonly does it
// (Duarte's detect_onset, BMC notebooks). NaN never counts as above the threshold.
//
// - a run is a maximal set of samples >= threshold where gaps of at most `nBelow` samples below it are bridged;
// - a run is kept when it spans at least `nAbove` samples (last - first >= nAbove - 1);
// - with `thresholdSecond`, a run is kept only when at least `nAboveSecond` of its samples are >= thresholdSecond.
// Returns [first, last] sample indexes (both inclusive).

export interface OnsetOptions {
  nAbove?: number;
  nBelow?: number;
  thresholdSecond?: number;
  nAboveSecond?: number;
}

function assertCount(name: string, value: number, min: number): void {
  if (!Number.isInteger(value) || value < min) throw new RangeError(`${name} must be an integer >= ${min}, got ${value}`);
}

export function detectOnset(x: ArrayLike<number>, threshold: number, opts: OnsetOptions = {}): Array<[number, number]> {
  const nAbove = opts.nAbove ?? 1;
  const nBelow = opts.nBelow ?? 0;
  const nAboveSecond = opts.nAboveSecond ?? 1;
  if (Number.isNaN(threshold)) throw new RangeError('threshold must be a number');
  assertCount('nAbove', nAbove, 0);
  assertCount('nBelow', nBelow, 0);
  assertCount('nAboveSecond', nAboveSecond, 0);
  if (opts.thresholdSecond !== undefined && Number.isNaN(opts.thresholdSecond)) {
    throw new RangeError('thresholdSecond must be a number');
  }

  const runs: Array<[number, number]> = [];
  let first = -1;
  let last = -1;
  const close = () => {
    if (first >= 0 && last - first >= nAbove - 1) runs.push([first, last]);
  };
  for (let i = 0; i < x.length; i++) {
    if (!(x[i] >= threshold)) continue; // NaN fails this comparison: below by definition
    if (first < 0) {
      first = i;
    } else if (i - last > nBelow + 1) {
      close();
      first = i;
    }
    last = i;
  }
  close();

  const second = opts.thresholdSecond;
  if (second === undefined) return runs;
  return runs.filter(([a, b]) => {
    let count = 0;
    for (let i = a; i <= b; i++) if (x[i] >= second) count++;
    return count >= nAboveSecond;
  });
}
