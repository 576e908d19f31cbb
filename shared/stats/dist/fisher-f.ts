/**
 * Fisher F distribution through the incomplete beta:
 * P(F ≤ f) = I_x(df1/2, df2/2), x = df1·f / (df1·f + df2) (Abramowitz & Stegun 26.6.2),
 * with the upper tail taken from the same call, never as 1 − cdf.
 */
import jStatModule from 'jstat';
import { incompleteBeta } from './incomplete-beta';
import { incompleteGamma } from './incomplete-gamma';
import { lbeta } from './log-gamma';
import { invert } from './quantile';
import type { Distribution } from './types';

const jStat: any = (jStatModule as any).jStat ?? jStatModule;

function tails(f: number, df1: number, df2: number): { lower: number; upper: number } {
  if (Number.isNaN(f) || !(df1 > 0) || !(df2 > 0)) return { lower: NaN, upper: NaN };
  if (f <= 0) return { lower: 0, upper: 1 };
  if (f === Infinity) return { lower: 1, upper: 0 };
  if (df2 === Infinity && df1 === Infinity) return f < 1 ? { lower: 0, upper: 1 } : { lower: 1, upper: 0 };
  if (df2 === Infinity) return incompleteGamma(df1 / 2, (df1 * f) / 2); // F(df1, ∞) = χ²(df1)/df1
  if (df1 === Infinity) {
    const g = incompleteGamma(df2 / 2, df2 / (2 * f)); // F(∞, df2) = df2/χ²(df2)
    return { lower: g.upper, upper: g.lower };
  }
  const denom = df1 * f + df2;
  return incompleteBeta((df1 * f) / denom, df1 / 2, df2 / 2, df2 / denom);
}

/** Fisher F with df1, df2 degrees of freedom. */
export function fisherF(df1: number, df2: number): Distribution {
  const a = df1 / 2;
  const b = df2 / 2;
  const logNorm = a * Math.log(df1 / df2) - lbeta(a, b);
  const d = {
    pdf: (x: number) => {
      if (x < 0) return 0;
      if (x === 0) return df1 === 2 ? 1 : df1 < 2 ? Infinity : 0;
      return Math.exp(logNorm + (a - 1) * Math.log(x) - (a + b) * Math.log1p((df1 * x) / df2));
    },
    cdf: (x: number) => tails(x, df1, df2).lower,
    sf: (x: number) => tails(x, df1, df2).upper,
  };
  return {
    ...d,
    quantile: (p) => {
      let guess = NaN;
      try {
        guess = jStat.centralF.inv(p, df1, df2);
      } catch {
        guess = NaN;
      }
      return invert(d, p, guess, 0);
    },
  };
}
