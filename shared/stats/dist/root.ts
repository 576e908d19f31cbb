/**
 * Root finding on monotone functions, used for quantiles and for the
 * sensitivity (detectable effect) search.
 */

/** Options for {@link solveIncreasing}. */
export interface SolveOptions {
  /** Derivative of f; enables Newton steps (falls back to bisection outside the bracket). */
  derivative?: (x: number) => number;
  /** Relative tolerance on x (default 1e-13). */
  relTol?: number;
  /** Absolute tolerance on x (default 1e-300). */
  absTol?: number;
  maxIter?: number;
}

/**
 * Root of an increasing function f inside a bracket [lo, hi] with f(lo) ≤ 0 ≤ f(hi).
 * Safeguarded Newton when a derivative is given, Illinois (modified regula
 * falsi) otherwise; every step that leaves the bracket becomes a bisection,
 * so convergence is guaranteed.
 */
export function solveIncreasing(f: (x: number) => number, lo: number, hi: number, opts: SolveOptions = {}): number {
  const relTol = opts.relTol ?? 1e-13;
  const absTol = opts.absTol ?? 1e-300;
  const maxIter = opts.maxIter ?? 300;
  let flo = f(lo);
  let fhi = f(hi);
  if (flo === 0) return lo;
  if (fhi === 0) return hi;
  if (!(flo < 0 && fhi > 0)) throw new Error(`root not bracketed in [${lo}, ${hi}]`);
  let x = 0.5 * (lo + hi);
  let side = 0;
  for (let i = 0; i < maxIter; i++) {
    const fx = f(x);
    if (fx === 0) return x;
    if (fx < 0) {
      lo = x;
      flo = fx;
      if (side === -1) fhi /= 2;
      side = -1;
    } else {
      hi = x;
      fhi = fx;
      if (side === 1) flo /= 2;
      side = 1;
    }
    if (hi - lo <= Math.max(absTol, relTol * Math.abs(x))) return 0.5 * (lo + hi);
    let next = NaN;
    if (opts.derivative) {
      const dx = opts.derivative(x);
      if (dx > 0 && Number.isFinite(dx)) next = x - fx / dx;
    } else {
      next = (lo * fhi - hi * flo) / (fhi - flo);
    }
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (opts.derivative && Math.abs(next - x) <= relTol * Math.abs(x)) return next;
    x = next;
  }
  return x;
}
