/**
 * Pairwise comparisons among the levels of one factor.
 *
 * Pairs are listed in level order: a is the earlier level, b the later one,
 * estimate = mean(a) − mean(b), statistic = estimate / se.
 *
 * Interval conventions (documented in docs/rerun-contract.md by the contract owner):
 * - tukey, games-howell: simultaneous 1 − alpha intervals from the studentized range;
 * - bonferroni, holm: Bonferroni-adjusted intervals (each at 1 − alpha/m), because
 *   Holm's step-down has no matching simultaneous interval;
 * - bh: unadjusted 1 − alpha intervals, because the false discovery rate has no
 *   interval counterpart.
 */
import type { ComparisonMethod, ComparisonRow } from './contract';
import { InputError } from './contract';
import { studentT, studentizedRange } from './dist/index';
import { adjustP } from './p-adjust';

/** Summary of one group for between-subjects comparisons. */
export interface GroupSummary {
  level: string;
  n: number;
  mean: number;
  variance: number;
}

interface RawPair {
  a: string;
  b: string;
  estimate: number;
  se: number;
  df: number;
}

function pairsOf<T>(items: T[]): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < items.length; i++) for (let j = i + 1; j < items.length; j++) out.push([i, j]);
  return out;
}

/** Two-sided t p-values, adjusted p and intervals for the t-test based methods. */
function tFamily(factor: string, method: ComparisonMethod, raw: RawPair[], alpha: number): ComparisonRow[] {
  const m = raw.length;
  const p = raw.map((r) => Math.min(1, 2 * studentT(r.df).sf(Math.abs(r.estimate / r.se))));
  const adjust = method === 'bh' ? 'bh' : method === 'holm' ? 'holm' : 'bonferroni';
  const pAdj = adjustP(p, adjust);
  const level = method === 'bh' ? alpha : alpha / m;
  return raw.map((r, i) => {
    const half = studentT(r.df).quantile(1 - level / 2) * r.se;
    return {
      factor,
      method,
      a: r.a,
      b: r.b,
      estimate: r.estimate,
      se: r.se,
      statistic: r.estimate / r.se,
      df: r.df,
      p: p[i],
      pAdjusted: pAdj[i],
      ciLower: r.estimate - half,
      ciUpper: r.estimate + half,
    };
  });
}

/** Studentized-range p (via |t|·√2) and simultaneous interval for one pair. */
function rangeRow(factor: string, method: ComparisonMethod, r: RawPair, k: number, alpha: number): ComparisonRow {
  const t = r.estimate / r.se;
  const dist = studentizedRange(k, r.df);
  const half = (dist.quantile(1 - alpha) / Math.SQRT2) * r.se;
  return {
    factor,
    method,
    a: r.a,
    b: r.b,
    estimate: r.estimate,
    se: r.se,
    statistic: t,
    df: r.df,
    p: null,
    pAdjusted: Math.min(1, Math.max(0, dist.sf(Math.abs(t) * Math.SQRT2))),
    ciLower: r.estimate - half,
    ciUpper: r.estimate + half,
  };
}

/**
 * Pairwise comparisons among independent groups.
 *
 * tukey: Tukey–Kramer (exact Tukey HSD for equal n), se = √(ms (1/n_a + 1/n_b)),
 * p from the studentized range with k groups and the error df.
 * games-howell: se = √(s²_a/n_a + s²_b/n_b), Welch–Satterthwaite df per pair,
 * studentized range with k groups at that df; ignores `error`.
 * bonferroni, holm, bh: t tests on the pooled error ms/df; `p` unadjusted.
 */
export function compareBetween(
  factor: string,
  groups: GroupSummary[],
  method: ComparisonMethod,
  error: { ms: number; df: number },
  alpha: number,
): ComparisonRow[] {
  const k = groups.length;
  if (k < 2) throw new InputError(`factor ${factor}`, `Pairwise comparisons on "${factor}" need at least two levels with data.`);
  for (const g of groups)
    if (!(g.n >= 1)) throw new InputError(`factor ${factor}`, `Level "${g.level}" of "${factor}" has no observations to compare.`);
  if (method === 'games-howell') {
    for (const g of groups)
      if (g.n < 2)
        throw new InputError(
          `factor ${factor}`,
          `Games–Howell comparisons on "${factor}" need at least two observations in every level; level "${g.level}" has ${g.n}.`,
        );
    return pairsOf(groups).map(([i, j]) => {
      const a = groups[i];
      const b = groups[j];
      const va = a.variance / a.n;
      const vb = b.variance / b.n;
      const se = Math.sqrt(va + vb);
      if (!(se > 0))
        throw new InputError(
          `factor ${factor}`,
          `Games–Howell comparison of "${a.level}" and "${b.level}" on "${factor}" is undefined: neither level varies.`,
        );
      const df = (va + vb) ** 2 / ((va * va) / (a.n - 1) + (vb * vb) / (b.n - 1));
      return rangeRow(factor, method, { a: a.level, b: b.level, estimate: a.mean - b.mean, se, df }, k, alpha);
    });
  }
  if (!(error.ms > 0) || !(error.df > 0))
    throw new InputError(`factor ${factor}`, `Pairwise comparisons on "${factor}" need a positive error variance and error df (got ms = ${error.ms}, df = ${error.df}).`);
  const raw = pairsOf(groups).map(([i, j]): RawPair => {
    const a = groups[i];
    const b = groups[j];
    return { a: a.level, b: b.level, estimate: a.mean - b.mean, se: Math.sqrt(error.ms * (1 / a.n + 1 / b.n)), df: error.df };
  });
  if (method === 'tukey') return raw.map((r) => rangeRow(factor, method, r, k, alpha));
  return tFamily(factor, method, raw, alpha);
}

/**
 * Why a within-factor family fell back to Bonferroni, or null when the method
 * applies as asked. The studentized range assumes independent groups with a
 * common variance, which paired differences of repeated measures do not satisfy.
 */
export function withinComparisonNote(factor: string, method: ComparisonMethod): string | null {
  if (method !== 'tukey' && method !== 'games-howell') return null;
  const name = method === 'tukey' ? 'Tukey' : 'Games–Howell';
  return (
    `Comparisons on the within-subjects factor "${factor}" were asked for with ${name}; its studentized-range ` +
    `reference assumes independent groups, which repeated measures are not, so paired t tests with a ` +
    `Bonferroni adjustment (and Bonferroni-adjusted intervals) are reported instead under the label "${method}".`
  );
}

/**
 * Pairwise comparisons among the levels of a within-subjects factor by paired
 * t tests (df = subjects − 1). scores[i][s] is subject s's mean at level i.
 * bonferroni, holm, bh adjust as named; tukey and games-howell fall back to
 * Bonferroni (see {@link withinComparisonNote}) but keep the requested method label.
 */
export function compareWithin(
  factor: string,
  levels: string[],
  scores: Float64Array[],
  method: ComparisonMethod,
  alpha: number,
): ComparisonRow[] {
  if (levels.length < 2) throw new InputError(`factor ${factor}`, `Pairwise comparisons on "${factor}" need at least two levels.`);
  if (scores.length !== levels.length) throw new RangeError('one score vector per level is required');
  const n = scores[0].length;
  if (n < 2) throw new InputError(`factor ${factor}`, `Paired comparisons on "${factor}" need at least two complete subjects (found ${n}).`);
  const raw = pairsOf(levels).map(([i, j]): RawPair => {
    const x = scores[i];
    const y = scores[j];
    let mean = 0;
    for (let s = 0; s < n; s++) mean += x[s] - y[s];
    mean /= n;
    let ss = 0;
    for (let s = 0; s < n; s++) ss += (x[s] - y[s] - mean) ** 2;
    const se = Math.sqrt(ss / (n - 1) / n);
    if (!(se > 0))
      throw new InputError(
        `factor ${factor}`,
        `Levels "${levels[i]}" and "${levels[j]}" of "${factor}" differ by the same amount for every subject, so a paired t test is undefined.`,
      );
    return { a: levels[i], b: levels[j], estimate: mean, se, df: n - 1 };
  });
  const effective: ComparisonMethod = method === 'tukey' || method === 'games-howell' ? 'bonferroni' : method;
  return tFamily(factor, effective, raw, alpha).map((r) => ({ ...r, method }));
}
