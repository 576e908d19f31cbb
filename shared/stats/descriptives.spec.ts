/** Cell descriptives, checked against @stdlib/stats/ttest (confidence interval of a mean) and hand computation. */
import { describe, expect, it } from 'vitest';
import ttest from '@stdlib/stats/ttest';
import { cellDescriptives, summariseCells } from './descriptives';
import { codeLevels } from './prepared-builder';

describe('cellDescriptives', () => {
  const y = [4, 8, 6, 5, 3, 9, 7.5, 6.5];
  const g = codeLevels('g', ['a', 'b', 'a', 'b', 'a', 'b', 'a', 'b']);

  it('gives n, mean, SD, SE per cell and the t interval of @stdlib/stats/ttest', () => {
    const rows = cellDescriptives(Float64Array.from(y), 0, [g], 0.1);
    const a = [4, 6, 3, 7.5];
    const ref = ttest(a, { alpha: 0.1 }) as { ci: number[] };
    expect(rows[0].levels).toEqual({ g: 'a' });
    expect(rows[0].n).toBe(4);
    expect(rows[0].mean).toBeCloseTo(5.125, 14);
    // SS = 1.265625 + 0.765625 + 4.515625 + 5.640625 = 12.1875 (hand computation).
    expect(rows[0].sd).toBeCloseTo(Math.sqrt(12.1875 / 3), 14);
    expect(rows[0].se).toBeCloseTo(rows[0].sd / 2, 14);
    expect(rows[0].ciLower).toBeCloseTo(ref.ci[0], 10);
    expect(rows[0].ciUpper).toBeCloseTo(ref.ci[1], 10);
  });

  it('adds the offset back to mean and interval but not to SD', () => {
    const plain = cellDescriptives(Float64Array.from(y), 0, [g], 0.05);
    const shifted = cellDescriptives(Float64Array.from(y, (v) => v - 5), 5, [g], 0.05);
    shifted.forEach((c, i) => {
      expect(c.mean).toBeCloseTo(plain[i].mean, 14);
      expect(c.sd).toBeCloseTo(plain[i].sd, 14);
      expect(c.ciLower).toBeCloseTo(plain[i].ciLower, 13);
    });
  });
});

describe('summariseCells', () => {
  it('skips empty combinations and maps each row to its cell', () => {
    const a = codeLevels('a', ['x', 'x', 'y', 'y']);
    const b = codeLevels('b', ['p', 'q', 'p', 'p']);
    const { cells, cellOfRow } = summariseCells(Float64Array.of(1, 2, 3, 5), [a, b]);
    expect(cells.map((c) => c.levels)).toEqual([[0, 0], [0, 1], [1, 0]]);
    expect([...cellOfRow]).toEqual([0, 1, 2, 2]);
    expect(cells[2]).toMatchObject({ n: 2, mean: 4, ss: 2 });
  });
});
