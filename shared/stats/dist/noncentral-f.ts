/**
 * Noncentral F distribution function as a Poisson mixture of central
 * incomplete beta functions (Johnson, Kotz & Balakrishnan, Continuous
 * Univariate Distributions vol. 2, 30.5):
 *   P(F ≤ f) = Σ_j e^(−λ/2) (λ/2)^j / j! · I_x(df1/2 + j, df2/2),  x = df1·f / (df1·f + df2).
 * This is the series of Lenth (1987, AS 226) and Frick (1990, AS R84) for the
 * noncentral beta; following Ding (1992, AS 275), the sum starts at the largest
 * Poisson weight (j = ⌊λ/2⌋) and walks outwards in both directions, using
 * I_x(a+1, b) = I_x(a, b) − g_a with g_a = x^a (1−x)^b / (a B(a, b)) (formed in
 * logs at each step so no underflow propagates), until the weights fall below 1e-18. The upper tail is summed
 * from the complements 1 − I_x, so P(F > f) never comes from 1 − cdf.
 */
import { incompleteBeta } from './incomplete-beta';
import { lbeta, lgamma } from './log-gamma';
import { fisherF } from './fisher-f';

const WEIGHT_EPS = 1e-18;

function mixture(f: number, df1: number, df2: number, ncp: number, upperTail: boolean): number {
  // Finite df only: the mixture below has no limiting form for df2 = ∞.
  if (Number.isNaN(f) || !(df1 > 0) || !(df2 > 0) || !Number.isFinite(df1) || !Number.isFinite(df2) || !(ncp >= 0)) return NaN;
  if (f <= 0) return upperTail ? 1 : 0;
  if (f === Infinity) return upperTail ? 0 : 1;
  if (ncp === 0) {
    const c = fisherF(df1, df2);
    return upperTail ? c.sf(f) : c.cdf(f);
  }
  const denom = df1 * f + df2;
  const x = (df1 * f) / denom;
  const y = df2 / denom;
  const half = ncp / 2;
  const b = df2 / 2;
  const j0 = Math.floor(half);
  const a0 = df1 / 2 + j0;
  const logW0 = -half + (j0 > 0 ? j0 * Math.log(half) : 0) - lgamma(j0 + 1);
  const w0 = Math.exp(logW0);
  const t0 = incompleteBeta(x, a0, b, y);
  const lx = Math.log(x);
  const ly = Math.log(y);
  const gAt = (a: number) => Math.exp(a * lx + b * ly - lbeta(a, b) - Math.log(a));
  const tail0 = upperTail ? t0.upper : t0.lower;
  // Moving a → a+1 lowers I_x by g_a, i.e. adds g_a to the upper tail.
  const sign = upperTail ? 1 : -1;
  let total = w0 * tail0;

  // Forward: j = j0 + 1, j0 + 2, ...
  let w = w0;
  let tail = tail0;
  let a = a0;
  for (let j = j0 + 1; j < j0 + 1000000; j++) {
    tail += sign * gAt(a);
    a += 1;
    w *= half / j;
    total += w * Math.min(1, Math.max(0, tail));
    if (w < WEIGHT_EPS && j > half) break;
  }
  // Backward: j = j0 − 1, ..., 0. g_{a−1} = g_a · a / (x (a + b − 1)).
  w = w0;
  a = a0;
  tail = tail0;
  for (let j = j0 - 1; j >= 0; j--) {
    a -= 1;
    tail -= sign * gAt(a);
    w *= (j + 1) / half;
    total += w * Math.min(1, Math.max(0, tail));
    if (w < WEIGHT_EPS) break;
  }
  return Math.min(1, Math.max(0, total));
}

/** Lower tail P(F ≤ f) of the noncentral F with df1, df2 and noncentrality ncp ≥ 0. */
export function noncentralFCdf(f: number, df1: number, df2: number, ncp: number): number {
  return mixture(f, df1, df2, ncp, false);
}

/** Upper tail P(F > f) of the noncentral F (the power of an F test at critical value f). */
export function noncentralFSf(f: number, df1: number, df2: number, ncp: number): number {
  return mixture(f, df1, df2, ncp, true);
}
