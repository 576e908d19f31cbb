/**
 * Householder QR least squares, checked against hand-solvable systems and the
 * defining identities of least squares (normal equations, (X'X)·(X'X)^-1 = I).
 */
import { describe, expect, it } from 'vitest';
import { lastBlockSs, meanAndSs, qrFit, solveWith, unscaledCovariance } from './linear-model';

describe('meanAndSs', () => {
  it('gives mean 2.5 and SS 5 for 1, 2, 3, 4 (hand computation)', () => {
    expect(meanAndSs([1, 2, 3, 4])).toEqual({ mean: 2.5, ss: 5 });
  });

  it('is shift-invariant for SS even with a 1e12 offset (two-pass property)', () => {
    const base = [0.4, 0.3, 0.5, 0.3, 0.6];
    const a = meanAndSs(base);
    const b = meanAndSs(base.map((v) => v + 1e6));
    // 1e6 + 0.x keeps about 10 decimals: SS agrees to 1e-9 relative.
    expect(Math.abs(b.ss - a.ss) / a.ss).toBeLessThan(1e-9);
  });

  it('gives NaN for an empty segment', () => {
    expect(meanAndSs([]).mean).toBeNaN();
  });
});

describe('qrFit', () => {
  it('recovers an exact line y = 2 + 3x (hand computation)', () => {
    const x = [0, 1, 2, 3, 4];
    const fit = qrFit([[1, 1, 1, 1, 1], x], x.map((v) => 2 + 3 * v));
    expect(fit.rank).toBe(2);
    expect(fit.coef[0]).toBeCloseTo(2, 13);
    expect(fit.coef[1]).toBeCloseTo(3, 13);
    expect(fit.rss).toBeLessThan(1e-24);
  });

  it('solves y = (1, 2, 4) on (1, x) with x = (0, 1, 2): b = (5/6, 3/2), RSS = 1/6 (hand computation)', () => {
    const fit = qrFit([[1, 1, 1], [0, 1, 2]], [1, 2, 4]);
    expect(fit.coef[0]).toBeCloseTo(5 / 6, 14);
    expect(fit.coef[1]).toBeCloseTo(1.5, 14);
    expect(fit.rss).toBeCloseTo(1 / 6, 14);
    expect(fit.dfResidual).toBe(1);
  });

  it('flags a repeated column as aliased and still fits the others', () => {
    const x = [1, 2, 3, 5, 8];
    const fit = qrFit([[1, 1, 1, 1, 1], x, x.map((v) => 2 * v)], [2, 4, 5, 9, 15]);
    expect(fit.rank).toBe(2);
    expect(fit.aliased).toEqual([false, false, true]);
    expect(fit.coef[2]).toBeNaN();
  });

  it('satisfies the normal equations X\'(y − Xb) = 0 (defining property)', () => {
    const cols = [[1, 1, 1, 1, 1, 1], [0.5, 1.5, 2, 3, 4.5, 6], [1, 0, 1, 0, 1, 1]];
    const y = [1.2, 2.9, 3.1, 4.8, 6.7, 9.9];
    const fit = qrFit(cols, y);
    const resid = y.map((v, i) => v - cols.reduce((s, c, j) => s + c[i] * fit.coef[j], 0));
    for (const c of cols) expect(Math.abs(c.reduce((s, v, i) => s + v * resid[i], 0))).toBeLessThan(1e-12);
    expect(fit.rss).toBeCloseTo(resid.reduce((s, r) => s + r * r, 0), 12);
  });

  it('gives (X\'X)^-1 whose product with X\'X is the identity (defining property)', () => {
    const cols = [[1, 1, 1, 1, 1], [2, 4, 5, 7, 9], [1, 3, 2, 6, 4]];
    const inv = unscaledCovariance(qrFit(cols, [1, 2, 3, 4, 5]));
    for (let a = 0; a < 3; a++)
      for (let b = 0; b < 3; b++) {
        let s = 0;
        for (let m = 0; m < 3; m++) s += cols[a].reduce((t, v, i) => t + v * cols[m][i], 0) * inv[m][b];
        expect(s).toBeCloseTo(a === b ? 1 : 0, 12);
      }
  });

  it('solveWith reuses the factors: same coefficients as a fresh fit for a new response', () => {
    const cols = [[1, 1, 1, 1, 1], [2, 4, 5, 7, 9], [1, 3, 2, 6, 4]];
    const fit = qrFit(cols, [1, 2, 3, 4, 5]);
    const y2 = [3.5, -1, 2.25, 8, 0.5];
    const fresh = qrFit(cols, y2).coef;
    solveWith(fit, y2).forEach((b, j) => expect(b).toBeCloseTo(fresh[j], 13));
  });

  it('splits the model SS sequentially: SS(x | 1) = Sxy²/Sxx (hand computation)', () => {
    const x = [1, 2, 3, 4];
    const y = [2, 3, 7, 8];
    // Sxx = 5, Sxy = 11 → SS = 121/5.
    const { ss, df } = lastBlockSs(qrFit([[1, 1, 1, 1], x], y), 1);
    expect(df).toBe(1);
    expect(ss).toBeCloseTo(121 / 5, 13);
  });
});
