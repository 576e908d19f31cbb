/**
 * Multiplicity adjustment of a family of p-values.
 *
 * Bonferroni: min(1, m·p). Holm (1979) step-down: sort ascending, multiply the
 * i-th smallest by (m − i + 1), enforce monotonicity with a running maximum.
 * Benjamini–Hochberg (1995) step-up: sort descending, multiply the i-th
 * smallest by m / i, enforce monotonicity with a running minimum. NaN entries
 * stay NaN and do not count towards m.
 */

/** Adjustment methods understood by {@link adjustP}. */
export type PAdjustMethod = 'bonferroni' | 'holm' | 'bh';

/** Adjusted p-values, in the order given, for one family of tests. */
export function adjustP(p: number[], method: PAdjustMethod): number[] {
  const out = p.map(() => Number.NaN);
  const idx: number[] = [];
  for (let i = 0; i < p.length; i++) {
    const v = p[i];
    if (Number.isNaN(v)) continue;
    if (v < 0 || v > 1) throw new RangeError(`p-value ${v} at position ${i} is outside [0, 1]`);
    idx.push(i);
  }
  const m = idx.length;
  if (m === 0) return out;
  if (method === 'bonferroni') {
    for (const i of idx) out[i] = Math.min(1, p[i] * m);
    return out;
  }
  // Stable sort by p so ties keep input order, as the usual definitions assume.
  idx.sort((a, b) => p[a] - p[b] || a - b);
  if (method === 'holm') {
    let running = 0;
    for (let r = 0; r < m; r++) {
      const i = idx[r];
      running = Math.max(running, Math.min(1, (m - r) * p[i]));
      out[i] = running;
    }
    return out;
  }
  if (method === 'bh') {
    let running = 1;
    for (let r = m - 1; r >= 0; r--) {
      const i = idx[r];
      running = Math.min(running, (m / (r + 1)) * p[i]);
      out[i] = Math.min(1, running);
    }
    return out;
  }
  throw new RangeError(`unknown p-value adjustment "${String(method)}"`);
}
