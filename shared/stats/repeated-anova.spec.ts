/**
 * Repeated-measures and mixed ANOVA. Exact identities with an independent
 * library: a two-level within factor's F equals the squared paired t
 * (@stdlib/stats/ttest); in a 2 × 2 mixed design the group F equals the squared
 * Student t on subject means and the group:time F the squared Student t on
 * difference scores (@stdlib/stats/ttest2), for unequal group sizes too.
 * The R reference fixtures (afex) live under test/reference/.
 */
import { describe, expect, it } from 'vitest';
import ttest from '@stdlib/stats/ttest';
import ttest2 from '@stdlib/stats/ttest2';
import type { ComparisonRequest } from './contract';
import type { Factor, PreparedData } from './prepared';
import { analyseRepeated } from './repeated-anova';

interface Row {
  id: string;
  y: number;
  group?: string;
  time?: string;
  a?: string;
  b?: string;
  w?: string;
  v?: string;
}

type FactorColumn = Exclude<keyof Row, 'id' | 'y'>;

function factor(name: string, labels: string[]): Factor {
  const levels = [...new Set(labels)];
  return { name, levels, codes: Int32Array.from(labels, (l) => levels.indexOf(l)) };
}

/** PreparedData from long rows (offset 0 unless given). */
function prepared(rows: Row[], between: FactorColumn[], within: FactorColumn[], comparisons: ComparisonRequest[] = [], offset = 0, ssType: 2 | 3 = 3): PreparedData {
  return {
    plan: { design: 'anova', outcome: 'y', subject: 'id', alpha: 0.05, ssType, between, within, predictors: [], comparisons },
    n: rows.length,
    outcome: { name: 'y', values: Float64Array.from(rows, (r) => r.y - offset), offset },
    between: between.map((b) => factor(b, rows.map((r) => String(r[b])))),
    within: within.map((w) => factor(w, rows.map((r) => String(r[w])))),
    subject: factor('id', rows.map((r) => r.id)),
    predictors: [],
    rowNumbers: Int32Array.from(rows, (_, i) => i + 1),
    excluded: 0,
    warnings: [],
  };
}

/** Deterministic noise (LCG → Box–Muller). */
function noise(seed: number) {
  let s = seed >>> 0;
  const u = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) + 0.5) / 2 ** 32;
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
}

/** Mixed design rows: groups of the given sizes × within levels, with subject and interaction effects. */
function mixedRows(sizes: number[], times: string[], seed: number): Row[] {
  const z = noise(seed);
  const rows: Row[] = [];
  let id = 0;
  sizes.forEach((n, g) => {
    for (let s = 0; s < n; s++) {
      const subj = 3 * z();
      id++;
      times.forEach((t, k) => rows.push({ id: `S${id}`, group: `g${g + 1}`, time: t, y: 50 + subj + k * g * 0.8 + (1 + k * 0.4) * z() }));
    }
  });
  return rows;
}

const byTerm = (r: ReturnType<typeof analyseRepeated>, term: string) => r.tests!.find((t) => t.term === term)!;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('analyseRepeated: identities with t tests (source: @stdlib/stats/ttest, ttest2)', () => {
  it('two within levels: F = paired t², same p; no sphericity row', () => {
    const rows = mixedRows([14], ['pre', 'post'], 3);
    const r = analyseRepeated(prepared(rows, [], ['time']));
    const pre = rows.filter((x) => x.time === 'pre').map((x) => x.y);
    const post = rows.filter((x) => x.time === 'post').map((x) => x.y);
    const t = ttest(pre, post);
    const f = byTerm(r, 'time');
    expect(rel(f.value, t.statistic ** 2)).toBeLessThan(1e-10);
    expect(Math.abs(f.p - t.pValue)).toBeLessThan(1e-12);
    expect([f.df1, f.df2]).toEqual([1, 13]);
    expect(f.sphericity).toBeUndefined();
    expect(f.corrections).toBeUndefined();
  });

  for (const sizes of [[9, 9], [7, 12]]) {
    it(`2 × 2 mixed (${sizes.join(' vs ')}): group F = t² on subject means, group:time F = t² on differences`, () => {
      const rows = mixedRows(sizes, ['t1', 't2'], 17);
      const r = analyseRepeated(prepared(rows, ['group'], ['time']));
      const subjects = [...new Set(rows.map((x) => x.id))];
      const of = (id: string, t: string) => rows.find((x) => x.id === id && x.time === t)!;
      const grp = (g: string) => subjects.filter((id) => of(id, 't1').group === g);
      const means = (g: string) => grp(g).map((id) => (of(id, 't1').y + of(id, 't2').y) / 2);
      const diffs = (g: string) => grp(g).map((id) => of(id, 't1').y - of(id, 't2').y);
      const tg = ttest2(means('g1'), means('g2'), { variance: 'equal' });
      const ti = ttest2(diffs('g1'), diffs('g2'), { variance: 'equal' });
      expect(rel(byTerm(r, 'group').value, tg.statistic ** 2)).toBeLessThan(1e-10);
      expect(Math.abs(byTerm(r, 'group').p - tg.pValue)).toBeLessThan(1e-12);
      expect(rel(byTerm(r, 'group:time').value, ti.statistic ** 2)).toBeLessThan(1e-10);
      expect(byTerm(r, 'group:time').df2).toBe(sizes[0] + sizes[1] - 2);
      expect(r.tests!.map((t) => t.term)).toEqual(['group', 'time', 'group:time']);
    });
  }
});

describe('analyseRepeated: decomposition and effect sizes', () => {
  const rows = mixedRows([6, 6, 6], ['t1', 't2', 't3', 't4'], 5);
  const r = analyseRepeated(prepared(rows, ['group'], ['time'], [], 0));

  it('balanced: term SS plus error SS add up to the total SS (split-plot identity)', () => {
    const mean = rows.reduce((a, x) => a + x.y, 0) / rows.length;
    const total = rows.reduce((a, x) => a + (x.y - mean) ** 2, 0);
    const g = byTerm(r, 'group');
    const t = byTerm(r, 'time');
    const gt = byTerm(r, 'group:time');
    expect(rel(g.ss! + g.errorSs! + t.ss! + gt.ss! + t.errorSs!, total)).toBeLessThan(1e-12);
    expect(t.errorSs).toBe(gt.errorSs);
  });

  it('generalized eta squared uses all error strata; partial uses its own', () => {
    const t = byTerm(r, 'time');
    const g = byTerm(r, 'group');
    const errors = g.errorSs! + t.errorSs!;
    expect(t.generalizedEtaSq).toBeCloseTo(t.ss! / (t.ss! + errors), 14);
    expect(t.partialEtaSq).toBeCloseTo(t.ss! / (t.ss! + t.errorSs!), 14);
    expect(t.generalizedEtaSq!).toBeLessThanOrEqual(t.partialEtaSq!);
  });

  it('within terms with more than two levels carry Mauchly and all three corrections', () => {
    for (const term of ['time', 'group:time']) {
      const t = byTerm(r, term);
      expect(t.sphericity!.df).toBe(5);
      expect(t.corrections!.lb.epsilon).toBeCloseTo(1 / 3, 15);
      expect(t.corrections!.gg.df1).toBeCloseTo(t.df1! * t.corrections!.gg.epsilon, 12);
    }
    expect(byTerm(r, 'group').sphericity).toBeUndefined();
  });

  it('descriptives per group × time cell, offset added back; results unchanged by the offset', () => {
    expect(r.descriptives).toHaveLength(12);
    expect(r.descriptives![0].levels).toEqual({ group: 'g1', time: 't1' });
    const cell = rows.filter((x) => x.group === 'g2' && x.time === 't3').map((x) => x.y);
    const d = r.descriptives!.find((c) => c.levels['group'] === 'g2' && c.levels['time'] === 't3')!;
    expect(d.mean).toBeCloseTo(cell.reduce((a, b) => a + b, 0) / cell.length, 12);
    const shifted = analyseRepeated(prepared(rows, ['group'], ['time'], [], 50));
    expect(shifted.descriptives![5].mean).toBeCloseTo(r.descriptives![5].mean, 12);
    expect(byTerm(shifted, 'time').value).toBeCloseTo(byTerm(r, 'time').value, 10);
  });

  it('Type II equals Type III when the groups are balanced', () => {
    const r2 = analyseRepeated(prepared(rows, ['group'], ['time'], [], 0, 2));
    r.tests!.forEach((t, i) => expect(r2.tests![i].ss).toBeCloseTo(t.ss!, 9));
  });

  it('reports residual normality and no Friedman test in a mixed design', () => {
    expect(r.assumptions!.normality!.n).toBe(72);
    expect(r.nonparametric).toBeUndefined();
  });
});

describe('analyseRepeated: subjects, errors and comparisons', () => {
  it('drops subjects with a missing cell, counts them and names them', () => {
    const rows = mixedRows([8], ['a', 'b', 'c'], 9).filter((x) => !(x.id === 'S3' && x.time === 'b') && !(x.id === 'S7' && x.time === 'a'));
    const r = analyseRepeated(prepared(rows, [], ['time']));
    expect(r.excluded).toBe(2);
    expect(r.subjects).toBe(6);
    expect(r.n).toBe(18);
    expect(r.warnings!.join(' ')).toMatch(/2 subject\(s\).*S3, S7/);
    expect(r.nonparametric![0]).toMatchObject({ term: 'time', method: 'friedman', df: 2 });
  });

  it('rejects duplicate subject × cell rows and a subject in two groups, naming subject and rows', () => {
    const rows = mixedRows([4, 4], ['a', 'b'], 2);
    const dup = [...rows, { ...rows[3] }];
    expect(() => analyseRepeated(prepared(dup, ['group'], ['time']))).toThrow(/S2.*more than one row/);
    const moved = rows.map((x, i) => (i === 1 ? { ...x, group: 'g2' } : x));
    expect(() => analyseRepeated(prepared(moved, ['group'], ['time']))).toThrow(/S1.*two between-subjects groups|S1.*appears in/);
  });

  it('rejects an outcome with no variation and a factor with one level', () => {
    const flat = mixedRows([5], ['a', 'b', 'c'], 1).map((x) => ({ ...x, y: 4 }));
    expect(() => analyseRepeated(prepared(flat, [], ['time']))).toThrow(/no variation/);
    const one = mixedRows([5], ['a'], 1);
    expect(() => analyseRepeated(prepared(one, [], ['time']))).toThrow(/only one level/);
  });

  it('between comparisons use subject means and the between-subjects error (tukey equals Student t with two groups)', () => {
    const rows = mixedRows([7, 12], ['t1', 't2', 't3'], 21);
    const r = analyseRepeated(prepared(rows, ['group'], ['time'], [{ factor: 'group', method: 'tukey' }, { factor: 'time', method: 'holm' }]));
    const ids = [...new Set(rows.map((x) => x.id))];
    const meanOf = (id: string) => rows.filter((x) => x.id === id).reduce((a, x) => a + x.y, 0) / 3;
    const g = (name: string) => ids.filter((id) => rows.find((x) => x.id === id)!.group === name).map(meanOf);
    const t = ttest2(g('g1'), g('g2'), { variance: 'equal' });
    const row = r.comparisons!.find((c) => c.factor === 'group')!;
    expect(rel(row.statistic, t.statistic)).toBeLessThan(1e-10);
    expect(Math.abs(row.pAdjusted - t.pValue)).toBeLessThan(1e-6);
    const within = r.comparisons!.filter((c) => c.factor === 'time');
    expect(within.map((c) => `${c.a}-${c.b}`)).toEqual(['t1-t2', 't1-t3', 't2-t3']);
    const pt = ttest(rows.filter((x) => x.time === 't1').map((x) => x.y), rows.filter((x) => x.time === 't3').map((x) => x.y));
    expect(Math.abs(within[1].p! - pt.pValue)).toBeLessThan(1e-12);
  });

  it('warns when Tukey is asked for a within factor and rejects an unknown comparison factor', () => {
    const rows = mixedRows([6], ['a', 'b', 'c'], 4);
    const r = analyseRepeated(prepared(rows, [], ['time'], [{ factor: 'time', method: 'tukey' }]));
    expect(r.warnings!.some((w) => /Bonferroni/.test(w))).toBe(true);
    expect(() => analyseRepeated(prepared(rows, [], ['time'], [{ factor: 'site', method: 'holm' }]))).toThrow(/"site"/);
  });

  it('two within factors and two between factors: every term present in plan order', () => {
    const z = noise(8);
    const rows: Row[] = [];
    let id = 0;
    for (const a of ['a1', 'a2']) for (const b of ['b1', 'b2', 'b3']) for (let s = 0; s < 3 + (a === 'a2' ? 1 : 0); s++) {
      id++;
      for (const w of ['w1', 'w2', 'w3']) for (const v of ['v1', 'v2']) rows.push({ id: `P${id}`, a, b, w, v, y: 10 + z() + (w === 'w3' ? 1 : 0) });
    }
    const r = analyseRepeated(prepared(rows, ['a', 'b'], ['w', 'v']));
    expect(r.tests!.map((t) => t.term)).toEqual([
      'a', 'b', 'a:b', 'w', 'a:w', 'b:w', 'a:b:w', 'v', 'a:v', 'b:v', 'a:b:v', 'w:v', 'a:w:v', 'b:w:v', 'a:b:w:v',
    ]);
    expect(byTerm(r, 'a:b:w:v').df1).toBe(4);
    expect(byTerm(r, 'a:b:w:v').df2).toBe((21 - 6) * 2);
    expect(byTerm(r, 'v').corrections).toBeUndefined();
  });
});
