/**
 * Between-subjects ANOVA with any number of factors, balanced or not.
 *
 * Sums of squares: Type III with sum-to-zero coding by default, Type II when
 * plan.ssType is 2 (see between-model.ts for the cell-level QR). Every main
 * effect and interaction is tested against the residual of the full factorial
 * model (the pooled within-cell SS). Simple effects in two-factor designs are
 * one-way tests of one factor within each level of the other, each against
 * that same full-model residual mean square (the pooled-error convention).
 *
 * Residual diagnostics: standardized residuals e / (s √(1 − h)) with leverage
 * h = 1/n_cell (the full factorial model fits cell means); outliers beyond ±3;
 * Q-Q points at plotting positions (i − a)/(n + 1 − 2a), a = 3/8 for n ≤ 10
 * and 1/2 otherwise; Shapiro–Wilk on the residuals, or, above 5000 rows, on a
 * systematic subsample of 5000 residuals taken at evenly spaced positions in
 * data order (row ⌊k·n/5000⌋ for k = 0…4999), with a warning.
 */
import type { Assumptions, ComparisonRow, NonparametricRow, RerunResult, SimpleEffectRow, TestRow } from './contract';
import { InputError } from './contract';
import { factorialTerms, termSumsOfSquares } from './between-model';
import { compareBetween } from './comparisons';
import { describeCell, levelRecord, summariseCells, type CellSummary } from './descriptives';
import { fisherF, normal } from './dist';
import { leveneTest } from './levene';
import type { Factor, PreparedData } from './prepared';
import { selectRanks } from './order-statistics';
import { kruskalWallis } from './rank-tests';
import { shapiroWilk } from './shapiro-wilk';

/** Largest sample Shapiro–Wilk accepts (Royston's approximation is valid up to 5000). */
const SW_MAX = 5000;
/** At most this many outliers are listed; the rest are counted in a warning. */
const MAX_OUTLIERS = 100;
/** At most this many Q-Q points. */
const QQ_POINTS = 200;

/** Between-subjects ANOVA table, assumption checks, rank test, simple effects, diagnostics and comparisons. */
export function analyseBetween(d: PreparedData): Partial<RerunResult> {
  const factors = d.between;
  const { alpha } = d.plan;
  const ssType = d.plan.ssType ?? 3;
  const yName = d.outcome.name;
  if (factors.length === 0) throw new InputError('plan.between', 'A between-subjects ANOVA needs at least one factor in plan.between.');
  for (const f of factors)
    if (f.levels.length < 2) throw new InputError(`column ${f.name}`, `Factor "${f.name}" has only one level (${f.levels[0] ?? 'none'}); a factor needs at least two.`);
  const y = d.outcome.values;
  const N = y.length;
  const warnings: string[] = [];
  const { cells, cellOfRow } = summariseCells(y, factors);
  const K = cells.length;
  const levelCounts = factors.map((f) => f.levels.length);
  const possible = levelCounts.reduce((a, b) => a * b, 1);
  if (K < possible) {
    const empty = firstEmptyCell(cells, factors);
    if (ssType === 3)
      throw new InputError(
        'plan.ssType',
        `The cell ${empty} has no observations. Type III sums of squares need every combination of levels observed; use "ssType": 2 or supply data for that cell.`,
      );
    warnings.push(`${possible - K} combination(s) of factor levels have no observations (for example ${empty}); interaction terms involving them have fewer degrees of freedom.`);
  }
  const dfRes = N - K;
  if (dfRes < 1) throw new InputError(`column ${yName}`, `Every cell has a single observation, so there is no residual variance to test against.`);
  let ssRes = 0;
  for (const c of cells) ssRes += c.ss;
  if (!(ssRes > 0)) throw new InputError(`column ${yName}`, `"${yName}" does not vary within any cell; the F ratios are undefined.`);
  const msRes = ssRes / dfRes;
  const singles = cells.filter((c) => c.n === 1).length;
  if (singles > 0) warnings.push(`${singles} cell(s) have a single observation; they add nothing to the residual variance.`);

  const terms = factorialTerms(factors.length);
  const termSs = termSumsOfSquares(cells, levelCounts, terms, ssType);
  const oneWay = factors.length === 1;
  const tests: TestRow[] = terms.map((t, i) => {
    const { ss, df } = termSs[i];
    const term = t.factors.map((f) => factors[f].name).join(':');
    const ms = ss / df;
    const value = ms / msRes;
    const row: TestRow = { term, statistic: 'F', value, df1: df, df2: dfRes, p: fisherF(df, dfRes).sf(value), ss, ms, errorSs: ssRes, errorDf: dfRes, partialEtaSq: ss / (ss + ssRes) };
    if (oneWay) {
      row.etaSq = ss / (ss + ssRes);
      row.omegaSq = (ss - df * msRes) / (ss + ssRes + msRes);
    }
    return row;
  });
  const aliasedTerm = termSs.findIndex((t) => t.df === 0);
  if (aliasedTerm >= 0) throw new InputError('plan.between', `The term "${tests[aliasedTerm].term}" cannot be estimated from the observed cells (no degrees of freedom left).`);

  const buckets = bucketByCell(y, cellOfRow, cells);
  const diag = residualDiagnostics(d, cells, cellOfRow, msRes, warnings);
  const assumptions: Assumptions = {
    levene: leveneTest(buckets, 'mean'),
    // The median selection may reorder the private buckets; nothing later depends on their order.
    brownForsythe: leveneTest(buckets, 'median', true),
    ...(diag.normality ? { normality: diag.normality } : {}),
    varianceRatio: varianceRatio(cells),
  };

  const result: Partial<RerunResult> = {
    descriptives: cells.map((c) => describeCell(c, levelRecord(factors, c.levels), d.outcome.offset, alpha)),
    tests,
    residual: { ss: ssRes, df: dfRes, ms: msRes },
    assumptions,
    outliers: diag.outliers,
    qq: diag.qq,
    warnings,
  };
  if (oneWay) {
    const welch = welchAnova(cells);
    if (welch) tests.push({ term: factors[0].name, statistic: 'F', variant: 'welch', ...welch, p: fisherF(welch.df1, welch.df2).sf(welch.value) });
    else warnings.push(`Welch's ANOVA is not reported: it needs at least two observations and some variation in every group of "${factors[0].name}".`);
    for (const b of buckets) b.sort();
    const kw = kruskalWallis(buckets, true);
    const np: NonparametricRow = { term: factors[0].name, method: 'kruskal-wallis', value: kw.value, df: kw.df, p: kw.p };
    result.nonparametric = [np];
  }
  if (factors.length === 2) result.simpleEffects = simpleEffects(cells, factors, msRes, dfRes);
  const comparisons = requestedComparisons(d, cells, msRes, dfRes);
  if (comparisons.length > 0) result.comparisons = comparisons;
  return result;
}

/** "a = x, b = y" for the first level combination without data. */
function firstEmptyCell(cells: CellSummary[], factors: Factor[]): string {
  const seen = new Set(cells.map((c) => c.levels.join(',')));
  const idx = factors.map(() => 0);
  for (;;) {
    if (!seen.has(idx.join(','))) return factors.map((f, i) => `${f.name} = ${f.levels[idx[i]]}`).join(', ');
    let f = factors.length - 1;
    while (f >= 0 && ++idx[f] === factors[f].levels.length) idx[f--] = 0;
    if (f < 0) return '(none)';
  }
}

/** Outcome values grouped by cell (counting sort, data order kept within a cell). */
function bucketByCell(y: Float64Array, cellOfRow: Int32Array, cells: CellSummary[]): Float64Array[] {
  const starts = new Int32Array(cells.length + 1);
  cells.forEach((c, i) => (starts[i + 1] = starts[i] + c.n));
  const fill = starts.slice(0, cells.length);
  const all = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) all[fill[cellOfRow[i]]++] = y[i];
  return cells.map((_, i) => all.subarray(starts[i], starts[i + 1]));
}

/** Largest over smallest cell variance among cells with at least two observations. */
function varianceRatio(cells: CellSummary[]): number {
  let lo = Infinity;
  let hi = 0;
  for (const c of cells) {
    if (c.n < 2) continue;
    const v = c.ss / (c.n - 1);
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return hi / lo;
}

/** Welch's heteroscedastic one-way ANOVA, or null when a group has n < 2 or zero variance. */
export function welchAnova(groups: { n: number; mean: number; ss: number }[]): { value: number; df1: number; df2: number } | null {
  const k = groups.length;
  if (groups.some((g) => g.n < 2 || !(g.ss > 0))) return null;
  const w = groups.map((g) => g.n / (g.ss / (g.n - 1)));
  const W = w.reduce((a, b) => a + b, 0);
  const m = groups.reduce((a, g, i) => a + w[i] * g.mean, 0) / W;
  let A = 0;
  let tmp = 0;
  groups.forEach((g, i) => {
    A += w[i] * (g.mean - m) ** 2;
    tmp += (1 - w[i] / W) ** 2 / (g.n - 1);
  });
  A /= k - 1;
  const B = 1 + ((2 * (k - 2)) / (k * k - 1)) * tmp;
  return { value: A / B, df1: k - 1, df2: (k * k - 1) / (3 * tmp) };
}

/** One-way tests of each factor within each level of the other (two-factor designs), on the full model's residual MS. */
function simpleEffects(cells: CellSummary[], factors: Factor[], msRes: number, dfRes: number): SimpleEffectRow[] {
  const rows: SimpleEffectRow[] = [];
  for (const [tested, at] of [
    [0, 1],
    [1, 0],
  ]) {
    for (let level = 0; level < factors[at].levels.length; level++) {
      const slice = cells.filter((c) => c.levels[at] === level);
      if (slice.length < 2) continue;
      const n = slice.reduce((a, c) => a + c.n, 0);
      const m = slice.reduce((a, c) => a + c.n * c.mean, 0) / n;
      const ss = slice.reduce((a, c) => a + c.n * (c.mean - m) ** 2, 0);
      const df1 = slice.length - 1;
      const value = ss / df1 / msRes;
      rows.push({ factor: factors[tested].name, at: { factor: factors[at].name, level: factors[at].levels[level] }, df1, df2: dfRes, ss, value, p: fisherF(df1, dfRes).sf(value) });
    }
  }
  return rows;
}

/**
 * Pairwise comparisons requested in the plan for between factors. Groups are
 * the factor's marginal raw groups; their means stay on the centred scale
 * (every comparison output is a difference of means, which is shift-invariant).
 */
function requestedComparisons(d: PreparedData, cells: CellSummary[], msRes: number, dfRes: number): ComparisonRow[] {
  const out: ComparisonRow[] = [];
  for (const req of d.plan.comparisons ?? []) {
    const fi = d.between.findIndex((f) => f.name === req.factor);
    if (fi < 0) throw new InputError('plan.comparisons', `Comparisons were requested for "${req.factor}", which is not one of the between-subjects factors (${d.between.map((f) => f.name).join(', ')}).`);
    const f = d.between[fi];
    const groups = f.levels.map((level, li) => {
      const members = cells.filter((c) => c.levels[fi] === li);
      const n = members.reduce((a, c) => a + c.n, 0);
      const mean = members.reduce((a, c) => a + c.n * c.mean, 0) / n;
      const ss = members.reduce((a, c) => a + c.ss + c.n * (c.mean - mean) ** 2, 0);
      return { level, n, mean, variance: n > 1 ? ss / (n - 1) : NaN };
    });
    out.push(...compareBetween(f.name, groups, req.method, { ms: msRes, df: dfRes }, d.plan.alpha));
  }
  return out;
}

/** Standardized residuals, outliers, Q-Q points and Shapiro–Wilk on the residuals. */
function residualDiagnostics(d: PreparedData, cells: CellSummary[], cellOfRow: Int32Array, msRes: number, warnings: string[]) {
  const y = d.outcome.values;
  const N = y.length;
  const s = Math.sqrt(msRes);
  const scale = cells.map((c) => (c.n > 1 ? 1 / (s * Math.sqrt(1 - 1 / c.n)) : NaN));
  const pool = new Float64Array(N);
  const outliers: { row: number; value: number }[] = [];
  let finite = 0;
  for (let i = 0; i < N; i++) {
    const c = cellOfRow[i];
    const v = (y[i] - cells[c].mean) * scale[c];
    // Cells of one observation have no standardized residual (NaN): left out of the Q-Q points.
    if (v === v) pool[finite++] = v;
    if (Math.abs(v) > 3) outliers.push({ row: d.rowNumbers[i], value: v });
  }
  if (outliers.length > MAX_OUTLIERS) {
    warnings.push(`${outliers.length} standardized residuals lie beyond ±3; the ${MAX_OUTLIERS} largest are listed.`);
    outliers.sort((a, b) => Math.abs(b.value) - Math.abs(a.value));
    outliers.length = MAX_OUTLIERS;
    outliers.sort((a, b) => a.row - b.row);
  }
  const m = Math.min(QQ_POINTS, finite);
  const ranks = Array.from({ length: m }, (_, k) => (m === 1 ? 0 : Math.round((k * (finite - 1)) / (m - 1))));
  const observed = selectRanks(pool.subarray(0, finite), ranks);
  const a = finite <= 10 ? 3 / 8 : 1 / 2;
  const z = normal();
  const qq = ranks.map((idx, k) => ({ theoretical: z.quantile((idx + 1 - a) / (finite + 1 - 2 * a)), observed: observed[k] }));
  let normality: Assumptions['normality'];
  if (N >= 3) {
    let sample: Float64Array;
    if (N <= SW_MAX) {
      sample = new Float64Array(N);
      for (let i = 0; i < N; i++) sample[i] = y[i] - cells[cellOfRow[i]].mean;
    } else {
      sample = new Float64Array(SW_MAX);
      for (let k = 0; k < SW_MAX; k++) {
        const i = Math.floor((k * N) / SW_MAX);
        sample[k] = y[i] - cells[cellOfRow[i]].mean;
      }
      warnings.push(`The Shapiro–Wilk test was run on 5000 residuals taken at evenly spaced positions in data order (of ${N}); the test is defined up to 5000 values.`);
    }
    const sw = shapiroWilk(sample);
    normality = { method: 'shapiro-wilk', W: sw.W, p: sw.p, n: sample.length };
  }
  return { outliers, qq, normality };
}
