// Aligns two sequences of event times that were taken on two clocks differing by an unknown constant offset
// (shots on a launch monitor's clock against impacts on the insoles' clock; later, audio onsets against impacts).
//
// The intervals between events do not depend on the offset, so the offset is found where the interval patterns
// agree: every pair (a_i, b_j) proposes an offset d = a_i - b_j, i.e. anchors the two sequences at that pair; the
// anchor is scored by how many events of `a` then have an event of `b` within `toleranceS` (one-to-one), which is
// the number of intervals from the anchor that agree in both sequences. Missing events in either sequence only lower
// the score of the right anchor by the events that are missing; they never break the pattern, as a difference of
// consecutive intervals would. The best anchor's offset is then refined as the mean of the matched differences.
//
// Pure: arrays in, a new object out; inputs are never mutated. Bad parameters throw RangeError.

export interface AlignOptions {
  /** largest |a - (b + offset)| that still counts as the same event, seconds (> 0) */
  toleranceS: number;
  /** only offsets within [minOffsetS, maxOffsetS] are considered (defaults: unbounded) */
  minOffsetS?: number;
  maxOffsetS?: number;
}

export interface AlignResult {
  /** a ≈ b + offsetS; null when no anchor matches at least `minMatches` events */
  offsetS: number | null;
  /** events matched at the best offset */
  matched: number;
  /** matched count of the best anchor at an offset more than 2 tolerances away (how clear the choice was) */
  runnerUp: number;
  /** residuals a - (b + offset) of the matched pairs, their root mean square in seconds */
  rmsS: number | null;
}

export interface Pair {
  a: number;
  b: number;
}

function check(times: readonly number[], name: string): number[] {
  const out = Array.from(times);
  for (let i = 0; i < out.length; i++) {
    if (!Number.isFinite(out[i])) throw new RangeError(`${name}[${i}] is not a finite number`);
    if (i > 0 && out[i] < out[i - 1]) throw new RangeError(`${name} must be in increasing order (index ${i})`);
  }
  return out;
}

/**
 * One-to-one nearest pairing of sorted `a` with sorted `b + offsetS`, within `toleranceS`: every candidate pair
 * closer than the tolerance, taken by increasing distance, each event used at most once. Indexes into a and b.
 */
export function pairNearest(a: readonly number[], b: readonly number[], offsetS: number, toleranceS: number): Pair[] {
  if (!(toleranceS > 0)) throw new RangeError('toleranceS must be > 0');
  if (!Number.isFinite(offsetS)) throw new RangeError('offsetS must be finite');
  const xs = check(a, 'a');
  const ys = check(b, 'b').map((t) => t + offsetS);
  const candidates: { i: number; j: number; d: number }[] = [];
  let start = 0;
  for (let i = 0; i < xs.length; i++) {
    while (start < ys.length && ys[start] < xs[i] - toleranceS) start++;
    for (let j = start; j < ys.length && ys[j] <= xs[i] + toleranceS; j++) candidates.push({ i, j, d: Math.abs(xs[i] - ys[j]) });
  }
  candidates.sort((p, q) => p.d - q.d || p.i - q.i || p.j - q.j);
  const usedA = new Set<number>();
  const usedB = new Set<number>();
  const pairs: Pair[] = [];
  for (const c of candidates) {
    if (usedA.has(c.i) || usedB.has(c.j)) continue;
    usedA.add(c.i);
    usedB.add(c.j);
    pairs.push({ a: c.i, b: c.j });
  }
  return pairs.sort((p, q) => p.a - q.a);
}

/** How many events match at this offset (a greedy two-pointer count, the same order as pairNearest for sorted input). */
function countMatches(xs: readonly number[], ys: readonly number[], offset: number, tol: number): number {
  let i = 0;
  let j = 0;
  let n = 0;
  while (i < xs.length && j < ys.length) {
    const d = xs[i] - (ys[j] + offset);
    if (Math.abs(d) <= tol) {
      n++;
      i++;
      j++;
    } else if (d > 0) j++;
    else i++;
  }
  return n;
}

/** The offset (a's clock minus b's clock) that lines up the intervals of `a` with those of `b`. */
export function alignIntervals(a: readonly number[], b: readonly number[], options: AlignOptions, minMatches = 2): AlignResult {
  const tol = options.toleranceS;
  if (!(tol > 0)) throw new RangeError('toleranceS must be > 0');
  if (!(Number.isInteger(minMatches) && minMatches >= 1)) throw new RangeError('minMatches must be an integer >= 1');
  const lo = options.minOffsetS ?? -Infinity;
  const hi = options.maxOffsetS ?? Infinity;
  if (!(lo <= hi)) throw new RangeError('minOffsetS must be <= maxOffsetS');
  const xs = check(a, 'a');
  const ys = check(b, 'b');

  // Every anchor's offset; anchors within a tolerance of one already scored give (nearly) the same pairing.
  const offsets: number[] = [];
  for (const x of xs) for (const y of ys) if (x - y >= lo && x - y <= hi) offsets.push(x - y);
  offsets.sort((p, q) => p - q);

  let best: { offset: number; n: number; rms: number } | null = null;
  const scored: { offset: number; n: number }[] = [];
  let lastScored = -Infinity;
  for (const d of offsets) {
    if (d - lastScored < tol / 4) continue;
    lastScored = d;
    const n = countMatches(xs, ys, d, tol);
    scored.push({ offset: d, n });
    if (n < minMatches || (best && n < best.n)) continue;
    const refined = refine(xs, ys, d, tol);
    if (!best || n > best.n || (n === best.n && refined.rms < best.rms)) best = { offset: refined.offset, n, rms: refined.rms };
  }
  if (!best) return { offsetS: null, matched: 0, runnerUp: scored.reduce((m, s) => Math.max(m, s.n), 0), rmsS: null };
  // Refining may move the pairing slightly; take the final pairing's count.
  const final = refine(xs, ys, best.offset, tol);
  const runnerUp = scored.filter((s) => Math.abs(s.offset - final.offset) > 2 * tol).reduce((m, s) => Math.max(m, s.n), 0);
  return { offsetS: final.offset, matched: final.n, runnerUp, rmsS: final.rms };
}

/** Mean difference of the pairs matched at `offset` (two rounds: the pairing can change once the offset moves). */
function refine(xs: number[], ys: number[], offset: number, tol: number): { offset: number; n: number; rms: number } {
  let current = offset;
  let pairs = pairNearest(xs, ys, current, tol);
  for (let round = 0; round < 2 && pairs.length > 0; round++) {
    current = pairs.reduce((s, p) => s + (xs[p.a] - ys[p.b]), 0) / pairs.length;
    pairs = pairNearest(xs, ys, current, tol);
  }
  const rms = pairs.length === 0 ? Infinity : Math.sqrt(pairs.reduce((s, p) => s + (xs[p.a] - ys[p.b] - current) ** 2, 0) / pairs.length);
  return { offset: current, n: pairs.length, rms };
}
