// Order statistics without sorting: the k-th smallest value of an array by selection (Hoare's quickselect with a
// median-of-three pivot), O(n) on average instead of a sort's O(n log n). The answer is the value a sort would put at
// index k; arrays holding NaN or -0 (where a typed-array sort's order differs from `<`) are sorted instead.

/** The value at index k of `a` sorted ascending (as Float64Array.prototype.sort orders it). Reorders `a`. */
export function selectInPlace(a: Float64Array, k: number): number {
  const n = a.length;
  if (!(k >= 0 && k < n)) throw new RangeError(`k must be in 0..${n - 1}, got ${k}`);
  for (let i = 0; i < n; i++) {
    const v = a[i];
    if (v !== v || (v === 0 && 1 / v < 0)) return a.sort()[k];
  }
  let lo = 0;
  let hi = n - 1;
  while (hi > lo) {
    const mid = (lo + hi) >> 1;
    // median of three as the pivot, moved to a[lo + 1] .. ordered a[lo] <= a[lo + 1] <= a[hi]
    swap(a, mid, lo + 1);
    if (a[lo] > a[hi]) swap(a, lo, hi);
    if (a[lo + 1] > a[hi]) swap(a, lo + 1, hi);
    if (a[lo] > a[lo + 1]) swap(a, lo, lo + 1);
    if (hi - lo <= 2) break;
    const pivot = a[lo + 1];
    let i = lo + 1;
    let j = hi;
    for (;;) {
      do i++;
      while (a[i] < pivot);
      do j--;
      while (a[j] > pivot);
      if (j < i) break;
      swap(a, i, j);
    }
    a[lo + 1] = a[j];
    a[j] = pivot;
    if (j >= k) hi = j - 1;
    if (j <= k) lo = i;
  }
  return a[k];
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/** Median of `a` (the mean of the two middle values for an even count), as a sort of a copy would give; reorders `a`. */
export function medianInPlace(a: Float64Array): number {
  const n = a.length;
  const m = n >> 1;
  const upper = selectInPlace(a, m);
  if (n % 2) return upper;
  // after selection every value below index m is <= a[m]: the largest of them is the lower middle value
  let lower = a[0];
  for (let i = 1; i < m; i++) if (a[i] > lower) lower = a[i];
  return (lower + upper) / 2;
}
