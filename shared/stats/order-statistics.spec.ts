/** Selection of order statistics, checked against a full sort (the definition). */
import { describe, expect, it } from 'vitest';
import { medianOf, selectRanks } from './order-statistics';

/** Deterministic pseudo-random values (LCG), optionally with many ties. */
function values(seed: number, n: number, ties: boolean): Float64Array {
  let s = seed >>> 0;
  return Float64Array.from({ length: n }, () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    const u = s / 2 ** 32;
    return ties ? Math.floor(u * 4) : u - 0.5;
  });
}

describe('selectRanks', () => {
  for (const [seed, n, ties] of [[1, 1, false], [2, 31, false], [3, 500, true], [4, 5000, false], [5, 20000, true], [6, 150000, false], [7, 200000, true]] as const) {
    it(`matches a full sort for n = ${n}${ties ? ' with ties' : ''}`, () => {
      const a = values(seed, n, ties);
      const sorted = a.slice().sort();
      const ranks = Array.from({ length: Math.min(n, 60) }, (_, k) => Math.floor((k * (n - 1)) / Math.max(1, Math.min(n, 60) - 1)));
      expect(selectRanks(a.slice(), ranks)).toEqual(ranks.map((r) => sorted[r]));
    });
  }
});

describe('selectRanks on large skewed data (histogram path)', () => {
  it('matches a full sort when most values crowd into one bin', () => {
    const a = values(8, 100000, false).map((v, i) => (i % 1000 === 0 ? v * 1e9 : v));
    const sorted = a.slice().sort();
    const ranks = Array.from({ length: 200 }, (_, k) => Math.round((k * 99999) / 199));
    expect(selectRanks(a.slice(), ranks)).toEqual(ranks.map((r) => sorted[r]));
  });
});

describe('medianOf', () => {
  it('gives the middle value, or the mean of the two middle values', () => {
    expect(medianOf(Float64Array.of(5, 1, 3))).toBe(3);
    expect(medianOf(Float64Array.of(4, 1, 3, 10))).toBe(3.5);
    expect(medianOf(new Float64Array(0))).toBeNaN();
  });
});
