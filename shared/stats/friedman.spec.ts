/** Friedman's test: a hand-worked tied example, the k = 2 sign-test identity, invariances. */
import { describe, expect, it } from 'vitest';
import { friedmanTest } from './friedman';

describe('friedmanTest', () => {
  it('hand-worked example with a tie (mid-ranks, tie-corrected denominator)', () => {
    // Rows: (1,2,3), (1,2,3), (1,1,2). Rank sums 3.5, 5.5, 9; expected 6; Σ(R − 6)² = 15.5;
    // ties Σ(t³ − t) = 6; statistic = 12 · 15.5 / (3·3·4 − 6/2) = 186 / 33.
    const r = friedmanTest(Float64Array.from([1, 2, 3, 1, 2, 3, 1, 1, 2]), 3, 3);
    expect(r.value).toBeCloseTo(186 / 33, 13);
    expect(r.df).toBe(2);
    expect(r.p).toBeCloseTo(Math.exp(-186 / 33 / 2), 12);
  });

  it('with two conditions and no ties equals the sign-test chi-square (n₊ − n₋)² / n (from memory; follows from the rank sums)', () => {
    const pairs = [[3, 5], [2, 7], [9, 4], [1, 6], [8, 8.5], [4, 2], [6, 10]];
    const table = Float64Array.from(pairs.flat());
    const plus = pairs.filter(([a, b]) => b > a).length;
    const minus = pairs.length - plus;
    expect(friedmanTest(table, pairs.length, 2).value).toBeCloseTo((plus - minus) ** 2 / pairs.length, 13);
  });

  it('is unchanged by a monotone transformation within subjects and by reordering subjects', () => {
    const x = [5.1, 6.3, 4.8, 7.0, 2.2, 3.9, 3.9, 4.4, 8.8, 9.1, 7.7, 9.9, 1.0, 0.5, 2.5, 1.7];
    const a = friedmanTest(Float64Array.from(x), 4, 4);
    const b = friedmanTest(Float64Array.from(x, (v) => Math.exp(v) - 3), 4, 4);
    const c = friedmanTest(Float64Array.from([...x.slice(8), ...x.slice(0, 8)]), 4, 4);
    expect(b.value).toBeCloseTo(a.value, 13);
    expect(c.value).toBeCloseTo(a.value, 13);
  });

  it('is zero when every subject ranks the conditions in opposite ways that cancel', () => {
    expect(friedmanTest(Float64Array.from([1, 2, 2, 1]), 2, 2).value).toBe(0);
  });
});
