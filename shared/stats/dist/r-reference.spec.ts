/**
 * Distribution layer against R (stats package) over df from 1 to 10^6.
 * Source: test/reference/dist/*.json, written by test/reference/dist/generate-dist.R.
 * Required: p to 1e-6 absolute, quantiles to 1e-6 relative; the tolerances
 * asserted below are tighter, at what the implementation achieves.
 */
import { describe, expect, it } from 'vitest';
import { chiSquare, fisherF, noncentralF, noncentralT, normal, studentizedRange, studentT } from './index';
import { ErrorTally, loadDistFixture } from './fixture-loader.spec-helper';

const central = loadDistFixture('central.json');

function checkTails(name: string, rows: any[], make: (r: any) => { cdf(x: number): number; sf(x: number): number }, absTol: number, relTol: number) {
  const tally = new ErrorTally();
  for (const r of rows) {
    const d = make(r);
    const lower = d.cdf(r.x);
    const upper = d.sf(r.x);
    tally.add(lower, r.lower, relTol > 0 ? 1e-300 : Infinity);
    tally.add(upper, r.upper, relTol > 0 ? 1e-300 : Infinity);
    const ctx = `${name} ${JSON.stringify(r)} got lower ${lower}, upper ${upper}`;
    expect(Math.abs(lower - r.lower), ctx).toBeLessThanOrEqual(absTol);
    expect(Math.abs(upper - r.upper), ctx).toBeLessThanOrEqual(absTol);
    const [a, e] = r.upper < r.lower ? [upper, r.upper] : [lower, r.lower];
    if (relTol > 0 && e > 0) {
      // the small tail must keep relative precision (it is computed directly, not as 1 − cdf)
      expect(Math.abs(a - e) / e, ctx).toBeLessThanOrEqual(relTol);
    }
  }
  console.info(`[R] ${name}: ${tally}`);
}

function checkQuantiles(name: string, rows: any[], q: (r: any) => number, relTol: number, key = 'q') {
  const tally = new ErrorTally();
  for (const r of rows) {
    const got = q(r);
    tally.add(got, r[key]);
    expect(Math.abs(got - r[key]) / Math.abs(r[key] || 1), `${name} ${JSON.stringify(r)} got ${got}`).toBeLessThanOrEqual(relTol);
  }
  console.info(`[R] ${name}: ${tally}`);
}

describe('central distributions against R (pt, pf, pchisq, pnorm and quantiles)', () => {
  it('Student t tails match R pt(lower.tail = TRUE/FALSE) to 1e-11 abs, small tail 5e-10 rel', () => {
    checkTails('pt', central.t.p, (r) => studentT(r.df), 1e-11, 5e-10);
  });
  it('Student t quantiles match R qt to 1e-10 rel', () => {
    checkQuantiles('qt', central.t.q, (r) => studentT(r.df).quantile(r.p), 1e-10);
  });
  it('F tails match R pf to 1e-11 abs, small tail 5e-10 rel', () => {
    checkTails('pf', central.f.p, (r) => fisherF(r.df1, r.df2), 1e-11, 5e-10);
  });
  it('F quantiles match pf inverted in R to 1e-10 rel (R qf approximates above df 4e5)', () => {
    checkQuantiles('qf', central.f.q, (r) => fisherF(r.df1, r.df2).quantile(r.p), 1e-10);
  });
  it('chi-square tails match R pchisq to 1e-11 abs, small tail 5e-10 rel', () => {
    checkTails('pchisq', central.chisq.p, (r) => chiSquare(r.df), 1e-11, 5e-10);
  });
  it('chi-square quantiles match R qchisq to 1e-10 rel', () => {
    checkQuantiles('qchisq', central.chisq.q, (r) => chiSquare(r.df).quantile(r.p), 1e-10);
  });
  it('normal tails match R pnorm to 1e-12 rel down to 1e-300', () => {
    checkTails('pnorm', central.normal.p, () => normal(), 1e-15, 1e-12);
  });
  it('normal quantiles match R qnorm to 1e-12 rel', () => {
    checkQuantiles('qnorm', central.normal.q, (r) => normal().quantile(r.p), 1e-12);
  });
});

describe('studentized range against R (ptukey, qtukey)', () => {
  const sr = loadDistFixture('studentized-range.json');
  it('cdf matches R ptukey to 1e-8 abs', () => {
    checkTails('ptukey', sr.p.map((r: any) => ({ ...r, x: r.q, upper: 1 - r.lower })), (r) => studentizedRange(r.k, r.df), 1e-8, 0);
  }, 60_000);
  it('quantile matches ptukey inverted in R (uniroot, tol 1e-13) to 1e-7 rel, and qtukey to its own 1e-4', () => {
    const tight = new ErrorTally();
    for (const r of sr.q) {
      const got = studentizedRange(r.k, r.df).quantile(r.p);
      tight.add(got, r.q);
      const ctx = `qtukey ${JSON.stringify(r)} got ${got}`;
      expect(Math.abs(got - r.q) / r.q, ctx).toBeLessThanOrEqual(1e-7);
      // R's qtukey stops its secant search at eps = 1e-4
      expect(Math.abs(got - r.qtukey) / r.qtukey, ctx).toBeLessThanOrEqual(1e-4);
    }
    console.info(`[R] qtukey (vs ptukey inverted): ${tight}`);
  }, 60_000);
});

describe('noncentral t and F against R (pt(ncp =), pf(ncp =))', () => {
  const nc = loadDistFixture('noncentral.json');
  it('noncentral t matches R to 1e-10 abs', () => {
    // R's own pnt is accurate to about 1e-12 absolute only (it can return −1e-11), so no relative check.
    checkTails('pt(ncp)', nc.t, (r) => noncentralT(r.df, r.ncp), 1e-10, 0);
  });
  it('noncentral F matches R to 1e-8 abs', () => {
    // R's pnbeta stops at errmax 1e-9, hence the wider tolerance.
    checkTails('pf(ncp)', nc.f, (r) => noncentralF(r.df1, r.df2, r.ncp), 1e-8, 0);
  });
});
