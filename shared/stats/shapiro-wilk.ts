/**
 * Shapiro–Wilk W test of normality, following Royston's approximation:
 * P. Royston (1995), "Remark AS R94: A remark on Algorithm AS 181: The W-test
 * for normality", Applied Statistics 44(4), 547–551. The coefficients a_i come
 * from the polynomial approximation of that remark, and the p-value from its
 * normalising transformations of W (one for 4 ≤ n ≤ 11, one for n ≥ 12; the
 * exact distribution for n = 3). Valid for 3 ≤ n ≤ 5000.
 */
import { InputError } from './contract';
import { normal } from './dist';

const C1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
const C2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];
const C3 = [0.544, -0.39978, 0.025054, -6.714e-4];
const C4 = [1.3822, -0.77857, 0.062767, -0.0020322];
const C5 = [-1.5861, -0.31082, -0.083751, 0.0038915];
const C6 = [-0.4803, -0.082676, 0.0030302];
const G = [-2.273, 0.459];

/** Shapiro–Wilk W and its p-value (Royston 1995, AS R94) for 3 ≤ n ≤ 5000. */
export function shapiroWilk(x: ArrayLike<number>): { W: number; p: number } {
  const n = x.length;
  if (n < 3 || n > 5000) throw new InputError('normality', `The Shapiro–Wilk test needs between 3 and 5000 values; got ${n}.`);
  const sorted = Float64Array.from(x).sort();
  const range = sorted[n - 1] - sorted[0];
  if (!(range > 0)) throw new InputError('normality', 'The Shapiro–Wilk test is undefined when all values are identical.');
  const a = coefficients(n);
  // Signed coefficient per order statistic: −a for the lower half, +a for the upper half.
  const nn2 = n >> 1;
  const coef = new Float64Array(n);
  for (let i = 0; i < nn2; i++) {
    coef[i] = -a[i];
    coef[n - 1 - i] = a[i];
  }
  let sa = 0;
  let sx = 0;
  for (let i = 0; i < n; i++) {
    sa += coef[i];
    sx += sorted[i] / range;
  }
  sa /= n;
  sx /= n;
  let ssa = 0;
  let ssx = 0;
  let sax = 0;
  for (let i = 0; i < n; i++) {
    const asa = coef[i] - sa;
    const xsx = sorted[i] / range - sx;
    ssa += asa * asa;
    ssx += xsx * xsx;
    sax += asa * xsx;
  }
  // W = 1 − w1 with w1 formed as a product so that W near 1 keeps its digits.
  const ssassx = Math.sqrt(ssa * ssx);
  const w1 = ((ssassx - sax) * (ssassx + sax)) / (ssa * ssx);
  const W = 1 - w1;
  return { W, p: pValue(W, w1, n) };
}

/** The a_i (i = 1..n/2, positive, for the upper order statistics). */
function coefficients(n: number): Float64Array {
  const nn2 = n >> 1;
  const a = new Float64Array(nn2);
  if (n === 3) {
    a[0] = Math.SQRT1_2;
    return a;
  }
  const std = normal();
  const an25 = n + 0.25;
  const m = new Float64Array(nn2);
  let summ2 = 0;
  for (let i = 0; i < nn2; i++) {
    m[i] = std.quantile((i + 1 - 0.375) / an25);
    summ2 += m[i] * m[i];
  }
  summ2 *= 2;
  const ssumm2 = Math.sqrt(summ2);
  const rsn = 1 / Math.sqrt(n);
  const a1 = poly(C1, rsn) - m[0] / ssumm2;
  let i1: number;
  let fac: number;
  if (n > 5) {
    i1 = 2;
    const a2 = -m[1] / ssumm2 + poly(C2, rsn);
    fac = Math.sqrt((summ2 - 2 * m[0] * m[0] - 2 * m[1] * m[1]) / (1 - 2 * a1 * a1 - 2 * a2 * a2));
    a[1] = a2;
  } else {
    i1 = 1;
    fac = Math.sqrt((summ2 - 2 * m[0] * m[0]) / (1 - 2 * a1 * a1));
  }
  a[0] = a1;
  for (let i = i1; i < nn2; i++) a[i] = -m[i] / fac;
  return a;
}

/** Royston's normalising transformation of W to an upper-tail normal p-value. */
function pValue(W: number, w1: number, n: number): number {
  if (n === 3) {
    const pi6 = 6 / Math.PI;
    const stqr = Math.PI / 3;
    return Math.max(0, pi6 * (Math.asin(Math.sqrt(W)) - stqr));
  }
  let y = Math.log(w1);
  const lxx = Math.log(n);
  let m: number;
  let s: number;
  if (n <= 11) {
    const gamma = poly(G, n);
    if (y >= gamma) return 1e-99;
    y = -Math.log(gamma - y);
    m = poly(C3, n);
    s = Math.exp(poly(C4, n));
  } else {
    m = poly(C5, lxx);
    s = Math.exp(poly(C6, lxx));
  }
  return normal(m, s).sf(y);
}

/** c[0] + c[1] x + c[2] x² + … (Horner). */
function poly(c: number[], x: number): number {
  let r = 0;
  for (let i = c.length - 1; i >= 0; i--) r = r * x + c[i];
  return r;
}
