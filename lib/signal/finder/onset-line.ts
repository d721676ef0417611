// Where a move starts, from its velocity's rising flank: the times t25 and t50 where the speed passes 25 % and 50 %
// of its peak are joined by a straight line, extended back to zero speed: t0 = t25 - (t50 - t25). A move that
// starts with a finite acceleration has a velocity that is straight near its start, so the line meets zero where the
// move began; the two points lie far enough from the start that smoothing (which rounds the corner) barely moves
// them. For an eased move (velocity ~ sin(pi u)) the estimate is 0.006 of the move's duration early.

/** Fractional index where v (scanning back from `peak`) last reaches `level` (same sign as v[peak]); -1 if never. */
function crossingBack(v: ArrayLike<number>, peak: number, lo: number, level: number): number {
  const sgn = Math.sign(v[peak]);
  for (let i = peak; i - 1 >= lo; i--) {
    const a = sgn * v[i - 1];
    const b = sgn * v[i];
    if (a < level && b >= level) return i - 1 + (level - a) / (b - a);
  }
  return -1;
}

/** Fractional index where the move peaking at `peak` started (never before lo); NaN when a crossing is missing. */
export function moveOnset(v: ArrayLike<number>, peak: number, lo: number): number {
  const vp = Math.abs(v[peak]);
  if (!(vp > 0)) return NaN;
  const c50 = crossingBack(v, peak, lo, 0.5 * vp);
  if (c50 < 0) return NaN;
  const c25 = crossingBack(v, Math.floor(c50), lo, 0.25 * vp);
  if (c25 < 0) return NaN;
  return Math.max(lo, c25 - (c50 - c25));
}
