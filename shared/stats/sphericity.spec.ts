/**
 * Sphericity: Mauchly's W with the chi-square approximation and second-order
 * term of Anderson (An Introduction to Multivariate Statistical Analysis,
 * §10.7), and the Greenhouse–Geisser / Huynh–Feldt (Lecoutre form) / lower-bound
 * epsilons. Checked by closed forms and the invariances the definitions imply.
 */
import { describe, expect, it } from 'vitest';
import { chiSquare, fisherF } from './dist/index';
import { congruence, type Matrix } from './matrix';
import { assessSphericity, correctedTests } from './sphericity';

function mat(p: number, values: number[]): Matrix {
  return { rows: p, cols: p, data: Float64Array.from(values) };
}

const E3 = mat(3, [9, 2, -1, 2, 4, 0.5, -1, 0.5, 2]);

describe('assessSphericity', () => {
  it('a spherical error matrix gives W = 1, chi-square 0, p = 1, GG = 1', () => {
    const s = assessSphericity(mat(3, [5, 0, 0, 0, 5, 0, 0, 0, 5]), 20);
    expect(s.mauchly!.W).toBeCloseTo(1, 14);
    expect(Math.abs(s.mauchly!.chiSq)).toBeLessThan(1e-12);
    expect(s.mauchly!.p).toBeCloseTo(1, 12);
    expect(s.mauchly!.df).toBe(5);
    expect(s.epsilons.gg).toBeCloseTo(1, 14);
    // Lecoutre HF at GG = 1: ((ν + 1)p − 2) / (p(ν − p)) = (63 − 2) / (3 · 17), above 1 and reported as computed.
    expect(s.epsilons.hf).toBeCloseTo(61 / 51, 14);
    expect(s.epsilons.lb).toBeCloseTo(1 / 3, 15);
  });

  it('two contrasts: closed form W = 4 det / tr², chi-square on 2 df, no second-order term', () => {
    const e = mat(2, [6, 1.5, 1.5, 2]);
    const nu = 14;
    const s = assessSphericity(e, nu);
    const w = (4 * (6 * 2 - 1.5 * 1.5)) / 64;
    expect(s.mauchly!.W).toBeCloseTo(w, 14);
    const rho = 1 - 12 / (12 * nu);
    const chi = -nu * rho * Math.log(w);
    expect(s.mauchly!.chiSq).toBeCloseTo(chi, 12);
    expect(s.mauchly!.p).toBeCloseTo(Math.exp(-chi / 2), 12);
    expect(s.epsilons.gg).toBeCloseTo(64 / (2 * (6 ** 2 + 2 ** 2 + 2 * 1.5 ** 2)), 14);
  });

  it('is invariant to an orthogonal change of contrast basis', () => {
    const th = 0.7;
    const q = mat(3, [Math.cos(th), -Math.sin(th), 0, Math.sin(th), Math.cos(th), 0, 0, 0, 1]);
    const a = assessSphericity(E3, 25);
    const b = assessSphericity(congruence(E3, q), 25);
    expect(b.mauchly!.W).toBeCloseTo(a.mauchly!.W, 12);
    expect(b.mauchly!.p).toBeCloseTo(a.mauchly!.p, 12);
    expect(b.epsilons.gg).toBeCloseTo(a.epsilons.gg, 12);
    expect(b.epsilons.hf).toBeCloseTo(a.epsilons.hf, 12);
  });

  it('keeps epsilons within their published bounds and the p-value a proper mixture', () => {
    const s = assessSphericity(E3, 25);
    expect(s.epsilons.gg).toBeGreaterThanOrEqual(1 / 3);
    expect(s.epsilons.gg).toBeLessThanOrEqual(1);
    expect(s.epsilons.hf).toBeGreaterThan(s.epsilons.gg);
    const m = s.mauchly!;
    expect(m.W).toBeGreaterThan(0);
    expect(m.W).toBeLessThan(1);
    // With p = 3 the second-order weight is positive, so p lies between the f and f + 4 df tail areas.
    expect(m.p).toBeGreaterThanOrEqual(chiSquare(5).sf(m.chiSq));
    expect(m.p).toBeLessThanOrEqual(chiSquare(9).sf(m.chiSq));
  });

  it('reports no Mauchly test when the error matrix is singular', () => {
    const s = assessSphericity(mat(3, [1, 1, 0, 1, 1, 0, 0, 0, 2]), 30);
    expect(s.mauchly).toBeNull();
    expect(assessSphericity(E3, 2).mauchly).toBeNull();
  });
});

describe('correctedTests', () => {
  it('multiplies both df by epsilon and caps HF at 1 when applying it', () => {
    const c = correctedTests(4.2, 3, 45, { gg: 0.6, hf: 1.08, lb: 1 / 3 });
    expect(c.gg.df1).toBeCloseTo(1.8, 14);
    expect(c.gg.df2).toBeCloseTo(27, 14);
    expect(c.gg.p).toBeCloseTo(fisherF(1.8, 27).sf(4.2), 14);
    expect(c.hf.epsilon).toBe(1.08);
    expect(c.hf.df1).toBe(3);
    expect(c.hf.p).toBeCloseTo(fisherF(3, 45).sf(4.2), 14);
    expect(c.lb.df1).toBeCloseTo(1, 14);
    expect(c.lb.df2).toBeCloseTo(15, 14);
  });
});
