/**
 * Tests of equal variances across groups: Levene's test (absolute deviations
 * from the group mean) and the Brown–Forsythe variant (absolute deviations from
 * the group median), each a one-way ANOVA F on those deviations. With several
 * factors the groups are all the cells of the design, and the median is the
 * plain sample median of each cell (no observation is dropped for odd n).
 */
import type { VarianceTest } from './contract';
import { fisherF } from './dist';
import { meanAndSs } from './linear-model';
import { medianOf } from './order-statistics';

/**
 * Levene-type test of equal variances. `center: 'mean'` is Levene's test,
 * `'median'` the Brown–Forsythe variant. With `mayReorder` the groups (which
 * must then be Float64Arrays) may be permuted in place, saving a copy for the
 * median on large data.
 */
export function leveneTest(groups: ArrayLike<number>[], center: 'mean' | 'median', mayReorder = false): VarianceTest {
  const k = groups.length;
  // Group statistics of z = |y − centre|, two passes per group, without storing z.
  const stats = groups.map((g) => {
    let c: number;
    if (center === 'mean') c = meanAndSs(g).mean;
    else c = medianOf(mayReorder && g instanceof Float64Array ? g : Float64Array.from(g));
    const n = g.length;
    let s = 0;
    for (let i = 0; i < n; i++) s += Math.abs(g[i] - c);
    const mean = s / n;
    let ss = 0;
    for (let i = 0; i < n; i++) {
      const e = Math.abs(g[i] - c) - mean;
      ss += e * e;
    }
    return { n, mean, ss };
  });
  const { ssBetween, ssWithin, n } = decompose(stats);
  const df1 = k - 1;
  const df2 = n - k;
  const value = ssBetween / df1 / (ssWithin / df2);
  const p = Number.isFinite(value) ? fisherF(df1, df2).sf(value) : NaN;
  return { center, value, df1, df2, p };
}

/** Between- and within-group sums of squares of a one-way layout (two-pass per group). */
export function oneWaySs(groups: ArrayLike<number>[]): { ssBetween: number; ssWithin: number; n: number } {
  return decompose(groups.map((g) => ({ n: g.length, ...meanAndSs(g) })));
}

/** One-way SS decomposition from group sizes, means and within SS. */
function decompose(stats: { n: number; mean: number; ss: number }[]): { ssBetween: number; ssWithin: number; n: number } {
  let n = 0;
  let s = 0;
  for (const g of stats) {
    n += g.n;
    s += g.n * g.mean;
  }
  let grand = s / n;
  let corr = 0;
  for (const g of stats) corr += g.n * (g.mean - grand);
  grand += corr / n;
  let ssBetween = 0;
  let ssWithin = 0;
  for (const g of stats) {
    ssBetween += g.n * (g.mean - grand) ** 2;
    ssWithin += g.ss;
  }
  return { ssBetween, ssWithin, n };
}
