/**
 * Error-free transformations (Dekker, Knuth) for residuals computed to about
 * twice double precision: used by iterative refinement of least-squares
 * coefficients, where a residual computed in plain double arithmetic would be
 * no more accurate than the coefficients it is meant to correct.
 */

/** Veltkamp splitting constant 2^27 + 1. */
const SPLITTER = 134217729;

/** A value as an unevaluated sum hi + lo. */
export interface DoubleDouble {
  hi: number;
  lo: number;
}

/** Adds a (with its own low part aLo) to an accumulator in place. */
export function accumulate(acc: DoubleDouble, a: number, aLo = 0): void {
  const s = acc.hi + a;
  const bb = s - acc.hi;
  const err = acc.hi - (s - bb) + (a - bb);
  acc.hi = s;
  acc.lo += err + aLo;
}

/** Adds −(a·b) to an accumulator in place, keeping the product's rounding error. */
export function subtractProduct(acc: DoubleDouble, a: number, b: number): void {
  const p = a * b;
  let c = SPLITTER * a;
  const ah = c - (c - a);
  const al = a - ah;
  c = SPLITTER * b;
  const bh = c - (c - b);
  const bl = b - bh;
  const err = ah * bh - p + ah * bl + al * bh + al * bl;
  accumulate(acc, -p, -err);
}
