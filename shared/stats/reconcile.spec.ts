/**
 * Reconciliation rules (documented in reconcile.ts). Recomputed p values are
 * checked against R (pt, pnorm, pf, pchisq) in test/reference/dist/reconcile.json,
 * written by test/reference/dist/generate-dist.R; the verdicts follow from those
 * R values and the printed digits by the rules.
 */
import { describe, expect, it } from 'vitest';
import type { RerunResult, TestRow } from './contract';
import { reconcile } from './reconcile';
import { loadDistFixture } from './dist/fixture-loader.spec-helper';

const cases: any[] = loadDistFixture('reconcile.json').cases;
/** R's p for a reported statistic (two-sided t/z, upper F/χ²). */
function rP(stat: string, value: number, df = -1, df1 = -1, df2 = -1): any {
  const c = cases.find((x) => x.stat === stat && x.value === value && x.df === df && x.df1 === df1 && x.df2 === df2);
  if (!c) throw new Error(`no R case for ${stat} ${value}`);
  return c;
}

function result(tests: TestRow[], extra: Partial<RerunResult> = {}): RerunResult {
  return { engine: 'test', design: 'anova', n: 30, excluded: 0, alpha: 0.05, descriptives: [], tests, warnings: [], ...extra };
}
const empty = result([]);
const one = (text: string, res = empty, term?: string, alpha = 0.05) => reconcile([{ text, term }], res, alpha)[0];

describe('p recomputed from the reported statistic matches R', () => {
  it.each([
    ['F(2, 27) = 4.85, p = .016', rP('F', 4.85, -1, 2, 27)],
    ['t(28) = -2.10, p < .05', rP('t', -2.1, 28)],
    ['t(31.4) = 2.2, p = .035', rP('t', 2.2, 31.4)],
    ['χ²(3) = 7.9, p = .048', rP('chi2', 7.9, 3)],
    ['z = 1.96, p = .05', rP('z', 1.96)],
    ['F(2; 27) = 4,85; p = 0,016', rP('F', 4.85, -1, 2, 27)],
    ['F(3, 60) = 0.87, p = .46', rP('F', 0.87, -1, 3, 60)],
  ])('%s is consistent (R p in the reported interval)', (text, r) => {
    const row = one(text);
    expect(Math.abs(row.pFromReported! - r.p)).toBeLessThan(1e-10);
    expect(row.verdict).toBe('consistent');
  });
});

describe('verdict rules', () => {
  it('rounding: p at the printed t(20) = 2.10 is outside "p = .048", but t within [2.095, 2.105] reaches it', () => {
    const r = rP('t', 2.1, 20); // R: p = .04862, interval .04813 to .04911
    expect(r.p).toBeGreaterThan(0.0485);
    expect(r.pLow).toBeLessThan(0.0485);
    expect(one('t(20) = 2.10, p = .048').verdict).toBe('rounding');
  });
  it('inconsistent: t(20) = 2.10 with p = .030 (both significant, far apart)', () => {
    const row = one('t(20) = 2.10, p = .030');
    expect(row.verdict).toBe('inconsistent');
    expect(row.explanation).toMatch(/beyond rounding/);
  });
  it('decision-changing: t(20) = 1.80 reported p = .03 but R gives p = .087', () => {
    expect(rP('t', 1.8, 20).pHigh).toBeGreaterThan(0.05);
    const row = one('t(20) = 1.80, p = .03');
    expect(row.verdict).toBe('decision-changing');
    expect(row.explanation).toMatch(/significant/);
  });
  it('a reported p that is half the two-sided p is named as one-sided', () => {
    const row = one('t(20) = 1.80, p = .043');
    expect(row.verdict).toBe('decision-changing');
    expect(row.explanation).toMatch(/one-sided/);
  });
  it('"ns" with a significant recomputed p is decision-changing (F(1, 38) = 5.2: R p = .028)', () => {
    expect(rP('F', 5.2, -1, 1, 38).pHigh).toBeLessThan(0.05);
    expect(one('F(1, 38) = 5.2, ns').verdict).toBe('decision-changing');
  });
  it('"p = .05" at alpha .05 straddles alpha, so it is never decision-changing', () => {
    expect(one('t(20) = 1.80, p = .05').verdict).toBe('inconsistent');
  });
  it('the plan alpha is used: at alpha .10, "ns" for p = .087 is decision-changing', () => {
    expect(one('t(20) = 1.80, ns', empty, undefined, 0.1).verdict).toBe('decision-changing');
    expect(one('t(20) = 1.80, ns', empty, undefined, 0.05).verdict).toBe('consistent');
  });
  it('unreadable text and p-only strings are "unparsed" with a reason', () => {
    const a = one('hello');
    expect(a.verdict).toBe('unparsed');
    expect(a.explanation).toMatch(/no statistic/);
    const b = one('p < .001');
    expect(b.verdict).toBe('unparsed');
    expect(b.explanation).toMatch(/Only a p value/);
    expect(one('t = 2.1, p = .04').explanation).toMatch(/degrees of freedom/);
  });
});

describe('comparison with the rerun', () => {
  const fRow = (value: number, p: number): TestRow => ({ term: 'method', statistic: 'F', value, df1: 2, df2: 27, p });
  it('matches by statistic and df when no term is given, and rounds the rerun value to the printed digits', () => {
    const row = one('F(2, 27) = 4.85, p = .016', result([fRow(4.853, 0.0159)]));
    expect(row.verdict).toBe('consistent');
    expect(row.term).toBe('method');
    expect(row.rerunValue).toBe(4.853);
  });
  it('a rerun value one unit off in the last digit is a rounding difference', () => {
    expect(one('F(2, 27) = 4.85, p = .016', result([fRow(4.86, 0.0158)])).verdict).toBe('rounding');
  });
  it('a different rerun value on the same side of alpha is inconsistent; across alpha it is decision-changing', () => {
    expect(one('F(2, 27) = 4.85, p = .016', result([fRow(5.9, 0.0075)])).verdict).toBe('inconsistent');
    const row = one('F(2, 27) = 4.85, p = .016', result([fRow(2.1, 0.14)]));
    expect(row.verdict).toBe('decision-changing');
    expect(row.explanation).toMatch(/rerun gives F = 2\.100/);
  });
  it('Welch df pick the Welch row among the t tests of one term', () => {
    const tests: TestRow[] = [
      { term: 'group', statistic: 't', variant: 'student', value: -2.25, df: 28, p: 0.032 },
      { term: 'group', statistic: 't', variant: 'welch', value: -2.2, df: 26.31, p: 0.0368 },
    ];
    const row = one('t(26.3) = 2.2, p = .037', result(tests, { design: 'independent' }), 'group');
    expect(row.rerunValue).toBe(-2.2);
    expect(row.verdict).toBe('consistent');
    expect(row.explanation).toMatch(/sign differs/);
  });
  it('sphericity-corrected df of a within term are matched (Greenhouse–Geisser)', () => {
    const gg = { epsilon: 0.806, df1: 1.612, df2: 30.43, p: 0.0081 };
    const tests: TestRow[] = [
      { term: 'time', statistic: 'F', value: 6.31, df1: 2, df2: 38, p: 0.0044, corrections: { gg, hf: { ...gg, epsilon: 0.9, df1: 1.8, df2: 34.2, p: 0.006 }, lb: { ...gg, epsilon: 0.5, df1: 1, df2: 19, p: 0.021 } } },
    ];
    const row = one('F(1.6, 30.4) = 6.3, p = .008', result(tests));
    expect(Math.abs(row.pFromReported! - rP('F', 6.3, -1, 1.6, 30.4).p)).toBeLessThan(1e-10);
    expect(row.verdict).toBe('consistent');
    expect(row.rerunP).toBe(0.0081);
    expect(row.explanation).toMatch(/GG correction/);
  });
  it('a chi-square without p is judged against the rerun rank test alone', () => {
    const res = result([], { nonparametric: [{ term: 'method', method: 'kruskal-wallis', value: 7.93, df: 3, p: 0.0475 }] });
    expect(one('chi2(3)=7.9', res).verdict).toBe('consistent');
    expect(one('chi2(3)=7.1', res).verdict).toBe('inconsistent');
    const none = one('chi2(3)=7.9');
    expect(none.verdict).toBe('unparsed');
    expect(none.parsed?.statistic).toBe('chi2');
    expect(none.explanation).toMatch(/nothing to check/);
  });
  it('regression coefficients are matched by term', () => {
    const res = result([{ term: 'model', statistic: 'F', value: 9.1, df1: 2, df2: 28, p: 0.0009 }], {
      design: 'regression',
      coefficients: [{ term: 'hours', estimate: 1.2, se: 0.4, value: 2.1, df: 28, p: 0.0449, ciLower: 0.1, ciUpper: 2.3 }],
    });
    const row = one('t(28) = 2.10, p = .045', res, 'hours');
    expect(row.verdict).toBe('consistent');
    expect(row.explanation).toMatch(/regression coefficient/);
  });
  it('a named term the rerun lacks is explained', () => {
    expect(one('F(2, 27) = 4.85, p = .016', result([fRow(4.853, 0.0159)]), 'dosage').explanation).toMatch(/no F test for "dosage"/);
  });
});
