import { describe, it, expect } from 'vitest';
import { autoFindings } from './checklist-findings';
import type { RerunResult } from '../stats/contract';

// Threshold logic only: the statistics themselves are checked against references elsewhere.
// The result objects below are invented shapes, not outputs of any reference program.
function base(partial: Partial<RerunResult>): RerunResult {
  return { engine: 'test', design: 'anova', n: 30, excluded: 0, alpha: 0.05, descriptives: [], tests: [], warnings: [], ...partial };
}
const byCriterion = (r: RerunResult, ctx = {}) => Object.fromEntries(autoFindings(r, ctx).map((f) => [f.criterion, f]));

describe('autoFindings', () => {
  it('returns one finding per criterion in checklist order', () => {
    expect(autoFindings(base({})).map((f) => f.criterion)).toEqual([
      'independence', 'variance-homogeneity', 'sphericity', 'multiplicity-control', 'residual-normality', 'outliers', 'effect-size-precision', 'sample-size-power', 'reported-agreement',
    ]);
  });

  it('suggests a variance concern when Brown–Forsythe rejects or the ratio exceeds the limit', () => {
    const ok = base({ assumptions: { levene: { center: 'mean', value: 1, df1: 2, df2: 27, p: 0.4 }, brownForsythe: { center: 'median', value: 0.9, df1: 2, df2: 27, p: 0.42 }, varianceRatio: 1.8 } });
    expect(byCriterion(ok)['variance-homogeneity'].suggested).toBe('met');
    const ratio = base({ assumptions: { brownForsythe: { center: 'median', value: 0.9, df1: 2, df2: 27, p: 0.42 }, varianceRatio: 5.2 } });
    expect(byCriterion(ratio)['variance-homogeneity'].suggested).toBe('concern');
    expect(byCriterion(ratio)['variance-homogeneity'].basis.join(' ')).toContain('common practice');
    const bf = base({ assumptions: { brownForsythe: { center: 'median', value: 6, df1: 2, df2: 27, p: 0.007 } } });
    expect(byCriterion(bf)['variance-homogeneity'].suggested).toBe('concern');
    expect(byCriterion(base({}))['variance-homogeneity'].suggested).toBe('not-applicable');
  });

  it('names the correction to apply when sphericity is rejected', () => {
    const corr = { gg: { epsilon: 0.62, df1: 1.86, df2: 50.2, p: 0.01 }, hf: { epsilon: 0.66, df1: 1.98, df2: 53.5, p: 0.009 }, lb: { epsilon: 0.33, df1: 1, df2: 27, p: 0.03 } };
    const r = base({ tests: [{ term: 'wave', statistic: 'F', value: 5, df1: 3, df2: 81, p: 0.003, sphericity: { W: 0.5, chiSq: 17.4, df: 5, p: 0.004 }, corrections: corr }] });
    const f = byCriterion(r)['sphericity'];
    expect(f.suggested).toBe('concern');
    expect(f.evidence.map((e) => e.value).join(' ')).toContain('apply Greenhouse–Geisser');
  });

  it('fails multiplicity control when several comparisons carry no stated correction', () => {
    const comp = { factor: 'format', method: 'holm' as const, a: 'x', b: 'y', estimate: 1, se: 0.5, statistic: 2, df: 27, p: 0.04, pAdjusted: 0.12, ciLower: 0, ciUpper: 2 };
    const r = base({ comparisons: [comp, { ...comp, b: 'z' }, { ...comp, a: 'y', b: 'z' }] });
    expect(byCriterion(r, { submitterCorrection: 'none' })['multiplicity-control'].suggested).toBe('not-met');
    expect(byCriterion(r, { submitterCorrection: 'holm' })['multiplicity-control'].suggested).toBe('met');
    expect(byCriterion(r, { submitterCorrection: 'bonferroni' })['multiplicity-control'].suggested).toBe('concern');
  });

  it('carries reconciliation verdicts into the agreement criterion', () => {
    const row = { text: 'F(2, 27) = 4.85, p = .016', verdict: 'consistent' as const, explanation: 'matches' };
    expect(byCriterion(base({ reconciliation: [row] }))['reported-agreement'].suggested).toBe('met');
    expect(byCriterion(base({ reconciliation: [row, { ...row, verdict: 'decision-changing' }] }))['reported-agreement'].suggested).toBe('not-met');
  });

  it('flags independence from data flags and outliers beyond ±3', () => {
    const r = base({ outliers: [{ row: 12, value: 3.4 }] });
    expect(byCriterion(r, { independenceFlags: ['subject S0012 appears in two groups'] })['independence'].suggested).toBe('concern');
    expect(byCriterion(r)['outliers'].suggested).toBe('concern');
    expect(byCriterion(base({ outliers: [] }))['outliers'].suggested).toBe('met');
  });
});
