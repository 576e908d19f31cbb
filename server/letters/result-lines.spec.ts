import { describe, expect, it } from 'vitest';
import type { RerunResult, TestRow } from '../../shared/stats/contract';
import { chosenCorrection, letterResults, testString } from './result-lines';

const within = (ggEps: number, mauchlyP: number): TestRow => ({
  term: 'wave', statistic: 'F', value: 6.4, df1: 3, df2: 87, p: 0.0006, partialEtaSq: 0.181, generalizedEtaSq: 0.05,
  sphericity: { W: 0.61, chiSq: 13.9, df: 5, p: mauchlyP },
  corrections: {
    gg: { epsilon: ggEps, df1: 3 * ggEps, df2: 87 * ggEps, p: 0.0021 },
    hf: { epsilon: Math.min(1, ggEps + 0.06), df1: 3 * Math.min(1, ggEps + 0.06), df2: 87 * Math.min(1, ggEps + 0.06), p: 0.0017 },
    lb: { epsilon: 1 / 3, df1: 1, df2: 29, p: 0.017 },
  },
});

describe('letter result lines', () => {
  it('reports corrected df only when Mauchly rejects sphericity (common practice: GG below ε = .75, HF above)', () => {
    expect(chosenCorrection(within(0.62, 0.2), 0.05)).toBeNull();
    expect(testString(within(0.62, 0.2), 0.05)).toBe('F(3, 87) = 6.40, p < .001, ηp² = .18, ηG² = .05');
    expect(chosenCorrection(within(0.62, 0.01), 0.05)?.name).toBe('Greenhouse–Geisser');
    expect(testString(within(0.62, 0.01), 0.05)).toBe('F(1.86, 53.94) = 6.40, p = .002, ηp² = .18, ηG² = .05, Greenhouse–Geisser ε = .62');
    expect(chosenCorrection(within(0.8, 0.01), 0.05)?.name).toBe('Huynh–Feldt');
    expect(testString(within(0.8, 0.01), 0.05)).toContain('Huynh–Feldt ε = .86');
  });

  it('gives t tests their interval, effect size interval and the direction of the difference', () => {
    const r: RerunResult = {
      engine: 'x', design: 'independent', n: 40, excluded: 0, alpha: 0.1, warnings: [],
      descriptives: [
        { levels: { format: 'online' }, n: 20, mean: 5, sd: 1, se: 0.2, ciLower: 4.6, ciUpper: 5.4 },
        { levels: { format: 'campus' }, n: 20, mean: 4, sd: 1, se: 0.2, ciLower: 3.6, ciUpper: 4.4 },
      ],
      tests: [{ term: 'format', statistic: 't', variant: 'welch', value: 3.16, df: 37.62, p: 0.0031, estimate: 1, ciLower: 0.47, ciUpper: 1.53, cohensD: 1, cohensDCi: [0.45, 1.54] }],
      comparisons: [
        { factor: 'format', method: 'holm', a: 'online', b: 'campus', estimate: 1, se: 0.32, statistic: 3.16, df: 37.62, p: 0.0031, pAdjusted: 0.0031, ciLower: 0.47, ciUpper: 1.53 },
      ],
    };
    const lines = letterResults(r);
    expect(lines.ciLabel).toBe('90% CI');
    expect(lines.mainTests[0]).toEqual({
      label: "format — Welch's t test",
      text: 't(37.62) = 3.16, p = .003, M diff (online − campus) = 1.00, 90% CI [0.47, 1.53], d = 1.00, 90% CI [0.45, 1.54]',
    });
    expect(lines.corrections).toEqual([
      "Welch's t test also reported for format: it does not assume equal variances.",
      'Pairwise comparisons of format: Holm adjustment over a family of 1.',
    ]);
    expect(lines.comparisons[0]).toMatchObject({ pair: 'online − campus', statistic: 't(37.62) = 3.16', pAdjusted: 'p adj = .003' });
  });
});
