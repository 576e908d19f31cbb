/**
 * Selected order statistics without a full sort: medians of large cells and
 * the few hundred quantiles of a Q-Q plot need O(n log m) work for m ranks,
 * where a sort would need O(n log n).
 */

/** Below this size a segment is simply sorted. */
const SMALL = 32;
/** From this size on, many ranks are found through a histogram of the values (linear time). */
const LARGE = 65536;
/** Histogram bins for {@link LARGE} inputs. */
const BINS = 65536;

/**
 * Values of the given 0-based ranks in the ascending order of `a`. `a` is
 * permuted in place (pass a copy to keep it). Ranks must lie in [0, a.length).
 */
export function selectRanks(a: Float64Array, ranks: number[]): number[] {
  if (a.length >= LARGE && ranks.length > 4) return selectByHistogram(a, ranks);
  const wanted = [...new Set(ranks)].sort((x, y) => x - y);
  select(a, 0, a.length - 1, wanted, 0, wanted.length - 1, 2 * Math.ceil(Math.log2(a.length + 1)) + 8);
  return ranks.map((r) => a[r]);
}

/** Median of `a` (permutes `a`). */
export function medianOf(a: Float64Array): number {
  const n = a.length;
  if (n === 0) return NaN;
  if (n % 2 === 1) return selectRanks(a, [n >> 1])[0];
  const [lo, hi] = selectRanks(a, [(n >> 1) - 1, n >> 1]);
  return (lo + hi) / 2;
}

/**
 * Places the wanted ranks in wanted[wFrom..wTo] (all inside [lo, hi]) at their
 * sorted positions, by partitioning around a median-of-three pivot and
 * recursing only into the sides that hold wanted ranks. Falls back to sorting
 * the segment when the depth budget runs out, which bounds the worst case.
 */
function select(a: Float64Array, lo: number, hi: number, wanted: number[], wFrom: number, wTo: number, depth: number): void {
  while (wFrom <= wTo && lo < hi) {
    if (hi - lo < SMALL || depth-- <= 0) {
      a.subarray(lo, hi + 1).sort();
      return;
    }
    const mid = (lo + hi) >>> 1;
    // Median of three moved to `lo` as the pivot.
    if (a[mid] < a[lo]) swap(a, mid, lo);
    if (a[hi] < a[lo]) swap(a, hi, lo);
    if (a[hi] < a[mid]) swap(a, hi, mid);
    swap(a, lo, mid);
    const pivot = a[lo];
    // Hoare partition: afterwards a[lo..j] ≤ pivot ≤ a[j+1..hi].
    let i = lo;
    let j = hi + 1;
    for (;;) {
      do i++;
      while (i <= hi && a[i] < pivot);
      do j--;
      while (a[j] > pivot);
      if (i >= j) break;
      swap(a, i, j);
    }
    swap(a, lo, j);
    // Now a[j] = pivot is in its final place; left side [lo, j−1], right [j+1, hi].
    let split = wFrom;
    while (split <= wTo && wanted[split] < j) split++;
    let rightFrom = split;
    while (rightFrom <= wTo && wanted[rightFrom] === j) rightFrom++;
    if (split - 1 >= wFrom) select(a, lo, j - 1, wanted, wFrom, split - 1, depth);
    lo = j + 1;
    wFrom = rightFrom;
  }
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/**
 * Many ranks of a large array in linear time: count the values in equal-width
 * bins between min and max, locate each wanted rank's bin from the cumulative
 * counts, then gather and select only within those bins. Exact: bins only
 * narrow the search. Does not permute `a`.
 */
function selectByHistogram(a: Float64Array, ranks: number[]): number[] {
  const n = a.length;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = a[i];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (!(max > min)) return ranks.map(() => min);
  const scale = BINS / (max - min);
  const binOf = (v: number) => Math.min(BINS - 1, Math.floor((v - min) * scale));
  const counts = new Int32Array(BINS);
  for (let i = 0; i < n; i++) counts[binOf(a[i])]++;
  const start = new Float64Array(BINS + 1);
  for (let b = 0; b < BINS; b++) start[b + 1] = start[b] + counts[b];
  // Bin of each rank by binary search on the cumulative counts.
  const binForRank = ranks.map((r) => {
    let lo = 0;
    let hi = BINS - 1;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (start[mid + 1] > r) hi = mid;
      else lo = mid + 1;
    }
    return lo;
  });
  const slot = new Int32Array(BINS).fill(-1);
  const gathered: Float64Array[] = [];
  for (const b of binForRank)
    if (slot[b] < 0) {
      slot[b] = gathered.length;
      gathered.push(new Float64Array(counts[b]));
    }
  const fill = new Int32Array(gathered.length);
  for (let i = 0; i < n; i++) {
    const s = slot[binOf(a[i])];
    if (s >= 0) gathered[s][fill[s]++] = a[i];
  }
  const perBin = new Map<number, number[]>();
  binForRank.forEach((b, k) => {
    const list = perBin.get(b) ?? [];
    list.push(ranks[k] - start[b]);
    perBin.set(b, list);
  });
  const found = new Map<number, number[]>();
  for (const [b, local] of perBin) found.set(b, selectRanks(gathered[slot[b]], local));
  const cursor = new Map<number, number>();
  return binForRank.map((b) => {
    const k = cursor.get(b) ?? 0;
    cursor.set(b, k + 1);
    return found.get(b)![k];
  });
}
