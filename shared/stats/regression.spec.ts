/**
 * Multiple regression, checked against closed forms that hold by definition
 * (simple regression: b = Sxy/Sxx, R² = r², F = t²; VIF with two predictors
 * = 1/(1 − r₁₂²)). NIST StRD certified values are in test/reference/nist.test.ts,
 * R's lm in the R reference fixtures.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from './contract';
import { buildPrepared } from './prepared-builder';
import { analyseRegression } from './regression';

const X = [2, 4, 5, 7, 9, 11, 12, 15];
const Y = [3.1, 5.2, 5.0, 7.9, 9.6, 11.8, 12.1, 16.4];
const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;
const sxy = (a: number[], b: number[]) => a.reduce((s, v, i) => s + (v - mean(a)) * (b[i] - mean(b)), 0);

describe('analyseRegression, one predictor', () => {
  const r = analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x'] }, { x: X, y: Y }));

  it('slope = Sxy/Sxx, intercept = ȳ − b·x̄ (hand formulas)', () => {
    const b = sxy(X, Y) / sxy(X, X);
    expect(r.coefficients![1].estimate).toBeCloseTo(b, 13);
    expect(r.coefficients![0].estimate).toBeCloseTo(mean(Y) - b * mean(X), 12);
    expect(r.coefficients!.map((c) => c.term)).toEqual(['(intercept)', 'x']);
  });

  it('R² = r², F = t² of the slope, adjusted R² = 1 − (1 − R²)(n − 1)/(n − 2)', () => {
    const rr = sxy(X, Y) ** 2 / (sxy(X, X) * sxy(Y, Y));
    expect(r.rSquared).toBeCloseTo(rr, 13);
    expect(r.tests![0].value).toBeCloseTo(r.coefficients![1].value ** 2, 9);
    expect(r.tests![0].p).toBeCloseTo(r.coefficients![1].p, 12);
    expect(r.adjRSquared).toBeCloseTo(1 - ((1 - rr) * 7) / 6, 13);
  });

  it('slope SE = σ/√Sxx and the CI is estimate ± t(.975, n − 2)·SE', () => {
    const se = r.sigma! / Math.sqrt(sxy(X, X));
    const c = r.coefficients![1];
    expect(c.se).toBeCloseTo(se, 13);
    // t(0.975, 6) = 2.446912 (standard t table).
    expect((c.ciUpper - c.estimate) / c.se).toBeCloseTo(2.446912, 5);
  });

  it('gives the same answer when the data arrive centred on offsets', () => {
    const s = analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x'] }, { x: X, y: Y }, { x: 7, y: 9 }));
    s.coefficients!.forEach((c, i) => expect(c.estimate).toBeCloseTo(r.coefficients![i].estimate, 12));
    expect(s.coefficients![0].se).toBeCloseTo(r.coefficients![0].se, 12);
  });
});

describe('analyseRegression, several predictors', () => {
  const X2 = [1, 3, 2, 5, 4, 6, 8, 7];
  it('VIF with two predictors is 1/(1 − r₁₂²) (definition)', () => {
    const r = analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x', 'x2'] }, { x: X, x2: X2, y: Y }));
    const r12 = sxy(X, X2) ** 2 / (sxy(X, X) * sxy(X2, X2));
    expect(r.coefficients![1].vif).toBeCloseTo(1 / (1 - r12), 11);
    expect(r.coefficients![2].vif).toBeCloseTo(1 / (1 - r12), 11);
    expect(r.tests![0].df1).toBe(2);
    expect(r.tests![0].df2).toBe(5);
  });

  it('rejects a predictor that is a linear combination of others, naming it', () => {
    const twice = X.map((v, i) => 2 * v - X2[i]);
    expect(() =>
      analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x', 'x2', 'combo'] }, { x: X, x2: X2, combo: twice, y: Y })),
    ).toThrow(/"combo"/);
  });

  it('treats an exact fit as residual SD 0 with infinite F and a warning', () => {
    const exact = X.map((v, i) => 1 + 2 * v - 3 * X2[i]);
    const r = analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x', 'x2'] }, { x: X, x2: X2, y: exact }));
    expect(r.sigma).toBe(0);
    expect(r.tests![0].value).toBe(Infinity);
    expect(r.rSquared).toBe(1);
    expect(r.coefficients![2].estimate).toBeCloseTo(-3, 12);
    expect(r.warnings![0]).toMatch(/exactly/);
  });

  it('rejects too few rows and a constant predictor', () => {
    expect(() => analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x'] }, { x: [1, 2], y: [3, 4] }))).toThrow(InputError);
    expect(() => analyseRegression(buildPrepared({ design: 'regression', outcome: 'y', predictors: ['x'] }, { x: [1, 1, 1, 1], y: [3, 4, 5, 7] }))).toThrow(/same value/);
  });
});
