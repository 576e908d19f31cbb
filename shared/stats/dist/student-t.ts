/**
 * Student t distribution through the incomplete beta:
 * P(|T| > |t|) = I_x(df/2, ½) with x = df / (df + t²), 1 − x = t² / (df + t²)
 * (Abramowitz & Stegun 26.7.1). Both one-sided tails come out directly.
 * Measured against R and stdlib: 6e-11 relative up to df = 1e6, 3e-9 up to 1e8.
 */
import { incompleteBeta } from './incomplete-beta';
import { lbeta } from './log-gamma';
import { normal, standardNormalTails } from './normal';
import { invert } from './quantile';
import type { Distribution } from './types';

/** Above this df the normal approximation is more accurate than the incomplete beta in doubles. */
const LARGE_DF = 1e8;

function tails(t: number, df: number): { lower: number; upper: number } {
  if (Number.isNaN(t) || Number.isNaN(df) || !(df > 0)) return { lower: NaN, upper: NaN };
  if (df === Infinity) {
    const n = normal();
    return { lower: n.cdf(t), upper: n.sf(t) };
  }
  if (t === Infinity) return { lower: 1, upper: 0 };
  if (t === -Infinity) return { lower: 0, upper: 1 };
  if (df > LARGE_DF) {
    // Abramowitz & Stegun 26.7.8: t(1 − 1/(4df)) / √(1 + t²/(2df)) is nearly standard normal;
    // its error (~x⁶/df²) is below 3e-9 relative at df = 1e8, |t| ≤ 30, where the
    // incomplete-beta route starts to lose digits (x = df/(df + t²) is too close to 1).
    const v = 1 / (4 * df);
    const z = (t * (1 - v)) / Math.sqrt(1 + t * t * 2 * v);
    return standardNormalTails(z);
  }
  const t2 = t * t;
  const b = incompleteBeta(df / (df + t2), df / 2, 0.5, t2 / (df + t2));
  const small = 0.5 * b.lower;
  const large = 0.5 + 0.5 * b.upper;
  return t > 0 ? { lower: large, upper: small } : { lower: small, upper: large };
}

/** Student t with `df` degrees of freedom (df > 0, may be fractional or Infinity). */
export function studentT(df: number): Distribution {
  const logNorm = -0.5 * Math.log(df) - lbeta(df / 2, 0.5);
  const d = {
    pdf: (x: number) =>
      df === Infinity ? normal().pdf(x) : Math.exp(logNorm - ((df + 1) / 2) * Math.log1p((x * x) / df)),
    cdf: (x: number) => tails(x, df).lower,
    sf: (x: number) => tails(x, df).upper,
  };
  return {
    ...d,
    quantile: (p) => {
      if (p === 0.5) return 0;
      return invert(d, p, normal().quantile(p), -Infinity);
    },
  };
}
