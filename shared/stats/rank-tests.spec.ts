/**
 * Rank tests, checked against @stdlib/stats (kruskal-test, wilcoxon: an
 * independent implementation) and against exact null distributions small
 * enough to enumerate by hand.
 */
import { describe, expect, it } from 'vitest';
import kruskalTest from '@stdlib/stats/kruskal-test';
import wilcoxon from '@stdlib/stats/wilcoxon';
import { kruskalWallis, mannWhitney, mannWhitneyDistribution, rankSums, signedRankDistribution, wilcoxonSignedRank } from './rank-tests';

const A = [1.1, 2.3, 3.7, 4.2, 8.9, 5.5, 6.1];
const B = [2.2, 0.5, 1.9, 3.1, 0.7];
const C = [1.1, 2.3, 0.2, 0.1];

describe('exact null distributions', () => {
  it('Mann–Whitney m = n = 2: U = 0..4 with counts 1, 1, 2, 1, 1 of 6 arrangements (enumerated by hand)', () => {
    const d = mannWhitneyDistribution(2, 2);
    [1, 1, 2, 1, 1].forEach((c, u) => expect(d[u]).toBeCloseTo(c / 6, 15));
  });

  it('signed rank n = 3: V = 0..6 with counts 1, 1, 1, 2, 1, 1, 1 of 8 sign patterns (enumerated by hand)', () => {
    const d = signedRankDistribution(3);
    [1, 1, 1, 2, 1, 1, 1].forEach((c, v) => expect(d[v]).toBeCloseTo(c / 8, 15));
  });

  it('sum to 1 and are symmetric for larger sizes (defining property)', () => {
    const d = mannWhitneyDistribution(12, 9);
    expect(d.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 13);
    for (let u = 0; u < d.length; u++) expect(d[u]).toBeCloseTo(d[d.length - 1 - u], 15);
  });
});

describe('rankSums', () => {
  it('gives mid-ranks to ties: (1, 2, 2) vs (2, 3) → ranks 1, 3, 3 | 3, 5 (hand computation)', () => {
    const { sums, tieTerm } = rankSums([Float64Array.of(1, 2, 2), Float64Array.of(2, 3)]);
    expect([...sums]).toEqual([7, 8]);
    expect(tieTerm).toBe(24); // one run of 3: 27 − 3
  });
});

describe('wilcoxonSignedRank', () => {
  it('matches @stdlib/stats/wilcoxon, exact case (no ties, n < 50)', () => {
    const x = [1.2, -0.5, 2.3, 3.1, -0.2, 0.9, 1.7, 2.2];
    const ours = wilcoxonSignedRank(x);
    const ref = wilcoxon(x) as { statistic: number; pValue: number };
    expect(ours.exact).toBe(true);
    expect(ours.value).toBe(ref.statistic);
    expect(ours.p).toBeCloseTo(ref.pValue, 12);
  });

  it('matches @stdlib/stats/wilcoxon with ties and a zero (normal approximation, continuity correction)', () => {
    const x = [1, -1, 2, 3, 0, 2, 5, -0.5];
    const ours = wilcoxonSignedRank(x);
    const ref = wilcoxon(x) as { statistic: number; pValue: number };
    expect(ours.exact).toBe(false);
    expect(ours.n).toBe(7);
    expect(ours.value).toBe(ref.statistic);
    expect(ours.p).toBeCloseTo(ref.pValue, 12);
  });

  it('matches @stdlib/stats/wilcoxon for n ≥ 50 (normal approximation)', () => {
    const x = Array.from({ length: 60 }, (_, i) => Math.sin(i * 1.3) + 0.2);
    const ours = wilcoxonSignedRank(x);
    const ref = wilcoxon(x) as { statistic: number; pValue: number };
    expect(ours.exact).toBe(false);
    expect(ours.value).toBe(ref.statistic);
    expect(ours.p).toBeCloseTo(ref.pValue, 12);
  });
});

describe('mannWhitney', () => {
  it('exact p for 7 vs 5 untied values equals the enumerated tail: W = 31, p = 2·P(U ≥ 31)', () => {
    const r = mannWhitney(A, B);
    expect(r.exact).toBe(true);
    expect(r.value).toBe(31); // pairs (a, b) with a > b, counted by hand
    const d = mannWhitneyDistribution(7, 5);
    let tail = 0;
    for (let u = 31; u < d.length; u++) tail += d[u];
    expect(r.p).toBeCloseTo(2 * tail, 15);
  });

  it('uses the normal approximation when there are ties, and U + U′ = m·n (defining property)', () => {
    const r = mannWhitney(A, C);
    const s = mannWhitney(C, A);
    expect(r.exact).toBe(false);
    expect(r.value + s.value).toBe(A.length * C.length);
    expect(r.p).toBeCloseTo(s.p, 14);
  });
});

describe('kruskalWallis', () => {
  it('matches @stdlib/stats/kruskal-test (tie-corrected H)', () => {
    const ours = kruskalWallis([A, B, C]);
    const ref = kruskalTest(A, B, C) as { statistic: number; pValue: number; df: number };
    expect(ours.df).toBe(ref.df);
    expect(ours.value).toBeCloseTo(ref.statistic, 12);
    expect(ours.p).toBeCloseTo(ref.pValue, 12);
  });
});
