/**
 * Levene and Brown–Forsythe tests, checked against @stdlib/stats/levene-test
 * (mean-centred Levene) and hand computations for the median variant.
 */
import { describe, expect, it } from 'vitest';
import stdlibLevene from '@stdlib/stats/levene-test';
import { leveneTest, oneWaySs } from './levene';

const A = [1.1, 2.3, 3.7, 4.2, 8.9, 5.5, 6.1];
const B = [2.2, 0.5, 1.9, 3.1, 0.7];
const C = [1.1, 2.3, 0.2, 0.1];

describe('leveneTest', () => {
  it('center = mean matches @stdlib/stats/levene-test', () => {
    const ours = leveneTest([A, B, C], 'mean');
    const ref = stdlibLevene(A, B, C) as unknown as { statistic: number; pValue: number; df: number[] };
    expect([ours.df1, ours.df2]).toEqual(ref.df);
    expect(ours.value).toBeCloseTo(ref.statistic, 12);
    expect(ours.p).toBeCloseTo(ref.pValue, 12);
  });

  it('center = median is the F test on absolute deviations from the group medians (hand computation)', () => {
    // Groups (1, 2, 6) and (3, 5, 7, 8): medians 2 and 6; deviations (1, 0, 4) and (3, 1, 1, 2).
    const ours = leveneTest([[1, 2, 6], [3, 5, 7, 8]], 'median');
    const { ssBetween, ssWithin } = oneWaySs([[1, 0, 4], [3, 1, 1, 2]]);
    expect(ours.center).toBe('median');
    expect(ours.value).toBeCloseTo(ssBetween / 1 / (ssWithin / 5), 14);
    expect([ours.df1, ours.df2]).toEqual([1, 5]);
  });

  it('is invariant to a common shift and scale of the data (defining property)', () => {
    const a = leveneTest([A, B, C], 'median');
    const b = leveneTest([A, B, C].map((g) => g.map((v) => 1000 + 3 * v)), 'median');
    expect(b.value).toBeCloseTo(a.value, 10);
  });
});

describe('oneWaySs', () => {
  it('splits (1, 2, 3 | 5, 7) into SSB = 19.2, SSW = 4 (hand computation)', () => {
    const { ssBetween, ssWithin, n } = oneWaySs([[1, 2, 3], [5, 7]]);
    // Grand mean 3.6; 3·(2 − 3.6)² + 2·(6 − 3.6)² = 7.68 + 11.52 = 19.2.
    expect(ssBetween).toBeCloseTo(19.2, 13);
    expect(ssWithin).toBeCloseTo(4, 14);
    expect(n).toBe(5);
  });
});
