/**
 * Multiple linear regression by Householder QR on the centred design.
 *
 * The outcome and every predictor arrive centred on exact decimal offsets;
 * each column is then centred on its own mean (two-pass), which removes the
 * intercept from the QR problem and with it the worst of the conditioning
 * (a column of years next to a column of ones). The intercept and its SE are
 * recovered afterwards from the means in the original units:
 * b0 = ȳ − Σ b_j x̄_j and Var(b0) = σ²(1/n + x̄' (Xc'Xc)^-1 x̄).
 *
 * The regression SS is the sum of the squared QR effects and the residual SS
 * the sum of the squared residual part of Q'y, so neither is a difference.
 *
 * Coefficients then get up to two steps of iterative refinement: the residual
 * of the original (uncentred) problem is computed with compensated arithmetic
 * (compensated.ts), and the correction solved with the same centred QR factors. At the
 * fixed point X'r = 0 holds for the data as read, so the rounding in the
 * centred columns and in the back-transformation to the intercept no longer
 * limits accuracy (this matters for polynomial designs, where the intercept is
 * a difference of large terms).
 *
 * Exact fit: when the residual SS is at rounding level (below (n·ε)² times the
 * total SS, ε = 2^-52) the fit is treated as exact: residual SD 0, standard
 * errors 0, t and F infinite (JSON writes them as null) with p = 0, intervals
 * of zero width, and a warning.
 */
import type { CoefficientRow, RerunResult } from './contract';
import { InputError } from './contract';
import { describeCell } from './descriptives';
import { fisherF, studentT } from './dist';
import { accumulate, subtractProduct, type DoubleDouble } from './compensated';
import { meanAndSs, qrFit, solveWith, unscaledCovariance, type QrFit } from './linear-model';
import type { PreparedData } from './prepared';
import { shapiroWilk } from './shapiro-wilk';

/** Multiple regression of the outcome on plan.predictors: coefficients, fit statistics, overall F, VIF. */
export function analyseRegression(d: PreparedData): Partial<RerunResult> {
  const { alpha } = d.plan;
  const preds = d.predictors;
  const p = preds.length;
  const yName = d.outcome.name;
  if (p === 0) throw new InputError('plan.predictors', 'A regression needs at least one predictor column in plan.predictors.');
  const y = d.outcome.values;
  const n = y.length;
  if (n < p + 2) throw new InputError(`column ${yName}`, `A regression with ${p} predictor(s) needs at least ${p + 2} complete rows; found ${n}.`);
  const warnings: string[] = [];

  const yStats = meanAndSs(y);
  if (!(yStats.ss > 0)) throw new InputError(`column ${yName}`, `Every value of "${yName}" is the same; there is nothing to explain.`);
  const yc = new Float64Array(n);
  for (let i = 0; i < n; i++) yc[i] = y[i] - yStats.mean;
  const xMeans: number[] = [];
  const xSs: number[] = [];
  const columns = preds.map((col) => {
    const st = meanAndSs(col.values);
    if (!(st.ss > 0)) throw new InputError(`column ${col.name}`, `Predictor "${col.name}" has the same value in every row; its coefficient cannot be estimated.`);
    xMeans.push(st.mean);
    xSs.push(st.ss);
    const c = new Float64Array(n);
    for (let i = 0; i < n; i++) c[i] = col.values[i] - st.mean;
    return c;
  });
  const fit = qrFit(columns, yc);
  const aliased = fit.aliased.findIndex((a) => a);
  if (aliased >= 0)
    throw new InputError(`column ${preds[aliased].name}`, `Predictor "${preds[aliased].name}" is (almost) an exact linear combination of the predictors before it; remove one of them.`);

  const df = n - p - 1;
  let ssReg = 0;
  for (let k = 0; k < fit.rank; k++) ssReg += fit.effects[k] ** 2;
  const exact = fit.rss <= (n * Number.EPSILON) ** 2 * yStats.ss;
  const rss = exact ? 0 : fit.rss;
  const sigma = Math.sqrt(rss / df);
  if (exact) warnings.push('The predictors reproduce the outcome exactly (residual SD 0): standard errors are 0, t and F are infinite and p is 0.');
  const cov = unscaledCovariance(fit);
  const q = studentT(df).quantile(1 - alpha / 2);

  // Means in original units: offset + centred mean.
  const xBar = preds.map((col, j) => col.offset + xMeans[j]);
  const yBar = d.outcome.offset + yStats.mean;
  let b0 = yBar;
  for (let j = 0; j < p; j++) b0 -= fit.coef[j] * xBar[j];
  const slopes = Float64Array.from(fit.coef);
  for (let step = 0; step < 2; step++) b0 = refine(d, fit, xBar, slopes, b0);
  let quad = 0;
  for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) quad += xBar[a] * cov[a][b] * xBar[b];
  const se0 = sigma * Math.sqrt(1 / n + quad);

  const row = (term: string, estimate: number, se: number, vif?: number): CoefficientRow => {
    const value = estimate / se;
    const p2 = se > 0 ? 2 * studentT(df).sf(Math.abs(value)) : 0;
    const out: CoefficientRow = { term, estimate, se, value, df, p: p2, ciLower: estimate - q * se, ciUpper: estimate + q * se };
    if (vif !== undefined) out.vif = vif;
    return out;
  };
  const coefficients: CoefficientRow[] = [row('(intercept)', b0, se0)];
  preds.forEach((col, j) => {
    const vif = p >= 2 ? cov[j][j] * xSs[j] : undefined;
    coefficients.push(row(col.name, slopes[j], sigma * Math.sqrt(cov[j][j]), vif));
  });

  const msReg = ssReg / p;
  const msRes = rss / df;
  const F = msReg / msRes;
  // An exact fit has R² = 1 by definition; the ratio of two rounded sums can land an ulp above it.
  const rSquared = exact ? 1 : ssReg / yStats.ss;
  const residuals = new Float64Array(n);
  for (let i = rss > 0 ? 0 : n; i < n; i++) {
    let fitted = 0;
    for (let j = 0; j < p; j++) fitted += slopes[j] * columns[j][i];
    residuals[i] = yc[i] - fitted;
  }
  const result: Partial<RerunResult> = {
    descriptives: [describeCell({ n, mean: yStats.mean, ss: yStats.ss }, {}, d.outcome.offset, alpha)],
    tests: [{ term: 'model', statistic: 'F', value: F, df1: p, df2: df, p: exact ? 0 : fisherF(p, df).sf(F), ss: ssReg, ms: msReg, errorSs: rss, errorDf: df }],
    residual: { ss: rss, df, ms: msRes },
    coefficients,
    rSquared,
    adjRSquared: 1 - (1 - rSquared) * ((n - 1) / df),
    sigma,
    warnings,
  };
  if (rss > 0 && n > 5000) warnings.push(`The Shapiro–Wilk check of the residuals was skipped: it is defined for at most 5000 values and there are ${n}.`);
  if (rss > 0 && n >= 3 && n <= 5000) {
    const sw = shapiroWilk(residuals);
    result.assumptions = { normality: { method: 'shapiro-wilk', W: sw.W, p: sw.p, n } };
  }
  return result;
}

/**
 * One step of iterative refinement: residuals of y − b0 − Σ b_j x_j on the
 * data as read (offset + centred value), accumulated in double-double, are
 * regressed on the centred columns; slopes are corrected in place and the
 * corrected intercept returned.
 */
function refine(d: PreparedData, fit: QrFit, xBar: number[], slopes: Float64Array, b0: number): number {
  const n = d.outcome.values.length;
  const p = slopes.length;
  // Constant part: offset_y − b0 − Σ b_j offset_j.
  const base: DoubleDouble = { hi: d.outcome.offset, lo: 0 };
  accumulate(base, -b0);
  d.predictors.forEach((col, j) => subtractProduct(base, slopes[j], col.offset));
  const r = new Float64Array(n);
  const acc: DoubleDouble = { hi: 0, lo: 0 };
  for (let i = 0; i < n; i++) {
    acc.hi = base.hi;
    acc.lo = base.lo;
    accumulate(acc, d.outcome.values[i]);
    for (let j = 0; j < p; j++) subtractProduct(acc, slopes[j], d.predictors[j].values[i]);
    r[i] = acc.hi + acc.lo;
  }
  const { mean } = meanAndSs(r);
  for (let i = 0; i < n; i++) r[i] -= mean;
  const correction = solveWith(fit, r);
  let delta0 = mean;
  for (let j = 0; j < p; j++) {
    slopes[j] += correction[j];
    delta0 -= correction[j] * xBar[j];
  }
  return b0 + delta0;
}
