/**
 * Generic quantile by inverting an accurate cdf/sf: bracket around a starting
 * guess, then safeguarded Newton (or Illinois without a density). Lower
 * targets solve cdf(x) = p, upper targets solve sf(x) = 1 − p, so each side
 * works with the tail that is small.
 */
import { solveIncreasing } from './root';

/** What the inversion needs from a distribution. */
export interface Invertible {
  cdf(x: number): number;
  sf(x: number): number;
  pdf?(x: number): number;
}

/** Quantile of a continuous distribution supported on (lower, ∞); `guess` may be NaN. */
export function invert(d: Invertible, p: number, guess: number, lower: number): number {
  if (Number.isNaN(p) || p < 0 || p > 1) return NaN;
  if (p === 0) return lower;
  if (p === 1) return Infinity;
  const upperTarget = 1 - p;
  const f = p <= 0.5 ? (x: number) => d.cdf(x) - p : (x: number) => upperTarget - d.sf(x);
  const positive = lower === 0;
  let g = Number.isFinite(guess) && (!positive || guess > 0) ? guess : positive ? 1 : 0;
  let lo = g;
  let hi = g;
  // Start with a narrow bracket (the guess is often good to 1e-4) and widen it
  // geometrically, multiplicatively on (0, ∞), additively on the real line.
  let rel = 1e-3;
  let step = 1e-3 * Math.max(1, Math.abs(g));
  if (f(g) > 0) {
    for (let i = 0; i < 2000 && f(lo) > 0; i++) {
      hi = lo;
      if (positive) {
        lo = g / (1 + rel);
        rel = rel * 4 + 1;
        if (lo < 1e-300) return 0;
      } else {
        lo -= step;
        step *= 4;
      }
    }
  } else {
    for (let i = 0; i < 2000 && f(hi) < 0; i++) {
      lo = hi;
      if (positive) {
        hi = g * (1 + rel);
        rel = rel * 4 + 1;
      } else {
        hi += step;
        step *= 4;
      }
    }
  }
  const pdf = d.pdf?.bind(d);
  return solveIncreasing(f, lo, hi, pdf ? { derivative: pdf, relTol: 1e-14 } : { relTol: 1e-13 });
}
