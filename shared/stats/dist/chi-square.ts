/**
 * Chi-square distribution through the incomplete gamma:
 * P(X ≤ x) = P(df/2, x/2) (Abramowitz & Stegun 26.4.19), both tails direct.
 */
import { incompleteGamma } from './incomplete-gamma';
import { lgamma } from './log-gamma';
import { normal } from './normal';
import { invert } from './quantile';
import type { Distribution } from './types';

/** Chi-square with `df` degrees of freedom. */
export function chiSquare(df: number): Distribution {
  const k = df / 2;
  const logNorm = -k * Math.LN2 - lgamma(k);
  const d = {
    pdf: (x: number) => {
      if (x < 0) return 0;
      if (x === 0) return df === 2 ? 0.5 : df < 2 ? Infinity : 0;
      return Math.exp(logNorm + (k - 1) * Math.log(x) - x / 2);
    },
    cdf: (x: number) => (x <= 0 ? 0 : incompleteGamma(k, x / 2).lower),
    sf: (x: number) => (x <= 0 ? 1 : incompleteGamma(k, x / 2).upper),
  };
  return {
    ...d,
    quantile: (p) => {
      // Wilson–Hilferty cube-root approximation as the starting point.
      const z = normal().quantile(p);
      const c = 2 / (9 * df);
      const guess = df * Math.pow(Math.max(1 - c + z * Math.sqrt(c), 0.01), 3);
      return invert(d, p, guess, 0);
    },
  };
}
