/**
 * log(1 + u) − u without cancellation for small |u|, the kernel of the
 * large-parameter prefactors of the incomplete beta and gamma (the same role
 * as the "bd0" deviance term in Loader's (2000) saddle-point binomial density).
 */

/** log(1 + u) − u for u > −1. */
export function log1pmx(u: number): number {
  if (Math.abs(u) >= 0.5) return Math.log1p(u) - u;
  // −u²/2 + u³/3 − u⁴/4 + …, summed until terms vanish (≤ 60 terms for |u| < 0.5)
  let term = u;
  let sum = 0;
  for (let k = 2; k < 200; k++) {
    term *= -u;
    const add = term / k;
    sum += add;
    if (Math.abs(add) <= 1e-17 * Math.abs(sum)) break;
  }
  return sum;
}
