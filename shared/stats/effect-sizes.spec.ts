/**
 * Standardised effect sizes. The noncentral-t interval is checked through its
 * defining equations (the observed t sits at the alpha/2 and 1 − alpha/2
 * quantiles of the bounding distributions), the Hedges correction against
 * hand-evaluated gamma functions.
 */
import { describe, expect, it } from 'vitest';
import { noncentralTCdf } from './dist';
import { hedgesCorrection, independentD, ncpInterval, oneSampleD } from './effect-sizes';

describe('hedgesCorrection', () => {
  it('J(10) = Γ(5) / (√5 Γ(4.5)) = 24 / (√5 · 11.631728396567…) (hand evaluation)', () => {
    // Γ(4.5) = 3.5 · 2.5 · 1.5 · 0.5 · √π.
    const gamma45 = 3.5 * 2.5 * 1.5 * 0.5 * Math.sqrt(Math.PI);
    expect(hedgesCorrection(10)).toBeCloseTo(24 / (Math.sqrt(5) * gamma45), 13);
  });

  it('approaches 1 − 3/(4·df − 1) for large df (common practice approximation; its error is about 1/(32·df²))', () => {
    const approx = 1 - 3 / (4 * 2000 - 1);
    expect(Math.abs(hedgesCorrection(2000) - approx)).toBeLessThan(1.2 / (32 * 2000 * 2000));
  });
});

describe('ncpInterval', () => {
  it('puts t at the 1 − alpha/2 and alpha/2 quantiles of the bounding noncentral t (defining equations)', () => {
    for (const [t, df] of [[2.3, 12], [-0.7, 40], [6.1, 5]] as const) {
      const [lo, hi] = ncpInterval(t, df, 0.05);
      expect(noncentralTCdf(t, df, lo)).toBeCloseTo(0.975, 9);
      expect(noncentralTCdf(t, df, hi)).toBeCloseTo(0.025, 9);
      expect(lo).toBeLessThan(t);
      expect(hi).toBeGreaterThan(t);
    }
  });

  it('is symmetric about 0 when t = 0', () => {
    const [lo, hi] = ncpInterval(0, 20, 0.05);
    expect(lo).toBeCloseTo(-hi, 9);
  });

  it('tends to t ± 1.959964 for very large df (normal limit)', () => {
    const [lo, hi] = ncpInterval(1, 1e6, 0.05);
    expect(lo).toBeCloseTo(1 - 1.959964, 3);
    expect(hi).toBeCloseTo(1 + 1.959964, 3);
  });
});

describe('independentD and oneSampleD', () => {
  it('d = difference / pooled SD, g = J(df)·d, intervals scaled alike', () => {
    const { d, g } = independentD(1.5, 3, 10, 14, 0.05);
    expect(d.value).toBe(0.5);
    const j = hedgesCorrection(22);
    expect(g.value).toBeCloseTo(0.5 * j, 15);
    expect(g.ci[0]).toBeCloseTo(d.ci[0] * j, 15);
    expect(d.ci[0]).toBeLessThan(0.5);
    expect(d.ci[1]).toBeGreaterThan(0.5);
  });

  it('one-sample d interval is the t interval for the noncentrality divided by √n', () => {
    const r = oneSampleD(2, 4, 25, 0.1);
    const [lo, hi] = ncpInterval(0.5 * 5, 24, 0.1);
    expect(r.value).toBe(0.5);
    expect(r.ci[0]).toBeCloseTo(lo / 5, 14);
    expect(r.ci[1]).toBeCloseTo(hi / 5, 14);
  });
});
