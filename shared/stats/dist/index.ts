/**
 * Distribution functions used by the engine, behind one typed shape.
 * Upper tails are computed directly (not as 1 − cdf) where the library allows,
 * so small p-values keep their relative precision.
 *
 * First version: thin wrapper over jstat. Accuracy work (noncentral t and F,
 * studentized range) lives beside this file.
 */
import jStatModule from 'jstat';

const jStat: any = (jStatModule as any).jStat ?? jStatModule;

/** Common shape of a continuous distribution. */
export interface Distribution {
  pdf(x: number): number;
  cdf(x: number): number;
  /** Upper tail P(X > x). */
  sf(x: number): number;
  quantile(p: number): number;
}

/** Student t with `df` degrees of freedom. */
export function studentT(df: number): Distribution {
  return {
    pdf: (x) => jStat.studentt.pdf(x, df),
    cdf: (x) => (x <= 0 ? 0.5 * jStat.ibeta(df / (df + x * x), df / 2, 0.5) : 1 - 0.5 * jStat.ibeta(df / (df + x * x), df / 2, 0.5)),
    sf: (x) => (x >= 0 ? 0.5 * jStat.ibeta(df / (df + x * x), df / 2, 0.5) : 1 - 0.5 * jStat.ibeta(df / (df + x * x), df / 2, 0.5)),
    quantile: (p) => jStat.studentt.inv(p, df),
  };
}

/** Fisher F with df1, df2 degrees of freedom. */
export function fisherF(df1: number, df2: number): Distribution {
  return {
    pdf: (x) => jStat.centralF.pdf(x, df1, df2),
    cdf: (x) => (x <= 0 ? 0 : jStat.ibeta((df1 * x) / (df1 * x + df2), df1 / 2, df2 / 2)),
    sf: (x) => (x <= 0 ? 1 : jStat.ibeta(df2 / (df2 + df1 * x), df2 / 2, df1 / 2)),
    quantile: (p) => jStat.centralF.inv(p, df1, df2),
  };
}

/** Chi-square with `df` degrees of freedom. */
export function chiSquare(df: number): Distribution {
  return {
    pdf: (x) => jStat.chisquare.pdf(x, df),
    cdf: (x) => (x <= 0 ? 0 : jStat.lowRegGamma(df / 2, x / 2)),
    sf: (x) => (x <= 0 ? 1 : 1 - jStat.lowRegGamma(df / 2, x / 2)),
    quantile: (p) => jStat.chisquare.inv(p, df),
  };
}

/** Normal with mean `mu` and SD `sd`. */
export function normal(mu = 0, sd = 1): Distribution {
  return {
    pdf: (x) => jStat.normal.pdf(x, mu, sd),
    cdf: (x) => 0.5 * jStat.erfc(-(x - mu) / (sd * Math.SQRT2)),
    sf: (x) => 0.5 * jStat.erfc((x - mu) / (sd * Math.SQRT2)),
    quantile: (p) => jStat.normal.inv(p, mu, sd),
  };
}

/** Studentized range for `k` means and `df` error degrees of freedom. */
export function studentizedRange(k: number, df: number): Omit<Distribution, 'pdf'> {
  return {
    cdf: (q) => (q <= 0 ? 0 : jStat.tukey.cdf(q, k, df)),
    sf: (q) => (q <= 0 ? 1 : 1 - jStat.tukey.cdf(q, k, df)),
    quantile: (p) => jStat.tukey.inv(p, k, df),
  };
}
