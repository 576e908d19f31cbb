/** APA-style formatting (conventions of the APA Publication Manual, 7th ed.; common practice). */
import { describe, expect, it } from 'vitest';
import { formatCoefficient, formatComparison, formatDf, formatP, formatTest } from './format';

describe('formatP', () => {
  it('three decimals, no leading zero, thresholds', () => {
    expect(formatP(0.01586)).toBe('p = .016');
    expect(formatP(0.0009999)).toBe('p < .001');
    expect(formatP(0.001)).toBe('p = .001');
    expect(formatP(0.04996)).toBe('p = .050');
    expect(formatP(0.9996)).toBe('p > .999');
    expect(formatP(NaN)).toBe('p = n/a');
  });
});

describe('formatDf', () => {
  it('integers plain, fractions to at most 2 decimals', () => {
    expect(formatDf(27)).toBe('27');
    expect(formatDf(31.4172)).toBe('31.42');
    expect(formatDf(31.4)).toBe('31.4');
    expect(formatDf(30.999)).toBe('31');
  });
});

describe('formatTest', () => {
  it('F with partial eta squared', () => {
    expect(formatTest({ term: 'a', statistic: 'F', value: 4.8512, df1: 2, df2: 27, p: 0.01586, partialEtaSq: 0.2643 })).toBe('F(2, 27) = 4.85, p = .016, ηp² = .26');
  });
  it('ASCII option for fonts without Greek letters', () => {
    expect(formatTest({ term: 'a', statistic: 'F', value: 4.85, df1: 2, df2: 27, p: 0.0002, partialEtaSq: 0.26 }, { ascii: true })).toBe('F(2, 27) = 4.85, p < .001, partial eta^2 = .26');
  });
  it('Welch t with fractional df and d', () => {
    expect(formatTest({ term: 'g', statistic: 't', variant: 'welch', value: -2.1, df: 26.314, p: 0.0453, cohensD: -0.7712 })).toBe('t(26.31) = -2.10, p = .045, d = -0.77');
  });
  it('paired t reports d_z; z has no df', () => {
    expect(formatTest({ term: 't', statistic: 't', variant: 'paired', value: 3.05, df: 11, p: 0.011, dz: 0.88, cohensD: 0.5 })).toBe('t(11) = 3.05, p = .011, dz = 0.88');
    expect(formatTest({ term: 'mean', statistic: 'z', value: 1.96, p: 0.04999 })).toBe('z = 1.96, p = .050');
  });
  it('never prints "-0.00"', () => {
    expect(formatTest({ term: 'm', statistic: 't', value: -0.001, df: 9, p: 0.9999 })).toBe('t(9) = 0.00, p > .999');
  });
});

describe('formatComparison and formatCoefficient', () => {
  it('comparison with CI and adjusted p', () => {
    expect(
      formatComparison({ factor: 'f', method: 'holm', a: 'Evening', b: 'Morning', estimate: 1.234, se: 0.4, statistic: 3.085, df: 27, p: 0.004, pAdjusted: 0.012, ciLower: 0.41, ciUpper: 2.06 }),
    ).toBe('Evening vs Morning: difference = 1.23, 95% CI [0.41, 2.06], t(27) = 3.08, adjusted p = .012 (Holm)');
  });
  it('coefficient with level option', () => {
    expect(formatCoefficient({ term: 'hours', estimate: 1.2345, se: 0.452, value: 2.731, df: 27, p: 0.0109, ciLower: 0.31, ciUpper: 2.16 }, { level: 0.9 })).toBe(
      'b = 1.23, SE = 0.45, t(27) = 2.73, p = .011, 90% CI [0.31, 2.16]',
    );
  });
});
