/**
 * Distribution functions used by the engine, behind one typed shape
 * (pdf, cdf, sf, quantile). Upper tails are computed directly, not as
 * 1 − cdf, so small p-values keep their relative precision: always use `sf`
 * for upper-tail p-values. Accuracy measured against R in r-reference.spec.ts for
 * df from 1 to 10^6: central t, F, chi-square p within 2e-12 absolute (small tails
 * within 6e-11 relative), quantiles within 1e-11 relative; studentized range p
 * within 2e-10 absolute; noncentral t within 2e-11 and noncentral F within 1e-9 absolute.
 * jstat's own incomplete beta and gamma are not used for p: its F upper tail is
 * off by up to 2e-2 at large df and its chi-square upper tail is 1 − lower.
 */
export type { Distribution } from './types';
export { studentT } from './student-t';
export { fisherF } from './fisher-f';
export { chiSquare } from './chi-square';
export { normal, standardNormalTails } from './normal';
export { studentizedRange } from './studentized-range';
export { noncentralTCdf, noncentralTSf } from './noncentral-t';
export { noncentralFCdf, noncentralFSf } from './noncentral-f';
export { incompleteBeta } from './incomplete-beta';
export { incompleteGamma } from './incomplete-gamma';
export { lgamma, lbeta } from './log-gamma';

import { noncentralTCdf, noncentralTSf } from './noncentral-t';
import { noncentralFCdf, noncentralFSf } from './noncentral-f';

/** Noncentral t with df and noncentrality ncp: cdf and sf only. */
export function noncentralT(df: number, ncp: number): { cdf(x: number): number; sf(x: number): number } {
  return { cdf: (x) => noncentralTCdf(x, df, ncp), sf: (x) => noncentralTSf(x, df, ncp) };
}

/** Noncentral F with df1, df2 and noncentrality ncp: cdf and sf only. */
export function noncentralF(df1: number, df2: number, ncp: number): { cdf(x: number): number; sf(x: number): number } {
  return { cdf: (x) => noncentralFCdf(x, df1, df2, ncp), sf: (x) => noncentralFSf(x, df1, df2, ncp) };
}
