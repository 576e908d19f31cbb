/**
 * Least squares by Householder QR, with rank detection, plus the two-pass
 * moments every family builds on.
 *
 * Why QR and not the normal equations: forming X'X squares the condition
 * number, which is what loses digits on ill-conditioned designs (polynomials,
 * collinear predictors). Householder reflections keep it as it is.
 *
 * Rank detection follows the usual "limited pivoting" rule: a column whose
 * norm, after removing the part explained by earlier columns, falls below
 * `tol` (default 1e-7) times its original norm is declared aliased and skipped;
 * later columns still enter. Column order therefore matters, which is what the
 * sequential sums of squares of an ANOVA need.
 */

/** Mean and sum of squared deviations of `x`, by two passes (the second pass corrects the mean). */
export function meanAndSs(x: ArrayLike<number>, from = 0, to = x.length): { mean: number; ss: number } {
  const n = to - from;
  if (n <= 0) return { mean: NaN, ss: NaN };
  let s = 0;
  for (let i = from; i < to; i++) s += x[i];
  let mean = s / n;
  let dev = 0;
  let ss = 0;
  for (let i = from; i < to; i++) {
    const e = x[i] - mean;
    dev += e;
    ss += e * e;
  }
  // Corrected two-pass: dev is the rounding error left in the first mean.
  mean += dev / n;
  ss -= (dev * dev) / n;
  return { mean, ss: ss < 0 ? 0 : ss };
}

/** A least-squares fit of y on the columns of X. */
export interface QrFit {
  /** Number of rows. */
  n: number;
  /** Number of columns of X. */
  p: number;
  /** Numerical rank of X. */
  rank: number;
  /** aliased[j] is true when column j is (numerically) a combination of earlier columns. */
  aliased: boolean[];
  /** Column index of each pivot, in order: pivotColumns[k] is the column behind effect k. */
  pivotColumns: number[];
  /** Coefficients in column order; NaN for aliased columns. */
  coef: Float64Array;
  /** Q'y: entries 0..rank-1 are the sequential effects of the pivot columns, the rest are residual. */
  effects: Float64Array;
  /** Residual sum of squares, summed from the residual part of Q'y (no cancellation). */
  rss: number;
  /** Residual degrees of freedom, n − rank. */
  dfResidual: number;
  /** Upper-triangular R (rank × rank) in pivot order, row-major. */
  r: Float64Array;
  /** Householder vectors (entries from their pivot row on) and their v'v/2, one per pivot: Q' = H_rank…H_1. */
  reflectors: { v: Float64Array; beta: number }[];
}

/**
 * Fits y ≈ Xb by Householder QR. `columns` holds X column by column (each of
 * length n); nothing is modified. Rows can be weighted by pre-multiplying both
 * X rows and y by sqrt(weight).
 */
export function qrFit(columns: ArrayLike<number>[], y: ArrayLike<number>, tol = 1e-7): QrFit {
  const p = columns.length;
  const n = y.length;
  const work = columns.map((c) => Float64Array.from(c));
  const qty = Float64Array.from(y);
  const aliased: boolean[] = new Array(p).fill(false);
  const pivotColumns: number[] = [];
  const originalNorm = work.map((c) => norm2(c, 0));
  // R entries for each pivot row k, by column: rRows[k][j].
  const rRows: Float64Array[] = [];
  const reflectors: { v: Float64Array; beta: number }[] = [];
  let k = 0;
  for (let j = 0; j < p; j++) {
    const col = work[j];
    const nrm = k < n ? norm2(col, k) : 0;
    if (k >= n || originalNorm[j] === 0 || nrm <= tol * originalNorm[j]) {
      aliased[j] = true;
      continue;
    }
    // Householder vector v = x + sign(x_k)‖x‖e_k stored in col[k..]; H = I − v v'/(‖x‖ |v_k|).
    const alpha = col[k] >= 0 ? -nrm : nrm;
    const vk = col[k] - alpha;
    col[k] = vk;
    const beta = -vk * alpha; // v'v / 2
    const row = new Float64Array(p);
    row[j] = alpha;
    for (let l = j + 1; l < p; l++) {
      const other = work[l];
      let s = 0;
      for (let i = k; i < n; i++) s += col[i] * other[i];
      const f = s / beta;
      for (let i = k; i < n; i++) other[i] -= f * col[i];
      row[l] = other[k];
    }
    let s = 0;
    for (let i = k; i < n; i++) s += col[i] * qty[i];
    const f = s / beta;
    for (let i = k; i < n; i++) qty[i] -= f * col[i];
    rRows.push(row);
    pivotColumns.push(j);
    reflectors.push({ v: col, beta });
    k++;
  }
  const rank = k;
  const r = new Float64Array(rank * rank);
  for (let a = 0; a < rank; a++) for (let b = 0; b < rank; b++) r[a * rank + b] = rRows[a][pivotColumns[b]];
  let rss = 0;
  for (let i = rank; i < n; i++) rss += qty[i] * qty[i];
  const fit: QrFit = { n, p, rank, aliased, pivotColumns, coef: new Float64Array(p), effects: qty, rss, dfResidual: n - rank, r, reflectors };
  fit.coef = backSubstitute(fit, qty);
  return fit;
}

/**
 * Least-squares coefficients for a new response with the same X, reusing the
 * factorisation (one pass per reflector instead of a new QR).
 */
export function solveWith(fit: QrFit, y: ArrayLike<number>): Float64Array {
  const qty = Float64Array.from(y);
  const n = qty.length;
  fit.reflectors.forEach(({ v, beta }, k) => {
    let s = 0;
    for (let i = k; i < n; i++) s += v[i] * qty[i];
    const f = s / beta;
    for (let i = k; i < n; i++) qty[i] -= f * v[i];
  });
  return backSubstitute(fit, qty);
}

/** Solves R b = (Q'y)[0..rank) and spreads b over the columns (NaN for aliased ones). */
function backSubstitute(fit: QrFit, qty: Float64Array): Float64Array {
  const { rank, r, p, pivotColumns } = fit;
  const b = new Float64Array(rank);
  for (let a = rank - 1; a >= 0; a--) {
    let s = qty[a];
    for (let c = a + 1; c < rank; c++) s -= r[a * rank + c] * b[c];
    b[a] = s / r[a * rank + a];
  }
  const coef = new Float64Array(p).fill(NaN);
  for (let a = 0; a < rank; a++) coef[pivotColumns[a]] = b[a];
  return coef;
}

/**
 * (X'X)^-1 for the non-aliased columns, as R^-1 R^-T, in column order
 * (rows and columns of aliased columns are NaN). Multiply by σ² for the
 * covariance of the coefficients.
 */
export function unscaledCovariance(fit: QrFit): Float64Array[] {
  const { rank, r, p, pivotColumns } = fit;
  // Invert the upper-triangular R column by column.
  const rinv = new Float64Array(rank * rank);
  for (let c = 0; c < rank; c++) {
    rinv[c * rank + c] = 1 / r[c * rank + c];
    for (let a = c - 1; a >= 0; a--) {
      let s = 0;
      for (let m = a + 1; m <= c; m++) s += r[a * rank + m] * rinv[m * rank + c];
      rinv[a * rank + c] = -s / r[a * rank + a];
    }
  }
  const out: Float64Array[] = [];
  for (let i = 0; i < p; i++) out.push(new Float64Array(p).fill(NaN));
  for (let a = 0; a < rank; a++) {
    for (let b = a; b < rank; b++) {
      let s = 0;
      for (let m = b; m < rank; m++) s += rinv[a * rank + m] * rinv[b * rank + m];
      out[pivotColumns[a]][pivotColumns[b]] = s;
      out[pivotColumns[b]][pivotColumns[a]] = s;
    }
  }
  return out;
}

/**
 * Sum of squares and degrees of freedom that the columns from `blockStart`
 * onwards add to a model holding the columns before it (sequential SS of the
 * last block). Summed from the effects, so it never subtracts two RSS values.
 */
export function lastBlockSs(fit: QrFit, blockStart: number): { ss: number; df: number } {
  let ss = 0;
  let df = 0;
  for (let k = 0; k < fit.rank; k++) {
    if (fit.pivotColumns[k] >= blockStart) {
      ss += fit.effects[k] * fit.effects[k];
      df++;
    }
  }
  return { ss, df };
}

/** Euclidean norm of x[from..], scaled against overflow and underflow. */
function norm2(x: ArrayLike<number>, from: number): number {
  let scale = 0;
  for (let i = from; i < x.length; i++) {
    const a = Math.abs(x[i]);
    if (a > scale) scale = a;
  }
  if (scale === 0) return 0;
  let s = 0;
  for (let i = from; i < x.length; i++) {
    const v = x[i] / scale;
    s += v * v;
  }
  return scale * Math.sqrt(s);
}
