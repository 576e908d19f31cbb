/**
 * Normal distribution. Φ is computed through the incomplete gamma,
 * erfc(u) = Q(½, u²), so both tails keep relative precision down to ~1e-300.
 */
import jStatModule from 'jstat';
import { incompleteGamma } from './incomplete-gamma';
import { invert } from './quantile';
import type { Distribution } from './types';

const jStat: any = (jStatModule as any).jStat ?? jStatModule;
const INV_SQRT_2PI = 0.398942280401432677939946059934;

/** P(Z ≤ z) and P(Z > z) for the standard normal. */
export function standardNormalTails(z: number): { lower: number; upper: number } {
  if (Number.isNaN(z)) return { lower: NaN, upper: NaN };
  if (z === 0) return { lower: 0.5, upper: 0.5 };
  const g = incompleteGamma(0.5, 0.5 * z * z);
  // g.lower = P(|Z| ≤ |z|), g.upper = P(|Z| > |z|)
  const small = 0.5 * g.upper;
  const large = 0.5 + 0.5 * g.lower;
  return z > 0 ? { lower: large, upper: small } : { lower: small, upper: large };
}

/** Normal with mean `mu` and SD `sd`. */
export function normal(mu = 0, sd = 1): Distribution {
  const std = {
    pdf: (z: number) => INV_SQRT_2PI * Math.exp(-0.5 * z * z),
    cdf: (z: number) => standardNormalTails(z).lower,
    sf: (z: number) => standardNormalTails(z).upper,
  };
  return {
    pdf: (x) => std.pdf((x - mu) / sd) / sd,
    cdf: (x) => std.cdf((x - mu) / sd),
    sf: (x) => std.sf((x - mu) / sd),
    quantile: (p) => {
      if (p === 0.5) return mu;
      const guess = jStat.normal.inv(p, 0, 1);
      return mu + sd * invert(std, p, guess, -Infinity);
    },
  };
}
