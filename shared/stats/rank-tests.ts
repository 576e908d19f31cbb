/**
 * Rank-based alternatives: Mann–Whitney U (two independent groups), Wilcoxon
 * signed-rank (paired differences) and Kruskal–Wallis H (k groups), all with
 * mid-ranks for ties and the usual tie corrections.
 *
 * Exact or approximate p (two-sided), decided as R's wilcox.test does by
 * default: the exact null distribution when every sample has fewer than 50
 * values and there are no ties (and, for the signed-rank test, no zero
 * differences); otherwise the normal approximation with a continuity
 * correction of 0.5 towards the mean and a tie-corrected variance. Zero
 * differences are dropped before the signed-rank test (and force the normal
 * approximation). Kruskal–Wallis always uses the chi-square approximation.
 */
import { chiSquare, normal } from './dist';

/** Result of a two-sided rank test. */
export interface RankTestResult {
  /** W = U for Mann–Whitney (pairs x > y, ties count ½); V = sum of positive ranks for Wilcoxon. */
  value: number;
  p: number;
  /** True when the exact null distribution was used. */
  exact: boolean;
  /** Number of values ranked (after dropping zero differences, for Wilcoxon). */
  n: number;
}

/** Mann–Whitney U test of x against y (two-sided); value is R's W, the U of x. */
export function mannWhitney(x: ArrayLike<number>, y: ArrayLike<number>): RankTestResult {
  const nx = x.length;
  const ny = y.length;
  const sx = Float64Array.from(x).sort();
  const sy = Float64Array.from(y).sort();
  const { sums, tieTerm } = rankSums([sx, sy]);
  const W = sums[0] - (nx * (nx + 1)) / 2;
  const exact = nx < 50 && ny < 50 && tieTerm === 0;
  let p: number;
  if (exact) {
    const dist = mannWhitneyDistribution(nx, ny);
    p = W > (nx * ny) / 2 ? upperTail(dist, W) : lowerTail(dist, W);
    p = Math.min(1, 2 * p);
  } else {
    const N = nx + ny;
    const sigma = Math.sqrt(((nx * ny) / 12) * (N + 1 - tieTerm / (N * (N - 1))));
    p = continuityCorrectedP(W - (nx * ny) / 2, sigma);
  }
  return { value: W, p, exact, n: nx + ny };
}

/** Wilcoxon signed-rank test that the differences are centred on 0 (two-sided). */
export function wilcoxonSignedRank(differences: ArrayLike<number>): RankTestResult {
  const pos: number[] = [];
  const neg: number[] = [];
  let zeros = 0;
  for (let i = 0; i < differences.length; i++) {
    const v = differences[i];
    if (v > 0) pos.push(v);
    else if (v < 0) neg.push(-v);
    else zeros++;
  }
  const n = pos.length + neg.length;
  if (n === 0) return { value: 0, p: NaN, exact: false, n };
  const { sums, tieTerm } = rankSums([Float64Array.from(pos).sort(), Float64Array.from(neg).sort()]);
  const V = sums[0];
  const exact = n < 50 && tieTerm === 0 && zeros === 0;
  let p: number;
  if (exact) {
    const dist = signedRankDistribution(n);
    p = V > (n * (n + 1)) / 4 ? upperTail(dist, V) : lowerTail(dist, V);
    p = Math.min(1, 2 * p);
  } else {
    const sigma = Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24 - tieTerm / 48);
    p = continuityCorrectedP(V - (n * (n + 1)) / 4, sigma);
  }
  return { value: V, p, exact, n };
}

/** Kruskal–Wallis H across groups, tie-corrected, with its chi-square p on k − 1 df. */
export function kruskalWallis(groups: ArrayLike<number>[], presorted = false): { value: number; df: number; p: number } {
  const sorted = groups.map((g) => (presorted ? g : Float64Array.from(g).sort()));
  const { sums, tieTerm } = rankSums(sorted);
  const N = sorted.reduce((a, g) => a + g.length, 0);
  const centre = (N + 1) / 2;
  // Σ n_i (R̄_i − (N+1)/2)² avoids the cancellation in Σ R_i²/n_i − 3(N+1).
  let s = 0;
  sorted.forEach((g, i) => {
    if (g.length > 0) s += g.length * (sums[i] / g.length - centre) ** 2;
  });
  const H = ((12 / (N * (N + 1))) * s) / (1 - tieTerm / (N * N * N - N));
  const df = sorted.filter((g) => g.length > 0).length - 1;
  return { value: H, df, p: chiSquare(df).sf(H) };
}

/**
 * Mid-rank sums of each group in the pooled ranking, and Σ(t³ − t) over tie
 * runs. Each group must be sorted ascending; the pooled order is found by a
 * k-way merge, so no pooled sort is needed.
 */
export function rankSums(sortedGroups: ArrayLike<number>[]): { sums: Float64Array; tieTerm: number } {
  const k = sortedGroups.length;
  const pos = new Int32Array(k);
  const sums = new Float64Array(k);
  const inRun = new Int32Array(k);
  let rank = 0;
  let tieTerm = 0;
  for (;;) {
    let min = Infinity;
    let any = false;
    for (let g = 0; g < k; g++) {
      if (pos[g] < sortedGroups[g].length) {
        const v = sortedGroups[g][pos[g]];
        if (!any || v < min) min = v;
        any = true;
      }
    }
    if (!any) break;
    let t = 0;
    for (let g = 0; g < k; g++) {
      const arr = sortedGroups[g];
      let c = 0;
      while (pos[g] + c < arr.length && arr[pos[g] + c] === min) c++;
      inRun[g] = c;
      t += c;
    }
    const mid = rank + (t + 1) / 2;
    for (let g = 0; g < k; g++) {
      if (inRun[g] > 0) {
        sums[g] += inRun[g] * mid;
        pos[g] += inRun[g];
      }
    }
    rank += t;
    if (t > 1) tieTerm += t * t * t - t;
  }
  return { sums, tieTerm };
}

/** Two-sided normal p for a centred statistic, with a continuity correction of 0.5 towards 0. */
function continuityCorrectedP(z0: number, sigma: number): number {
  const z = (z0 - Math.sign(z0) * 0.5) / sigma;
  const std = normal();
  return 2 * Math.min(std.cdf(z), std.sf(z));
}

/**
 * Exact null probabilities of U (pairs x > y) for sizes m, n, by the
 * recursion on which sample holds the largest value:
 * P_{m,n}(u) = m/(m+n) · P_{m−1,n}(u − n) + n/(m+n) · P_{m,n−1}(u). Only
 * additions of positive terms, so tail probabilities keep full precision.
 */
export function mannWhitneyDistribution(m: number, n: number): Float64Array {
  // prev[j] = distribution for (i − 1, j); cur[j] for (i, j).
  let prev: Float64Array[] = [];
  for (let j = 0; j <= n; j++) prev.push(Float64Array.of(1));
  for (let i = 1; i <= m; i++) {
    const cur: Float64Array[] = [Float64Array.of(1)];
    for (let j = 1; j <= n; j++) {
      const out = new Float64Array(i * j + 1);
      const a = prev[j];
      const b = cur[j - 1];
      const wa = i / (i + j);
      const wb = j / (i + j);
      for (let u = 0; u < a.length; u++) out[u + j] += wa * a[u];
      for (let u = 0; u < b.length; u++) out[u] += wb * b[u];
      cur.push(out);
    }
    prev = cur;
  }
  return prev[n];
}

/** Exact null probabilities of the signed-rank sum V for n non-zero, untied differences. */
export function signedRankDistribution(n: number): Float64Array {
  const max = (n * (n + 1)) / 2;
  let p = new Float64Array(max + 1);
  p[0] = 1;
  for (let r = 1; r <= n; r++) {
    const next = new Float64Array(max + 1);
    for (let v = 0; v <= max; v++) {
      if (p[v] === 0) continue;
      next[v] += 0.5 * p[v];
      next[v + r] += 0.5 * p[v];
    }
    p = next;
  }
  return p;
}

/** P(X ≤ x) for a distribution on 0, 1, 2, …. */
function lowerTail(dist: Float64Array, x: number): number {
  let s = 0;
  for (let u = 0; u <= Math.floor(x) && u < dist.length; u++) s += dist[u];
  return s;
}

/** P(X ≥ x) for a distribution on 0, 1, 2, …. */
function upperTail(dist: Float64Array, x: number): number {
  let s = 0;
  for (let u = dist.length - 1; u >= Math.ceil(x); u--) s += dist[u];
  return s;
}
