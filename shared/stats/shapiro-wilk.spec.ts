/**
 * Shapiro–Wilk (Royston 1995, AS R94). For n = 3 the W statistic and its exact
 * p-value have closed forms that can be checked by hand:
 * W = (x₃ − x₁)² / (2·SS) and p = (6/π)(asin √W − π/3).
 * Larger samples are checked against R's shapiro.test in the R reference
 * fixtures (test/reference); here only defining properties.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from './contract';
import { shapiroWilk } from './shapiro-wilk';

describe('shapiroWilk, n = 3 (closed form)', () => {
  it('equally spaced values give W = 1, p = 1', () => {
    const r = shapiroWilk([0, 1, 2]);
    expect(r.W).toBeCloseTo(1, 14);
    expect(r.p).toBeCloseTo(1, 12);
  });

  it('(0, 1, 3): W = 27/28 and p = (6/π)(asin √W − π/3) (hand computation)', () => {
    const r = shapiroWilk([3, 0, 1]);
    expect(r.W).toBeCloseTo(27 / 28, 14);
    expect(r.p).toBeCloseTo((6 / Math.PI) * (Math.asin(Math.sqrt(27 / 28)) - Math.PI / 3), 12);
  });

  it('(0, 0, 1): W = 3/4, the smallest possible, p = 0', () => {
    const r = shapiroWilk([0, 0, 1]);
    expect(r.W).toBeCloseTo(0.75, 14);
    expect(r.p).toBeCloseTo(0, 12);
  });
});

describe('shapiroWilk, properties', () => {
  const sample = Array.from({ length: 40 }, (_, i) => Math.sin(i * 2.7) * 3 + Math.cos(i * 0.9));

  it('is invariant to shift, positive scale and order (defining property)', () => {
    const a = shapiroWilk(sample);
    const b = shapiroWilk(sample.map((v) => 1e6 + 7 * v).reverse());
    expect(b.W).toBeCloseTo(a.W, 9);
    expect(b.p).toBeCloseTo(a.p, 8);
  });

  it('gives W in (0, 1] and p in [0, 1]', () => {
    for (const n of [4, 7, 11, 12, 50, 400]) {
      const { W, p } = shapiroWilk(sample.concat(sample).concat(sample).concat(sample).slice(0, Math.min(n, 160)).concat(Array.from({ length: Math.max(0, n - 160) }, (_, i) => i % 13)));
      expect(W).toBeGreaterThan(0);
      expect(W).toBeLessThanOrEqual(1);
      expect(p).toBeGreaterThanOrEqual(0);
      expect(p).toBeLessThanOrEqual(1);
    }
  });

  it('rejects a strongly skewed sample more strongly than a symmetric one', () => {
    const skewed = Array.from({ length: 60 }, (_, i) => Math.exp(i / 8));
    const symmetric = Array.from({ length: 60 }, (_, i) => i);
    expect(shapiroWilk(skewed).p).toBeLessThan(shapiroWilk(symmetric).p);
    expect(shapiroWilk(skewed).p).toBeLessThan(1e-4);
  });

  it('refuses n < 3, n > 5000 and identical values with an InputError', () => {
    expect(() => shapiroWilk([1, 2])).toThrow(InputError);
    expect(() => shapiroWilk(new Float64Array(5001).map((_, i) => i))).toThrow(/between 3 and 5000/);
    expect(() => shapiroWilk([2, 2, 2, 2])).toThrow(/identical/);
  });
});
