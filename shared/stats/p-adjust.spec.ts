/**
 * adjustP checked against @stdlib/stats/padjust (an independent implementation
 * of the same published procedures) and against the defining invariants.
 */
import { describe, expect, it } from 'vitest';
import padjust from '@stdlib/stats/padjust';
import { adjustP, type PAdjustMethod } from './p-adjust';

/** Deterministic pseudo-random p-values (LCG), with deliberate ties and extremes. */
function pFamily(seed: number, m: number): number[] {
  let s = seed >>> 0;
  const out: number[] = [];
  for (let i = 0; i < m; i++) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    const u = s / 2 ** 32;
    out.push(i % 7 === 3 && i > 0 ? out[i - 1] : u ** 3);
  }
  out.push(1, 1e-12);
  return out;
}

const METHODS: PAdjustMethod[] = ['bonferroni', 'holm', 'bh'];

describe('adjustP', () => {
  for (const method of METHODS) {
    it(`matches @stdlib/stats/padjust for ${method} (source: @stdlib/stats/padjust)`, () => {
      for (const [seed, m] of [[1, 1], [2, 3], [3, 10], [4, 57], [5, 200]] as const) {
        const p = pFamily(seed, m);
        const ours = adjustP(p, method);
        const theirs = padjust(p, method) as number[];
        ours.forEach((v, i) => expect(v, `${method} seed ${seed} index ${i}: p ${p[i]}`).toBeCloseTo(theirs[i], 14));
      }
    });

    it(`keeps the order of the raw p-values and never lowers them (${method}, defining property)`, () => {
      const p = pFamily(9, 40);
      const adj = adjustP(p, method);
      for (let i = 0; i < p.length; i++) {
        expect(adj[i]).toBeGreaterThanOrEqual(p[i]);
        expect(adj[i]).toBeLessThanOrEqual(1);
        for (let j = 0; j < p.length; j++) if (p[i] < p[j]) expect(adj[i]).toBeLessThanOrEqual(adj[j]);
      }
    });
  }

  it('orders the procedures as their definitions imply: BH ≤ Holm ≤ Bonferroni', () => {
    const p = pFamily(11, 25);
    const bh = adjustP(p, 'bh');
    const holm = adjustP(p, 'holm');
    const bonf = adjustP(p, 'bonferroni');
    p.forEach((_, i) => {
      expect(bh[i]).toBeLessThanOrEqual(holm[i] + 1e-15);
      expect(holm[i]).toBeLessThanOrEqual(bonf[i] + 1e-15);
    });
  });

  it('works the textbook arithmetic on a small family (worked by hand)', () => {
    // p = .01, .04, .03 (m = 3). Holm: .03, .06 (max of .06,.06), .06. BH: .03, .04, .04.
    expect(adjustP([0.01, 0.04, 0.03], 'holm').map((v) => +v.toFixed(12))).toEqual([0.03, 0.06, 0.06]);
    expect(adjustP([0.01, 0.04, 0.03], 'bh').map((v) => +v.toFixed(12))).toEqual([0.03, 0.04, 0.04]);
    expect(adjustP([0.01, 0.04, 0.5], 'bonferroni').map((v) => +v.toFixed(12))).toEqual([0.03, 0.12, 1]);
  });

  it('leaves NaN entries out of the family size', () => {
    const adj = adjustP([0.01, Number.NaN, 0.02], 'bonferroni');
    expect(adj[0]).toBeCloseTo(0.02, 15);
    expect(adj[1]).toBeNaN();
    expect(adj[2]).toBeCloseTo(0.04, 15);
  });

  it('rejects values outside [0, 1] and unknown methods', () => {
    expect(() => adjustP([0.2, 1.5], 'holm')).toThrow(/position 1/);
    expect(() => adjustP([0.2], 'sidak' as PAdjustMethod)).toThrow(/unknown/);
    expect(adjustP([], 'bh')).toEqual([]);
  });
});
