/**
 * Between-subjects ANOVA. One-way results are cross-checked against
 * @stdlib/stats (anova1, kruskal-test, levene-test, ttest2); factorial
 * sums of squares against identities that hold by construction (balanced
 * designs are orthogonal, so Type II = Type III and the SS add up to the
 * total; the highest-order interaction is the same under both types).
 * Type II/III values for unbalanced data are checked against R's car::Anova
 * in the R reference fixtures (test/reference).
 */
import { describe, expect, it } from 'vitest';
import anova1 from '@stdlib/stats/anova1';
import kruskalTest from '@stdlib/stats/kruskal-test';
import stdlibLevene from '@stdlib/stats/levene-test';
import ttest2 from '@stdlib/stats/ttest2';
import { analyseBetween, welchAnova } from './between-anova';
import { InputError } from './contract';
import { meanAndSs } from './linear-model';
import { buildPrepared } from './prepared-builder';

const CAMPUS = ['north', 'north', 'south', 'east', 'south', 'north', 'east', 'east', 'south', 'north', 'east', 'south', 'south', 'north'];
const HOURS = [12.5, 14, 9.5, 11, 8, 15.5, 10.5, 13, 7.5, 13.5, 12, 9, 10, 16];

/** Deterministic pseudo-random normal-ish noise (sum of 4 uniforms from an LCG). */
function noise(seed: number, n: number): number[] {
  let s = seed >>> 0;
  const u = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0), s / 2 ** 32);
  return Array.from({ length: n }, () => u() + u() + u() + u() - 2);
}

describe('analyseBetween, one-way', () => {
  const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'hours', between: ['campus'] }, { hours: HOURS, campus: CAMPUS }));
  const f = r.tests!.find((t) => t.term === 'campus' && !t.variant)!;

  it('matches @stdlib/stats/anova1 (SS, df, F, p)', () => {
    const ref = anova1(HOURS, CAMPUS) as any;
    expect(f.ss).toBeCloseTo(ref.treatment.ss, 11);
    expect(f.df1).toBe(ref.treatment.df);
    expect(r.residual!.ss).toBeCloseTo(ref.error.ss, 11);
    expect(r.residual!.df).toBe(ref.error.df);
    expect(f.value).toBeCloseTo(ref.statistic, 11);
    expect(f.p).toBeCloseTo(ref.pValue, 12);
  });

  it('eta² = SSB / SST and omega² = (SSB − dfB·MSE) / (SST + MSE) (definitions)', () => {
    const sst = meanAndSs(HOURS).ss;
    expect(f.etaSq).toBeCloseTo(f.ss! / sst, 13);
    expect(f.omegaSq).toBeCloseTo((f.ss! - 2 * r.residual!.ms) / (sst + r.residual!.ms), 13);
    expect(f.partialEtaSq).toBeCloseTo(f.etaSq!, 15);
  });

  it('Kruskal–Wallis matches @stdlib/stats/kruskal-test; Levene (mean) matches @stdlib/stats/levene-test', () => {
    const groups = ['north', 'south', 'east'].map((c) => HOURS.filter((_, i) => CAMPUS[i] === c));
    const kw = (kruskalTest as (...g: number[][]) => unknown)(...groups) as any;
    expect(r.nonparametric![0].value).toBeCloseTo(kw.statistic, 12);
    expect(r.nonparametric![0].p).toBeCloseTo(kw.pValue, 12);
    const lv = (stdlibLevene as (...g: number[][]) => unknown)(...groups) as any;
    expect(r.assumptions!.levene!.value).toBeCloseTo(lv.statistic, 12);
  });

  it('reports descriptives per level, Q-Q points in ascending order, and a variance ratio ≥ 1', () => {
    expect(r.descriptives!.map((c) => c.levels['campus'])).toEqual(['north', 'south', 'east']);
    const qq = r.qq!;
    expect(qq.length).toBe(HOURS.length);
    for (let i = 1; i < qq.length; i++) {
      expect(qq[i].observed).toBeGreaterThanOrEqual(qq[i - 1].observed);
      expect(qq[i].theoretical).toBeGreaterThan(qq[i - 1].theoretical);
    }
    expect(r.assumptions!.varianceRatio).toBeGreaterThanOrEqual(1);
  });
});

describe('welchAnova', () => {
  it('with two groups equals the squared Welch t, with the Welch–Satterthwaite df (identity; @stdlib/stats/ttest2)', () => {
    const a = [5.1, 6.3, 4.8, 7.2, 5.9, 6.6];
    const b = [7.9, 9.4, 6.1, 10.2, 8.8, 11.5, 7.3, 9.9];
    const w = welchAnova([a, b].map((g) => ({ n: g.length, ...meanAndSs(g) })))!;
    const ref = ttest2(a, b, { variance: 'unequal' }) as any;
    expect(w.value).toBeCloseTo(ref.statistic ** 2, 11);
    expect(w.df2).toBeCloseTo(ref.df, 10);
    expect(w.df1).toBe(1);
  });

  it('is not defined when a group has no variation', () => {
    expect(welchAnova([{ n: 3, mean: 1, ss: 0 }, { n: 3, mean: 2, ss: 1 }])).toBeNull();
  });
});

describe('analyseBetween, factorial', () => {
  // Balanced 3 × 2 design, 4 per cell.
  const a: string[] = [];
  const b: string[] = [];
  for (let i = 0; i < 24; i++) {
    a.push(['x', 'y', 'z'][i % 3]);
    b.push(['p', 'q'][Math.floor(i / 3) % 2]);
  }
  const y = noise(7, 24).map((e, i) => 10 + (a[i] === 'y' ? 1 : 0) + (b[i] === 'q' ? 0.7 : 0) + (a[i] === 'z' && b[i] === 'q' ? 1.2 : 0) + e);

  it('balanced: Type II equals Type III and the SS add up to the total (orthogonality)', () => {
    const t3 = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'] }, { y, a, b }));
    const t2 = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'], ssType: 2 }, { y, a, b }));
    expect(t3.tests!.map((t) => t.term)).toEqual(['a', 'b', 'a:b']);
    t3.tests!.forEach((t, i) => expect(t.ss).toBeCloseTo(t2.tests![i].ss!, 11));
    const sum = t3.tests!.reduce((s, t) => s + t.ss!, 0) + t3.residual!.ss;
    expect(sum).toBeCloseTo(meanAndSs(y).ss, 11);
    expect(t3.residual!.df).toBe(24 - 6);
  });

  it('unbalanced: the interaction SS is the same under Type II and III, main effects differ', () => {
    const keep = y.map((_, i) => i % 7 !== 0 && i !== 10);
    const pick = <T,>(v: T[]) => v.filter((_, i) => keep[i]);
    const cols = { y: pick(y), a: pick(a), b: pick(b) };
    const t3 = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'] }, cols));
    const t2 = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'], ssType: 2 }, cols));
    expect(t3.tests![2].ss).toBeCloseTo(t2.tests![2].ss!, 11);
    expect(Math.abs(t3.tests![0].ss! - t2.tests![0].ss!)).toBeGreaterThan(1e-6);
  });

  it('simple effects: SS of a within b = p is the one-way SS of the p cells, tested on the full-model MSE', () => {
    const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'] }, { y, a, b }));
    const row = r.simpleEffects!.find((s) => s.factor === 'a' && s.at.level === 'p')!;
    const cells = ['x', 'y', 'z'].map((l) => y.filter((_, i) => a[i] === l && b[i] === 'p'));
    const grand = cells.flat().reduce((s, v) => s + v, 0) / 12;
    const ss = cells.reduce((s, c) => s + c.length * (c.reduce((t, v) => t + v, 0) / c.length - grand) ** 2, 0);
    expect(row.ss).toBeCloseTo(ss, 12);
    expect(row.df1).toBe(2);
    expect(row.df2).toBe(r.residual!.df);
    expect(row.value).toBeCloseTo(ss / 2 / r.residual!.ms, 11);
    expect(r.simpleEffects!.length).toBe(2 + 3);
  });

  it('three factors: all 7 terms in plan order', () => {
    const c = y.map((_, i) => (i % 4 < 2 ? 'u' : 'v'));
    const yy = [...y, ...y.map((v) => v + 0.5)];
    const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b', 'c'] }, { y: yy, a: [...a, ...a], b: [...b, ...b], c: [...c, ...c] }));
    expect(r.tests!.map((t) => t.term)).toEqual(['a', 'b', 'c', 'a:b', 'a:c', 'b:c', 'a:b:c']);
  });

  it('an empty cell is an InputError under Type III and a warning under Type II', () => {
    const keep = a.map((l, i) => !(l === 'z' && b[i] === 'q'));
    const pick = <T,>(v: T[]) => v.filter((_, i) => keep[i]);
    const cols = { y: pick(y), a: pick(a), b: pick(b) };
    expect(() => analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'] }, cols))).toThrow(/a = z, b = q/);
    const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'], ssType: 2 }, cols));
    expect(r.warnings!.join(' ')).toMatch(/no observations/);
    expect(r.tests![2].df1).toBe(1);
  });

  it('lists an outlying row by its spreadsheet row number (header = row 1)', () => {
    const yo = [...y];
    yo[17] += 25;
    const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'] }, { y: yo, a, b }));
    // The 18th data row sits on row 19 of the sheet.
    expect(r.outliers!.map((o) => o.row)).toEqual([19]);
  });

  it('calls the pairwise comparisons with marginal means (estimate = difference of level means)', () => {
    const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a', 'b'], comparisons: [{ factor: 'a', method: 'holm' }] }, { y, a, b }));
    const mean = (l: string) => y.filter((_, i) => a[i] === l).reduce((s, v) => s + v, 0) / 8;
    const row = r.comparisons!.find((c) => c.a === 'x' && c.b === 'y')!;
    expect(row.estimate).toBeCloseTo(mean('x') - mean('y'), 12);
    expect(row.df).toBe(r.residual!.df);
    expect(() =>
      analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['a'], comparisons: [{ factor: 'b', method: 'holm' }] }, { y, a, b })),
    ).toThrow(InputError);
  });
});

describe('analyseBetween, large samples', () => {
  it('runs Shapiro–Wilk on a 5000-residual subsample above 5000 rows, with a warning', () => {
    const n = 6001;
    const g = Array.from({ length: n }, (_, i) => ['a', 'b'][i % 2]);
    const r = analyseBetween(buildPrepared({ design: 'anova', outcome: 'y', between: ['g'] }, { y: noise(3, n), g }));
    expect(r.assumptions!.normality!.n).toBe(5000);
    expect(r.warnings!.join(' ')).toMatch(/5000 residuals/);
    expect(r.qq!.length).toBe(200);
  });
});
