/**
 * t-test designs, cross-checked against @stdlib/stats/ttest (one-sample and
 * paired) and @stdlib/stats/ttest2 (Student and Welch), an independent
 * implementation; rank tests and input errors checked directly.
 */
import { describe, expect, it } from 'vitest';
import ttest from '@stdlib/stats/ttest';
import ttest2 from '@stdlib/stats/ttest2';
import wilcoxon from '@stdlib/stats/wilcoxon';
import { InputError } from './contract';
import { buildPrepared } from './prepared-builder';
import { analyseIndependent, analyseOneSample, analysePaired } from './t-tests';

interface StdlibT {
  statistic: number;
  pValue: number;
  df: number;
  ci: number[];
}

const SCORES = [61.5, 70.25, 58, 66.75, 73.5, 69, 55.25, 64, 71.75, 62.5];

describe('analyseOneSample', () => {
  it('matches @stdlib/stats/ttest with mu = 60 (t, df, p, CI)', () => {
    const d = buildPrepared({ design: 'one-sample', outcome: 'y', mu: 60 }, { y: SCORES });
    const r = analyseOneSample(d);
    const ref = ttest(SCORES, { mu: 60 }) as StdlibT;
    const t = r.tests![0];
    expect(t.term).toBe('mean');
    expect(t.statistic).toBe('t');
    expect(t.df).toBe(ref.df);
    expect(t.value).toBeCloseTo(ref.statistic, 12);
    expect(t.p).toBeCloseTo(ref.pValue, 12);
    // stdlib's interval is for the mean; ours is for mean − mu.
    expect(t.ciLower! + 60).toBeCloseTo(ref.ci[0], 10);
    expect(t.ciUpper! + 60).toBeCloseTo(ref.ci[1], 10);
  });

  it('gives the same answer when the data arrive centred on an offset (offset added back)', () => {
    const plain = analyseOneSample(buildPrepared({ design: 'one-sample', outcome: 'y', mu: 60 }, { y: SCORES }));
    const shifted = analyseOneSample(buildPrepared({ design: 'one-sample', outcome: 'y', mu: 60 }, { y: SCORES }, { y: 64 }));
    expect(shifted.tests![0].estimate).toBeCloseTo(plain.tests![0].estimate!, 13);
    expect(shifted.descriptives![0].mean).toBeCloseTo(plain.descriptives![0].mean, 13);
    expect(shifted.tests![0].value).toBeCloseTo(plain.tests![0].value, 12);
  });

  it('adds a z row with the known SD: z = (mean − mu)·√n / sigma (hand computation)', () => {
    const r = analyseOneSample(buildPrepared({ design: 'one-sample', outcome: 'y', mu: 60, sigma: 5 }, { y: SCORES }));
    const z = r.tests!.find((t) => t.statistic === 'z')!;
    const mean = SCORES.reduce((a, b) => a + b, 0) / SCORES.length;
    expect(z.value).toBeCloseTo(((mean - 60) * Math.sqrt(10)) / 5, 12);
    expect(z.ciUpper! - z.ciLower!).toBeCloseTo((2 * 1.959963984540054 * 5) / Math.sqrt(10), 8);
  });

  it('rejects constant data and a non-positive sigma', () => {
    expect(() => analyseOneSample(buildPrepared({ design: 'one-sample', outcome: 'y' }, { y: [3, 3, 3] }))).toThrow(InputError);
    expect(() => analyseOneSample(buildPrepared({ design: 'one-sample', outcome: 'y', sigma: -1 }, { y: SCORES }))).toThrow(/plan.sigma/);
  });
});

const GROUP = ['day', 'day', 'evening', 'day', 'evening', 'evening', 'day', 'evening', 'day', 'evening', 'evening', 'day', 'evening'];
const MARK = [71, 64.5, 58, 69, 61.5, 55, 73.5, 60, 66, 52.5, 63, 70, 57.25];
const split = (lvl: string) => MARK.filter((_, i) => GROUP[i] === lvl);

describe('analyseIndependent', () => {
  const r = analyseIndependent(buildPrepared({ design: 'independent', outcome: 'mark', between: ['group'] }, { mark: MARK, group: GROUP }));

  it('Student row matches @stdlib/stats/ttest2 with variance "equal"', () => {
    const ref = ttest2(split('day'), split('evening'), { variance: 'equal' }) as StdlibT;
    const t = r.tests!.find((x) => x.variant === 'student')!;
    expect(t.df).toBe(ref.df);
    expect(t.value).toBeCloseTo(ref.statistic, 12);
    expect(t.p).toBeCloseTo(ref.pValue, 12);
    expect(t.ciLower).toBeCloseTo(ref.ci[0], 10);
    expect(t.ciUpper).toBeCloseTo(ref.ci[1], 10);
  });

  it('Welch row matches @stdlib/stats/ttest2 with variance "unequal" (Welch–Satterthwaite df)', () => {
    const ref = ttest2(split('day'), split('evening'), { variance: 'unequal' }) as StdlibT;
    const t = r.tests!.find((x) => x.variant === 'welch')!;
    expect(t.df).toBeCloseTo(ref.df, 10);
    expect(t.value).toBeCloseTo(ref.statistic, 12);
    expect(t.p).toBeCloseTo(ref.pValue, 12);
    expect(t.ciLower).toBeCloseTo(ref.ci[0], 8);
  });

  it('estimate is level 1 minus level 2 in factor order, d = estimate / pooled SD', () => {
    const t = r.tests![0];
    const day = split('day');
    const eve = split('evening');
    const mean = (x: number[]) => x.reduce((a, b) => a + b, 0) / x.length;
    expect(t.estimate).toBeCloseTo(mean(day) - mean(eve), 12);
    const ss = (x: number[]) => x.reduce((a, b) => a + (b - mean(x)) ** 2, 0);
    expect(t.cohensD).toBeCloseTo(t.estimate! / Math.sqrt((ss(day) + ss(eve)) / (MARK.length - 2)), 12);
    expect(r.descriptives!.map((c) => c.levels['group'])).toEqual(['day', 'evening']);
  });

  it('reports both variance tests, normality and the Mann–Whitney W of level 1', () => {
    expect(r.assumptions!.levene!.center).toBe('mean');
    expect(r.assumptions!.brownForsythe!.center).toBe('median');
    expect(r.assumptions!.normality!.method).toBe('shapiro-wilk');
    const np = r.nonparametric![0];
    expect(np.method).toBe('mann-whitney');
    // W is the number of (day, evening) pairs with the day mark higher (no ties in these data).
    const pairs = split('day').reduce((s, a) => s + split('evening').filter((b) => a > b).length, 0);
    expect(np.value).toBe(pairs);
  });

  it('rejects a grouping column with three levels and a group with one observation', () => {
    expect(() =>
      analyseIndependent(buildPrepared({ design: 'independent', outcome: 'y', between: ['g'] }, { y: [1, 2, 3, 4], g: ['a', 'b', 'c', 'a'] })),
    ).toThrow(/exactly two groups/);
    expect(() =>
      analyseIndependent(buildPrepared({ design: 'independent', outcome: 'y', between: ['g'] }, { y: [1, 2, 3, 4], g: ['a', 'a', 'a', 'b'] })),
    ).toThrow(/at least two/);
  });
});

describe('analysePaired', () => {
  const pre = [12.5, 14, 11, 16.5, 13, 15.5, 12, 17];
  const post = [14, 15.5, 11.5, 18, 15, 15, 14.5, 19.5];
  const subjects = pre.map((_, i) => `s${i + 1}`);
  const long = {
    id: [...subjects, ...subjects.slice(0, 7).reverse(), 'late'],
    when: [...pre.map(() => 'pre'), ...subjects.slice(0, 7).map(() => 'post'), 'post'],
    y: [...pre, ...post.slice(0, 7).reverse(), 20],
  };

  it('pairs rows by subject, drops subjects missing a condition, and matches @stdlib/stats/ttest (paired)', () => {
    const r = analysePaired(buildPrepared({ design: 'paired', outcome: 'y', within: ['when'], subject: 'id' }, long));
    // s8 has no post row and "late" no pre row: both dropped.
    expect(r.excluded).toBe(2);
    expect(r.warnings![0]).toMatch(/2 subject\(s\)/);
    const ref = ttest(pre.slice(0, 7), post.slice(0, 7)) as StdlibT;
    const t = r.tests![0];
    expect(t.variant).toBe('paired');
    expect(t.df).toBe(ref.df);
    expect(t.value).toBeCloseTo(ref.statistic, 12);
    expect(t.p).toBeCloseTo(ref.pValue, 12);
    expect(t.ciLower).toBeCloseTo(ref.ci[0], 10);
    expect(t.dz).toBeCloseTo(t.cohensD!, 15);
  });

  it('Wilcoxon signed-rank on the differences matches @stdlib/stats/wilcoxon', () => {
    const r = analysePaired(buildPrepared({ design: 'paired', outcome: 'y', within: ['when'], subject: 'id' }, long));
    const ref = wilcoxon(pre.slice(0, 7), post.slice(0, 7)) as { statistic: number; pValue: number };
    expect(r.nonparametric![0].value).toBe(ref.statistic);
    expect(r.nonparametric![0].p).toBeCloseTo(ref.pValue, 12);
  });

  it('rejects a subject with two rows for the same condition, naming the subject', () => {
    const dup = { id: ['a', 'a', 'a', 'b', 'b'], when: ['pre', 'post', 'pre', 'pre', 'post'], y: [1, 2, 3, 4, 5] };
    expect(() => analysePaired(buildPrepared({ design: 'paired', outcome: 'y', within: ['when'], subject: 'id' }, dup))).toThrow(/'a'/);
  });
});
