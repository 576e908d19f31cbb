/**
 * Sums of squares for a between-subjects factorial model, computed on the
 * cells rather than the rows.
 *
 * All rows of a cell share one design row, so the least-squares problem on N
 * rows reduces exactly to a weighted problem on the K non-empty cells: row c is
 * √n_c · x_c with response √n_c · ȳ_c, and for any sub-model
 * RSS_rows = RSS_cells + Σ_c SS_within(c). The within-cell SS (two-pass per
 * cell) is the pure residual of the full factorial model. Each term's SS is
 * the sequential SS of its columns placed last in a Householder QR fit:
 * after all other terms (Type III, sum-to-zero coding) or after every term
 * that does not contain it (Type II). Nothing is obtained by subtracting two
 * residual sums, so no digits are lost to cancellation.
 */
import { lastBlockSs, qrFit } from './linear-model';

/** One model term: a set of factor indices (plan order). */
export interface ModelTerm {
  factors: number[];
  /** Bit mask of `factors`. */
  mask: number;
}

/** All main effects and interactions of `k` factors, main effects first, then by plan order. */
export function factorialTerms(k: number): ModelTerm[] {
  const terms: ModelTerm[] = [];
  for (let mask = 1; mask < 1 << k; mask++) {
    const factors: number[] = [];
    for (let f = 0; f < k; f++) if (mask & (1 << f)) factors.push(f);
    terms.push({ factors, mask });
  }
  terms.sort((a, b) => a.factors.length - b.factors.length || compareLex(a.factors, b.factors));
  return terms;
}

/** SS and df (number of non-aliased columns) of one term. */
export interface TermSs {
  ss: number;
  df: number;
}

/**
 * Type II or Type III sums of squares of every term, from cell counts, cell
 * means (centred scale) and each cell's level index per factor.
 */
export function termSumsOfSquares(
  cells: { n: number; mean: number; levels: number[] }[],
  levelCounts: number[],
  terms: ModelTerm[],
  ssType: 2 | 3,
): TermSs[] {
  const w = cells.map((c) => Math.sqrt(c.n));
  const y = cells.map((c, i) => w[i] * c.mean);
  const intercept = Float64Array.from(w);
  const termColumns = terms.map((t) => effectColumns(cells, levelCounts, t.factors, w));
  return terms.map((t, ti) => {
    const others = terms
      .map((s, si) => ({ s, si }))
      .filter(({ s, si }) => si !== ti && (ssType === 3 || (s.mask & t.mask) !== t.mask));
    const columns: Float64Array[] = [intercept];
    for (const { si } of others) columns.push(...termColumns[si]);
    const blockStart = columns.length;
    columns.push(...termColumns[ti]);
    const fit = qrFit(columns, y);
    return lastBlockSs(fit, blockStart);
  });
}

/**
 * Sum-to-zero (effect) coded columns of a term at the cell level, weighted by
 * √n_c: for a factor with L levels, column j is +1 at level j, −1 at the last
 * level, 0 elsewhere; interaction columns are products.
 */
function effectColumns(cells: { levels: number[] }[], levelCounts: number[], factors: number[], w: number[]): Float64Array[] {
  let combos: number[][] = [[]];
  for (const f of factors) {
    const next: number[][] = [];
    for (const c of combos) for (let j = 0; j < levelCounts[f] - 1; j++) next.push([...c, j]);
    combos = next;
  }
  return combos.map((js) => {
    const col = new Float64Array(cells.length);
    cells.forEach((cell, i) => {
      let v = w[i];
      factors.forEach((f, q) => {
        const level = cell.levels[f];
        v *= level === js[q] ? 1 : level === levelCounts[f] - 1 ? -1 : 0;
      });
      col[i] = v;
    });
    return col;
  });
}

function compareLex(a: number[], b: number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}
