import { describe, expect, it } from 'vitest';
import { resultDifferences } from './result-compare';

describe('resultDifferences', () => {
  const base = { engine: '1.0.0', n: 30, tests: [{ term: 'group', value: 4.1, p: 0.02 }], timings: { parseMs: 1, computeMs: 2 } };

  it('treats results that differ only in top-level timings as identical', () => {
    expect(resultDifferences(base, { ...base, timings: { parseMs: 9, computeMs: 7 } })).toEqual([]);
  });

  it('names the paths that differ, including length changes and missing keys', () => {
    const other = { ...base, n: 31, tests: [{ term: 'group', value: 4.1000000001, p: 0.02 }, { term: 'x', value: 1, p: 1 }], extra: true };
    expect(resultDifferences(base, other)).toEqual(['n', 'tests (length 1 vs 2)', 'tests[0].value', 'extra']);
  });

  it('does not ignore a nested field merely called timings', () => {
    expect(resultDifferences({ a: { timings: 1 } }, { a: { timings: 2 } })).toEqual(['a.timings']);
  });

  it('stops at the limit', () => {
    const a = { xs: Array.from({ length: 50 }, (_, i) => i) };
    const b = { xs: Array.from({ length: 50 }, (_, i) => i + 1) };
    expect(resultDifferences(a, b, 5)).toHaveLength(5);
  });
});
