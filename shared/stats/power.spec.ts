/**
 * Power and sensitivity against R. Source: test/reference/dist/power.json from
 * test/reference/dist/generate-dist.R — power.t.test(strict = TRUE, tol = 1e-12),
 * noncentral t with unequal groups, and pf(qf(1 − a), ncp = f²N, lower = FALSE),
 * detectable effects by uniroot (tol 1e-13).
 */
import { describe, expect, it } from 'vitest';
import type { RerunResult, TestRow } from './contract';
import type { PreparedData } from './prepared';
import { computePower, detectableF, detectableT, powerF, powerT } from './power';
import { ErrorTally, loadDistFixture } from './dist/fixture-loader.spec-helper';

const fx = loadDistFixture('power.json');
const POWER_ABS = 1e-8;
const EFFECT_REL = 1e-7;

function tInput(r: any) {
  return r.type === 'two.sample'
    ? { n1: r.n, n2: r.n, alpha: r.alpha, tails: 2 as const }
    : { n1: r.n, paired: r.type === 'paired', alpha: r.alpha, tails: 2 as const };
}

describe('powerT / detectableT against R power.t.test', () => {
  it('one-sample, two-sample and paired designs', () => {
    const pow = new ErrorTally();
    const det = new ErrorTally();
    for (const r of fx.t) {
      const got = powerT({ ...tInput(r), d: r.d });
      pow.add(got, r.power);
      expect(Math.abs(got - r.power), `power ${JSON.stringify(r)} got ${got}`).toBeLessThanOrEqual(POWER_ABS);
      const dd = detectableT(tInput(r));
      det.add(dd, r.detectable80);
      expect(Math.abs(dd - r.detectable80) / r.detectable80, `detectable ${JSON.stringify(r)} got ${dd}`).toBeLessThanOrEqual(EFFECT_REL);
    }
    console.info(`[R] power.t.test power: ${pow}; detectable d: ${det}`);
  });
  it('unequal group sizes (noncentral t in R)', () => {
    for (const r of fx.tUnequal) {
      const input = { n1: r.n1, n2: r.n2, alpha: r.alpha, tails: 2 as const };
      expect(Math.abs(powerT({ ...input, d: r.d }) - r.power)).toBeLessThanOrEqual(POWER_ABS);
      expect(Math.abs(detectableT(input) - r.detectable80) / r.detectable80).toBeLessThanOrEqual(EFFECT_REL);
    }
  });
  it('rejects impossible inputs with a message naming the field', () => {
    expect(() => powerT({ d: 0.5, n1: 1, alpha: 0.05, tails: 2 })).toThrow(/n1/);
    expect(() => powerT({ d: 0.5, n1: 10, alpha: 1.5, tails: 2 })).toThrow(/alpha/);
  });
});

describe('powerF / detectableF against R noncentral F', () => {
  it('matches pf(qf(1 − a), ncp = f²N, lower = FALSE) and its uniroot inverse', () => {
    const pow = new ErrorTally();
    const det = new ErrorTally();
    for (const r of fx.f) {
      const input = { df1: r.df1, df2: r.df2, nTotal: r.N, alpha: r.alpha };
      const got = powerF({ ...input, f: r.f });
      pow.add(got, r.power);
      expect(Math.abs(got - r.power), `power ${JSON.stringify(r)} got ${got}`).toBeLessThanOrEqual(POWER_ABS);
      const ff = detectableF(input);
      det.add(ff, r.detectable80);
      expect(Math.abs(ff - r.detectable80) / r.detectable80, `detectable ${JSON.stringify(r)} got ${ff}`).toBeLessThanOrEqual(EFFECT_REL);
    }
    console.info(`[R] F power: ${pow}; detectable f: ${det}`);
  });
});

function fakeResult(design: RerunResult['design'], tests: TestRow[], cells: number[]): RerunResult {
  return {
    engine: 'test',
    design,
    n: cells.reduce((a, b) => a + b, 0),
    excluded: 0,
    alpha: 0.05,
    descriptives: cells.map((n, i) => ({ levels: (cells.length > 1 ? { group: `g${i}` } : {}) as Record<string, string>, n, mean: 0, sd: 1, se: 1, ciLower: 0, ciUpper: 0 })),
    tests,
    warnings: [],
  };
}

function fakeData(n: number, alpha: number, within = 0): PreparedData {
  return {
    plan: { design: 'anova', outcome: 'score', alpha, ssType: 3, between: [], within: [], predictors: [], comparisons: [] },
    n,
    outcome: { name: 'score', values: new Float64Array(0), offset: 0 },
    between: [],
    within: Array.from({ length: within }, () => ({ name: 'w', levels: [], codes: new Int32Array(0) })),
    predictors: [],
    rowNumbers: new Int32Array(0),
    excluded: 0,
    warnings: [],
  };
}

describe('computePower on rerun results', () => {
  it('one-sample t: observed d and sample size from the result (R power.t.test case n = 20, d = 0.5)', () => {
    const r = fx.t.find((x: any) => x.type === 'one.sample' && x.n === 20 && x.d === 0.5 && x.alpha === 0.05);
    const res = fakeResult('one-sample', [{ term: 'mean', statistic: 't', value: 2.2, df: 19, p: 0.04, cohensD: 0.5 }], [20]);
    const [row] = computePower(res, fakeData(20, 0.05));
    expect(row.metric).toBe('d');
    expect(Math.abs(row.power - r.power)).toBeLessThanOrEqual(POWER_ABS);
    expect(Math.abs(row.detectable80 - r.detectable80) / r.detectable80).toBeLessThanOrEqual(EFFECT_REL);
  });
  it('independent: uses the Student row and the two group sizes, skips Welch (R noncentral t, n = 7 and 13)', () => {
    const r = fx.tUnequal.find((x: any) => x.n1 === 7 && x.n2 === 13 && x.d === 0.9);
    const tests: TestRow[] = [
      { term: 'group', statistic: 't', variant: 'student', value: -1.9, df: 18, p: 0.07, cohensD: -0.9 },
      { term: 'group', statistic: 't', variant: 'welch', value: -1.8, df: 11.2, p: 0.09, cohensD: -0.9 },
    ];
    const rows = computePower(fakeResult('independent', tests, [7, 13]), fakeData(20, 0.05));
    expect(rows).toHaveLength(1);
    expect(rows[0].observed).toBe(0.9);
    expect(Math.abs(rows[0].power - r.power)).toBeLessThanOrEqual(POWER_ABS);
  });
  it('paired: uses d_z and n = df + 1 pairs (R power.t.test paired, n = 8, d = 1.1, alpha .01)', () => {
    const r = fx.t.find((x: any) => x.type === 'paired' && x.n === 8 && x.d === 1.1 && x.alpha === 0.01);
    const res = fakeResult('paired', [{ term: 'time', statistic: 't', variant: 'paired', value: 3.1, df: 7, p: 0.02, dz: 1.1, cohensD: 0.7 }], [8, 8]);
    const [row] = computePower(res, fakeData(16, 0.01));
    expect(Math.abs(row.power - r.power)).toBeLessThanOrEqual(POWER_ABS);
    expect(row.alpha).toBe(0.01);
  });
  it('between ANOVA: f from partial eta squared, N = rows used; residual and Welch rows skipped (R case df 2, 27, N 30, f .3)', () => {
    const r = fx.f.find((x: any) => x.df1 === 2 && x.df2 === 27);
    const eta = (r.f * r.f) / (1 + r.f * r.f);
    const tests: TestRow[] = [
      { term: 'method', statistic: 'F', value: 3, df1: 2, df2: 27, p: 0.07, partialEtaSq: eta },
      { term: 'method', statistic: 'F', variant: 'welch', value: 3, df1: 2, df2: 17.3, p: 0.08 },
    ];
    const rows = computePower(fakeResult('anova', tests, [10, 10, 10]), fakeData(30, 0.05));
    expect(rows).toHaveLength(1);
    expect(rows[0].metric).toBe('f');
    expect(Math.abs(rows[0].observed - r.f)).toBeLessThan(1e-12);
    expect(Math.abs(rows[0].power - r.power)).toBeLessThanOrEqual(POWER_ABS);
  });
  it('designs with within factors get no F power rows', () => {
    const tests: TestRow[] = [{ term: 'time', statistic: 'F', value: 3, df1: 2, df2: 38, p: 0.06, partialEtaSq: 0.14 }];
    expect(computePower(fakeResult('anova', tests, [20, 20, 20]), fakeData(60, 0.05, 1))).toEqual([]);
  });
});
