/**
 * Pairwise comparisons. Exact identities with two groups let an independent
 * library check each method: with k = 2 the studentized range satisfies
 * P(Q > |t|·√2) = P(|T| > |t|), so Tukey equals Student's t test and
 * Games–Howell equals Welch's t test (source: @stdlib/stats/ttest2), and the
 * paired t tests are checked against @stdlib/stats/ttest.
 */
import { describe, expect, it } from 'vitest';
import ttest from '@stdlib/stats/ttest';
import ttest2 from '@stdlib/stats/ttest2';
import { compareBetween, compareWithin, withinComparisonNote, type GroupSummary } from './comparisons';
import { studentT, studentizedRange } from './dist/index';
import { adjustP } from './p-adjust';

const A = [12.1, 14.3, 11.8, 15.2, 13.9, 12.7, 16.1];
const B = [15.4, 17.9, 16.2, 19.8, 14.1, 18.3, 21.5, 17.0, 16.6];
const C = [13.0, 12.2, 14.8, 13.5, 15.9];

function summary(level: string, x: number[]): GroupSummary {
  const n = x.length;
  const mean = x.reduce((a, b) => a + b, 0) / n;
  const variance = x.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1);
  return { level, n, mean, variance };
}

function pooled(groups: GroupSummary[]) {
  const ss = groups.reduce((a, g) => a + (g.n - 1) * g.variance, 0);
  const df = groups.reduce((a, g) => a + g.n - 1, 0);
  return { ms: ss / df, df };
}

const rel = (x: number, y: number) => Math.abs(x - y) / Math.max(Math.abs(y), 1e-300);

describe('compareBetween with two groups (source: @stdlib/stats/ttest2)', () => {
  const groups = [summary('a', A), summary('b', B)];
  const student = ttest2(A, B, { variance: 'equal' });
  const welch = ttest2(A, B, { variance: 'unequal' });

  it('tukey equals Student t: statistic, df, p, interval', () => {
    const [row] = compareBetween('f', groups, 'tukey', pooled(groups), 0.05);
    expect(row.a).toBe('a');
    expect(row.b).toBe('b');
    expect(rel(row.statistic, student.statistic)).toBeLessThan(1e-12);
    expect(row.df).toBe(student.df);
    expect(row.p).toBeNull();
    // Tolerance 1e-6: jstat's studentized range is an Algorithm AS 190-style quadrature.
    expect(Math.abs(row.pAdjusted - student.pValue)).toBeLessThan(1e-6);
    expect(Math.abs(row.ciLower - student.ci[0])).toBeLessThan(1e-5);
    expect(Math.abs(row.ciUpper - student.ci[1])).toBeLessThan(1e-5);
  });

  it('games-howell equals Welch t: statistic, Welch df, p, interval', () => {
    const [row] = compareBetween('f', groups, 'games-howell', { ms: Number.NaN, df: Number.NaN }, 0.05);
    expect(rel(row.statistic, welch.statistic)).toBeLessThan(1e-12);
    expect(rel(row.df, welch.df)).toBeLessThan(1e-12);
    expect(Math.abs(row.pAdjusted - welch.pValue)).toBeLessThan(1e-6);
    expect(Math.abs(row.ciLower - welch.ci[0])).toBeLessThan(1e-5);
  });

  for (const method of ['bonferroni', 'holm', 'bh'] as const) {
    it(`${method} with one pair equals Student t unadjusted`, () => {
      const [row] = compareBetween('f', groups, method, pooled(groups), 0.05);
      expect(Math.abs(row.p! - student.pValue)).toBeLessThan(1e-12);
      expect(Math.abs(row.pAdjusted - student.pValue)).toBeLessThan(1e-12);
      expect(rel(row.ciLower, student.ci[0])).toBeLessThan(1e-10);
      expect(rel(row.ciUpper, student.ci[1])).toBeLessThan(1e-10);
    });
  }
});

describe('compareBetween with three groups', () => {
  const groups = [summary('a', A), summary('b', B), summary('c', C)];
  const err = pooled(groups);

  it('lists pairs in level order with estimate = mean(a) − mean(b)', () => {
    const rows = compareBetween('f', groups, 'holm', err, 0.05);
    expect(rows.map((r) => `${r.a}-${r.b}`)).toEqual(['a-b', 'a-c', 'b-c']);
    expect(rows[2].estimate).toBeCloseTo(groups[1].mean - groups[2].mean, 12);
  });

  it('tukey–kramer: the interval bound sits where the adjusted p equals alpha (definition of the simultaneous interval)', () => {
    const rows = compareBetween('f', groups, 'tukey', err, 0.05);
    const q = studentizedRange(3, err.df).quantile(0.95);
    for (const r of rows) {
      expect(r.se).toBeCloseTo(Math.sqrt(err.ms * (1 / groups.find((g) => g.level === r.a)!.n + 1 / groups.find((g) => g.level === r.b)!.n)), 12);
      expect(r.ciUpper - r.estimate).toBeCloseTo((q / Math.SQRT2) * r.se, 10);
      // A difference exactly at the half-width has adjusted p = alpha.
      expect(studentizedRange(3, err.df).sf(q)).toBeCloseTo(0.05, 6);
      expect(r.pAdjusted > 0.05).toBe(r.ciLower < 0 && r.ciUpper > 0);
    }
  });

  it('games-howell by hand: Welch df and SE from the group variances, p from the studentized range with k = 3', () => {
    const rows = compareBetween('f', groups, 'games-howell', err, 0.05);
    const [ga, gb] = groups;
    const va = ga.variance / ga.n;
    const vb = gb.variance / gb.n;
    const df = (va + vb) ** 2 / (va ** 2 / (ga.n - 1) + vb ** 2 / (gb.n - 1));
    const t = (ga.mean - gb.mean) / Math.sqrt(va + vb);
    expect(rows[0].df).toBeCloseTo(df, 10);
    expect(rows[0].statistic).toBeCloseTo(t, 10);
    expect(rows[0].pAdjusted).toBeCloseTo(studentizedRange(3, df).sf(Math.abs(t) * Math.SQRT2), 12);
    expect(rows[0].pAdjusted).toBeGreaterThan(2 * studentT(df).sf(Math.abs(t)));
  });

  it('bonferroni intervals use alpha/m; bh intervals are unadjusted', () => {
    const bonf = compareBetween('f', groups, 'bonferroni', err, 0.05);
    const bh = compareBetween('f', groups, 'bh', err, 0.05);
    const tb = studentT(err.df).quantile(1 - 0.05 / 6);
    const tu = studentT(err.df).quantile(0.975);
    expect(bonf[0].ciUpper - bonf[0].estimate).toBeCloseTo(tb * bonf[0].se, 10);
    expect(bh[0].ciUpper - bh[0].estimate).toBeCloseTo(tu * bh[0].se, 10);
    expect(bh.map((r) => r.pAdjusted)).toEqual(adjustP(bh.map((r) => r.p!), 'bh'));
  });

  it('rejects a level with one value for Games–Howell and a non-positive error for t methods', () => {
    const one = [...groups, { level: 'd', n: 1, mean: 3, variance: Number.NaN }];
    expect(() => compareBetween('f', one, 'games-howell', err, 0.05)).toThrow(/level "d" of|level "d" has 1/);
    expect(() => compareBetween('f', groups, 'holm', { ms: 0, df: 10 }, 0.05)).toThrow(/positive error variance/);
  });
});

describe('compareWithin (source: @stdlib/stats/ttest, paired)', () => {
  const t1 = Float64Array.from([10, 12, 9, 14, 11, 13, 12, 10]);
  const t2 = Float64Array.from([11, 14, 10, 15, 11, 16, 13, 12]);
  const t3 = Float64Array.from([13, 15, 12, 15, 14, 17, 13, 14]);
  const levels = ['t1', 't2', 't3'];

  it('paired t per pair matches stdlib; holm adjusts across the family', () => {
    const rows = compareWithin('time', levels, [t1, t2, t3], 'holm', 0.05);
    const ref = [ttest(Array.from(t1), Array.from(t2)), ttest(Array.from(t1), Array.from(t3)), ttest(Array.from(t2), Array.from(t3))];
    rows.forEach((r, i) => {
      expect(rel(r.statistic, ref[i].statistic)).toBeLessThan(1e-12);
      expect(Math.abs(r.p! - ref[i].pValue)).toBeLessThan(1e-12);
      expect(r.df).toBe(7);
    });
    expect(rows.map((r) => r.pAdjusted)).toEqual(adjustP(rows.map((r) => r.p!), 'holm'));
  });

  it('bh intervals equal the paired t interval at 1 − alpha (stdlib)', () => {
    const rows = compareWithin('time', levels, [t1, t2, t3], 'bh', 0.05);
    const ref = ttest(Array.from(t1), Array.from(t2));
    expect(rel(rows[0].ciLower, ref.ci[0])).toBeLessThan(1e-10);
    expect(rel(rows[0].ciUpper, ref.ci[1])).toBeLessThan(1e-10);
  });

  it('tukey on a within factor falls back to Bonferroni with a note, keeping the label', () => {
    const rows = compareWithin('time', levels, [t1, t2, t3], 'tukey', 0.05);
    const bonf = compareWithin('time', levels, [t1, t2, t3], 'bonferroni', 0.05);
    expect(rows.every((r) => r.method === 'tukey')).toBe(true);
    expect(rows.map((r) => r.pAdjusted)).toEqual(bonf.map((r) => r.pAdjusted));
    expect(withinComparisonNote('time', 'tukey')).toMatch(/Bonferroni/);
    expect(withinComparisonNote('time', 'holm')).toBeNull();
  });

  it('names the pair when a difference has no spread', () => {
    const shifted = Float64Array.from(t1, (v) => v + 2);
    expect(() => compareWithin('time', ['t1', 'tx'], [t1, shifted], 'holm', 0.05)).toThrow(/"t1" and "tx"/);
  });
});
