/**
 * Friedman's rank test for one within-subjects factor (Friedman 1937), with
 * the usual correction for ties within a subject (Hollander & Wolfe,
 * Nonparametric Statistical Methods, §7.1): mid-ranks within each subject,
 * chi-square reference on k − 1 df.
 */
import { chiSquare } from './dist/index';

/** Friedman statistic, df and p for an n × k table (row s = subject, column j = level). */
export function friedmanTest(table: Float64Array, n: number, k: number): { value: number; df: number; p: number } {
  const rankSums = new Float64Array(k);
  const order = new Int32Array(k);
  let tieTerm = 0;
  for (let s = 0; s < n; s++) {
    const row = table.subarray(s * k, s * k + k);
    // Insertion sort of the level indices by value: k is small, and this avoids a comparator call per step.
    for (let j = 0; j < k; j++) {
      let i = j;
      while (i > 0 && row[order[i - 1]] > row[j]) {
        order[i] = order[i - 1];
        i--;
      }
      order[i] = j;
    }
    for (let start = 0; start < k; ) {
      let end = start + 1;
      while (end < k && row[order[end]] === row[order[start]]) end++;
      const mid = (start + end + 1) / 2;
      for (let r = start; r < end; r++) rankSums[order[r]] += mid;
      const t = end - start;
      tieTerm += t * t * t - t;
      start = end;
    }
  }
  let ss = 0;
  const expected = (n * (k + 1)) / 2;
  for (let j = 0; j < k; j++) ss += (rankSums[j] - expected) ** 2;
  const denom = n * k * (k + 1) - tieTerm / (k - 1);
  const value = denom > 0 ? (12 * ss) / denom : Number.NaN;
  const df = k - 1;
  return { value, df, p: Number.isFinite(value) ? chiSquare(df).sf(value) : Number.NaN };
}
