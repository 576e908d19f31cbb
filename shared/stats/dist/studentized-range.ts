/**
 * Studentized range distribution (range of k normal means over an
 * independent SD estimate with df degrees of freedom).
 *
 * The cdf is jstat's port of Copenhaver & Holland (1988), "Computation of the
 * distribution of the maximum studentized range statistic with application to
 * multiple significance testing of simple effects", J. Statist. Comput. Simul. 30
 * (Gauss–Legendre quadrature over the SD and the range). The upper tail is
 * 1 − cdf: that quadrature has no direct upper-tail form, so p below ~1e-12 is
 * absolute, not relative. The quantile inverts that cdf to 1e-12 relative
 * instead of the 1e-4 stopping rule of the secant search that ships with it.
 */
import jStatModule from 'jstat';
import { invert } from './quantile';
import type { Distribution } from './types';

const jStat: any = (jStatModule as any).jStat ?? jStatModule;

/** Studentized range for `k` means (k ≥ 2) and `df` error degrees of freedom (df ≥ 2). */
export function studentizedRange(k: number, df: number): Omit<Distribution, 'pdf'> {
  const cdf = (q: number) => {
    if (Number.isNaN(q) || !(k >= 2) || !(df >= 2)) return NaN;
    if (q <= 0) return 0;
    if (q === Infinity) return 1;
    return Math.min(1, Math.max(0, jStat.tukey.cdf(q, k, df)));
  };
  const sf = (q: number) => 1 - cdf(q);
  return {
    cdf,
    sf,
    quantile: (p) => {
      if (Number.isNaN(p) || !(k >= 2) || !(df >= 2)) return NaN;
      let guess = NaN;
      try {
        guess = jStat.tukey.inv(p, k, df);
      } catch {
        guess = NaN;
      }
      return invert({ cdf, sf }, p, guess, 0);
    },
  };
}
