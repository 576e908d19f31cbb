/**
 * Critical values spot-checked against printed handbook tables, and the same
 * entries checked against R (test/reference/dist/critical.json) so a mistyped
 * table entry cannot pass silently.
 * Tables: Pearson & Hartley, Biometrika Tables for Statisticians, vol. 1 —
 * percentage points of the t distribution, of the F distribution (upper 5%),
 * and of the studentized range (upper 5%, after Harter's computations).
 * The entries below were typed from memory of those tables, then confirmed
 * against R; they carry the printed rounding (3 decimals for t, 2 for F and q).
 */
import { describe, expect, it } from 'vitest';
import { chiSquare, fisherF, normal, studentizedRange, studentT } from './index';
import { loadDistFixture } from './fixture-loader.spec-helper';

const crit = loadDistFixture('critical.json').critical;

// t(.975; df), Biometrika Tables vol. 1 (from memory)
const T975: Record<number, number> = { 1: 12.706, 2: 4.303, 5: 2.571, 10: 2.228, 20: 2.086, 30: 2.042, 60: 2.0, 120: 1.98 };
// F(.95; df1, df2), Biometrika Tables vol. 1 (from memory)
const F95: Record<string, number> = { '1,10': 4.96, '2,27': 3.35, '3,20': 3.1, '4,30': 2.69, '5,60': 2.37, '1,120': 3.92 };
// q(.05; k, df), studentized range upper 5% points, Biometrika Tables vol. 1 (from memory)
const Q05: Record<string, number> = { '2,10': 3.15, '3,10': 3.88, '3,20': 3.58, '4,20': 3.96, '5,30': 4.1, '6,24': 4.37, '10,60': 4.65, '4,60': 3.74 };

describe('critical values against handbook tables', () => {
  it('t(.975; df) agrees with the printed table to its 3 decimals', () => {
    for (const r of crit.t) {
      const table = T975[r.df];
      const ours = studentT(r.df).quantile(0.975);
      expect(Math.abs(ours - table), `df=${r.df}: ours ${ours}, table ${table}`).toBeLessThanOrEqual(0.0005 + 1e-12);
      expect(Math.abs(r.r - table), `R disagrees with the typed table at df=${r.df}`).toBeLessThanOrEqual(0.0005 + 1e-12);
      expect(Math.abs(ours - r.r) / r.r).toBeLessThan(1e-9);
    }
  });
  it('F(.95; df1, df2) agrees with the printed table to its 2 decimals', () => {
    for (const r of crit.f) {
      const table = F95[`${r.df1},${r.df2}`];
      const ours = fisherF(r.df1, r.df2).quantile(0.95);
      expect(Math.abs(ours - table), `F(${r.df1},${r.df2}): ours ${ours}, table ${table}`).toBeLessThanOrEqual(0.005 + 1e-12);
      expect(Math.abs(r.r - table), `R disagrees with the typed table at ${r.df1},${r.df2}`).toBeLessThanOrEqual(0.005 + 1e-12);
      expect(Math.abs(ours - r.r) / r.r).toBeLessThan(1e-9);
    }
  });
  it('q(.05; k, df) agrees with the printed table to its 2 decimals', () => {
    for (const r of crit.q) {
      const table = Q05[`${r.k},${r.df}`];
      const ours = studentizedRange(r.k, r.df).quantile(0.95);
      expect(Math.abs(ours - table), `q(${r.k},${r.df}): ours ${ours}, table ${table}`).toBeLessThanOrEqual(0.005 + 1e-12);
      expect(Math.abs(r.r - table), `R disagrees with the typed table at k=${r.k}, df=${r.df}`).toBeLessThanOrEqual(0.005 + 1e-12);
      expect(Math.abs(ours - r.r) / r.r).toBeLessThan(1e-7);
    }
  }, 30_000);
});

describe('edge cases', () => {
  it('invalid parameters give NaN, not a number that looks valid', () => {
    expect(studentT(0).cdf(1)).toBeNaN();
    expect(studentT(5).cdf(NaN)).toBeNaN();
    expect(fisherF(-1, 3).sf(2)).toBeNaN();
    expect(studentT(5).quantile(1.5)).toBeNaN();
    expect(studentizedRange(1, 10).cdf(2)).toBeNaN();
  });
  it('infinite arguments and limits', () => {
    expect(studentT(5).sf(Infinity)).toBe(0);
    expect(studentT(5).cdf(-Infinity)).toBe(0);
    expect(fisherF(2, 9).sf(0)).toBe(1);
    expect(studentT(7).quantile(0)).toBe(-Infinity);
    expect(fisherF(2, 9).quantile(1)).toBe(Infinity);
    // t with infinite df is the standard normal
    expect(studentT(Infinity).sf(1.96)).toBe(normal().sf(1.96));
    expect(Math.abs(studentT(1e12).sf(1.96) - normal().sf(1.96))).toBeLessThan(1e-12);
    // F(df1, ∞) is χ²(df1)/df1 and F(∞, df2) is df2/χ²(df2)
    expect(fisherF(3, Infinity).sf(2.6)).toBe(chiSquare(3).sf(7.8));
    expect(fisherF(Infinity, 4).cdf(2)).toBe(chiSquare(4).sf(2));
    expect(Math.abs(fisherF(3, 1e9).sf(2.6) - chiSquare(3).sf(7.8))).toBeLessThan(1e-8);
  });
});
