/**
 * Univariate split-plot decomposition for any number of between and within
 * factors. Each within stratum S (a set of within factors, the empty set being
 * the subject-mean stratum) has orthonormal contrast scores Z_S = Y C_S per
 * subject; every between term T is tested on those scores by a least-squares
 * comparison of between-subjects models with sum-to-zero coding, and against
 * the stratum's own error SSCP E_S (subject-by-term error). SS = tr(H),
 * df = df_T · p_S, error df = (N − g) · p_S, as in the multivariate-model
 * route to the univariate repeated-measures table.
 *
 * Type III: SS(T) = RSS(model without T) − RSS(full model).
 * Type II:  SS(T) = RSS(without T and terms containing T) − RSS(without terms containing T).
 * The full model is the cell-means model, so only the g weighted cell means
 * enter the model comparisons; the within-cell part cancels exactly.
 */
import { congruence, kron, orthonormalContrasts, unitAverage, weightedRss, zeros, type Matrix } from './matrix';
import type { SubjectTable } from './repeated-table';

/** One F test of the decomposition. */
export interface SplitPlotTerm {
  /** Between factor indices (plan order) in the term. */
  betweenSet: number[];
  /** Within factor indices (plan order) in the term. */
  withinSet: number[];
  ss: number;
  df1: number;
  errorSs: number;
  errorDf: number;
  /** Index into {@link SplitPlotResult.strata}. */
  stratum: number;
}

/** One within stratum: its contrasts' error SSCP. */
export interface Stratum {
  withinSet: number[];
  /** Number of orthonormal contrasts p_S. */
  p: number;
  /** Error SSCP E_S (p × p). */
  error: Matrix;
  /** Error df of the between-subjects model, N − g (not multiplied by p). */
  modelErrorDf: number;
}

/** Tests and strata of the decomposition. */
export interface SplitPlotResult {
  strata: Stratum[];
  terms: SplitPlotTerm[];
  /** Sum of the error SS of all strata (denominator part of generalized eta squared). */
  totalErrorSs: number;
}

/** All subsets of {0..k−1} in model order: by size, then lexicographically. */
export function termSubsets(k: number): number[][] {
  const out: number[][] = [];
  for (let mask = 0; mask < 1 << k; mask++) {
    const s: number[] = [];
    for (let j = 0; j < k; j++) if (mask & (1 << j)) s.push(j);
    out.push(s);
  }
  return out.sort((a, b) => a.length - b.length || a.join(',').localeCompare(b.join(','), 'en', { numeric: true }));
}

/** Sum-to-zero coding (k × (k − 1)): level i < k−1 → e_i, last level → −1s. */
function contrSum(k: number): Matrix {
  const out = zeros(k, k - 1);
  for (let i = 0; i < k - 1; i++) out.data[i * (k - 1) + i] = 1;
  for (let j = 0; j < k - 1; j++) out.data[(k - 1) * (k - 1) + j] = -1;
  return out;
}

/** Column block of one between term over all g cells (first factor slowest). */
function termBlock(sizes: number[], set: number[]): Matrix {
  let block: Matrix = { rows: 1, cols: 1, data: Float64Array.of(1) };
  sizes.forEach((k, j) => {
    const part = set.includes(j) ? contrSum(k) : { rows: k, cols: 1, data: new Float64Array(k).fill(1) };
    block = kron(block, part);
  });
  return block;
}

/** Horizontal concatenation of column blocks. */
function hcat(blocks: Matrix[], rows: number): Matrix {
  const cols = blocks.reduce((a, b) => a + b.cols, 0);
  const out = zeros(rows, cols);
  let off = 0;
  for (const b of blocks) {
    for (let i = 0; i < rows; i++) for (let j = 0; j < b.cols; j++) out.data[i * cols + off + j] = b.data[i * b.cols + j];
    off += b.cols;
  }
  return out;
}

/** Within contrast matrix C_S (m × p_S) for a set of within factors. */
function withinContrasts(sizes: number[], set: number[]): Matrix {
  let c: Matrix = { rows: 1, cols: 1, data: Float64Array.of(1) };
  sizes.forEach((k, j) => {
    c = kron(c, set.includes(j) ? orthonormalContrasts(k) : unitAverage(k));
  });
  return c;
}

/** Is `a` a strict superset of `b`? */
function strictSuperset(a: number[], b: number[]): boolean {
  return a.length > b.length && b.every((x) => a.includes(x));
}

/** Run the decomposition on a complete-case subject table. */
export function splitPlot(t: SubjectTable, ssType: 2 | 3): SplitPlotResult {
  const { n, m, g, y, cellOf, cellCounts } = t;
  // Cell means (g × m), two-pass so the within-cell SSCP is accurate.
  const means = zeros(g, m);
  for (let s = 0; s < n; s++) {
    const c = cellOf[s];
    for (let w = 0; w < m; w++) means.data[c * m + w] += y[s * m + w];
  }
  for (let c = 0; c < g; c++) for (let w = 0; w < m; w++) means.data[c * m + w] /= cellCounts[c];
  const within = zeros(m, m);
  const dev = new Float64Array(m);
  for (let s = 0; s < n; s++) {
    const c = cellOf[s];
    for (let w = 0; w < m; w++) dev[w] = y[s * m + w] - means.data[c * m + w];
    for (let a = 0; a < m; a++) {
      const da = dev[a];
      for (let b = a; b < m; b++) within.data[a * m + b] += da * dev[b];
    }
  }
  for (let a = 0; a < m; a++) for (let b = 0; b < a; b++) within.data[a * m + b] = within.data[b * m + a];

  const betweenTerms = termSubsets(t.betweenSizes.length);
  const blocks = betweenTerms.map((set) => termBlock(t.betweenSizes, set));
  const dfOf = blocks.map((b) => b.cols);
  const modelErrorDf = n - g;
  // Reduced models per between term, each as a (dropped, kept-out) pair of column sets.
  const design = (exclude: (i: number) => boolean): Matrix =>
    hcat(
      blocks.filter((_, i) => !exclude(i)),
      g,
    );
  const reduced = betweenTerms.map((set, i) => {
    if (ssType === 3) return { without: design((j) => j === i), base: null as Matrix | null };
    const supers = (j: number) => strictSuperset(betweenTerms[j], set);
    const hasSupers = betweenTerms.some((_, j) => supers(j));
    return { without: design((j) => j === i || supers(j)), base: hasSupers ? design(supers) : null };
  });

  const strata: Stratum[] = [];
  const terms: SplitPlotTerm[] = [];
  let totalErrorSs = 0;
  termSubsets(t.withinSizes.length).forEach((wset, si) => {
    const c = withinContrasts(t.withinSizes, wset);
    const p = c.cols;
    const error = congruence(within, c);
    let errorSs = 0;
    for (let a = 0; a < p; a++) errorSs += error.data[a * p + a];
    strata.push({ withinSet: wset, p, error, modelErrorDf });
    totalErrorSs += errorSs;
    // Cell means of the contrast scores (g × p).
    const z = zeros(g, p);
    for (let cc = 0; cc < g; cc++)
      for (let w = 0; w < m; w++) {
        const v = means.data[cc * m + w];
        for (let j = 0; j < p; j++) z.data[cc * p + j] += v * c.data[w * p + j];
      }
    betweenTerms.forEach((bset, i) => {
      if (bset.length === 0 && wset.length === 0) return; // grand mean: not reported
      const r = reduced[i];
      const ss = weightedRss(r.without, z, cellCounts) - (r.base ? weightedRss(r.base, z, cellCounts) : 0);
      terms.push({
        betweenSet: bset,
        withinSet: wset,
        ss: Math.max(ss, 0),
        df1: dfOf[i] * p,
        errorSs,
        errorDf: modelErrorDf * p,
        stratum: si,
      });
    });
  });
  return { strata, terms, totalErrorSs };
}
