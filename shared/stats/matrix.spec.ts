/**
 * Matrix helpers checked against constructions with known answers
 * (spectral decomposition built from known eigenvalues; closed-form weighted means).
 */
import { describe, expect, it } from 'vitest';
import { congruence, kron, orthonormalContrasts, symmetricEigenvalues, unitAverage, weightedRss, type Matrix } from './matrix';

function mat(rows: number, cols: number, values: number[]): Matrix {
  return { rows, cols, data: Float64Array.from(values) };
}

/** Full orthogonal k × k basis: unit average vector followed by the Helmert contrasts. */
function orthogonalBasis(k: number): Matrix {
  const c = orthonormalContrasts(k);
  const out = mat(k, k, new Array(k * k).fill(0));
  for (let i = 0; i < k; i++) {
    out.data[i * k] = 1 / Math.sqrt(k);
    for (let j = 1; j < k; j++) out.data[i * k + j] = c.data[i * (k - 1) + j - 1];
  }
  return out;
}

describe('orthonormalContrasts', () => {
  it('has orthonormal columns orthogonal to the unit vector', () => {
    for (const k of [2, 3, 5, 8]) {
      const c = orthonormalContrasts(k);
      const gram = congruence(mat(k, k, Array.from({ length: k * k }, (_, i) => (i % (k + 1) === 0 ? 1 : 0))), c);
      for (let a = 0; a < k - 1; a++) {
        for (let b = 0; b < k - 1; b++) expect(gram.data[a * (k - 1) + b]).toBeCloseTo(a === b ? 1 : 0, 14);
        let colSum = 0;
        for (let i = 0; i < k; i++) colSum += c.data[i * (k - 1) + a];
        expect(colSum).toBeCloseTo(0, 14);
      }
    }
  });

  it('kron of unit averages is the unit average of the product size', () => {
    const u = kron(unitAverage(3), unitAverage(4));
    expect(u.rows).toBe(12);
    u.data.forEach((v) => expect(v).toBeCloseTo(1 / Math.sqrt(12), 15));
  });
});

describe('symmetricEigenvalues', () => {
  it('recovers the eigenvalues of Q diag(λ) Qᵀ (known spectrum)', () => {
    const lambda = [0.001, 0.5, 2, 7.25, 40];
    const k = lambda.length;
    const q = orthogonalBasis(k);
    // S = Q Λ Qᵀ = congruence(Λ, Qᵀ).
    const qt = mat(k, k, Array.from({ length: k * k }, (_, i) => q.data[(i % k) * k + Math.floor(i / k)]));
    const diag = mat(k, k, Array.from({ length: k * k }, (_, i) => (i % (k + 1) === 0 ? lambda[i / (k + 1)] : 0)));
    const s = congruence(diag, qt);
    const eig = symmetricEigenvalues(s);
    lambda.forEach((l, i) => expect(Math.abs(eig[i] - l)).toBeLessThan(1e-12 * 40));
  });

  it('handles a diagonal and a 1 × 1 matrix', () => {
    expect(Array.from(symmetricEigenvalues(mat(2, 2, [3, 0, 0, 1])))).toEqual([1, 3]);
    expect(Array.from(symmetricEigenvalues(mat(1, 1, [4])))).toEqual([4]);
  });
});

describe('weightedRss', () => {
  const y = mat(4, 2, [1, 2, 3, 5, 4, 4, 10, 1]);
  const w = Float64Array.from([1, 2, 3, 4]);

  it('intercept only: Σ w (y − weighted mean)² per column (closed form)', () => {
    const x = mat(4, 1, [1, 1, 1, 1]);
    let expected = 0;
    for (let j = 0; j < 2; j++) {
      let sw = 0;
      let swy = 0;
      for (let i = 0; i < 4; i++) {
        sw += w[i];
        swy += w[i] * y.data[i * 2 + j];
      }
      for (let i = 0; i < 4; i++) expected += w[i] * (y.data[i * 2 + j] - swy / sw) ** 2;
    }
    expect(weightedRss(x, y, w)).toBeCloseTo(expected, 12);
  });

  it('a saturated design fits exactly, a repeated column adds nothing, no columns gives Σ w y²', () => {
    const full = mat(4, 4, [1, 1, 0, 0, 1, -1, 1, 0, 1, 0, -1, 1, 1, 0, 0, -1]);
    expect(weightedRss(full, y, w)).toBeLessThan(1e-24);
    const dup = mat(4, 2, [1, 1, 1, 1, 1, 1, 1, 1]);
    expect(weightedRss(dup, y, w)).toBeCloseTo(weightedRss(mat(4, 1, [1, 1, 1, 1]), y, w), 12);
    let sumSq = 0;
    for (let i = 0; i < 4; i++) for (let j = 0; j < 2; j++) sumSq += w[i] * y.data[i * 2 + j] ** 2;
    expect(weightedRss(mat(4, 0, []), y, w)).toBeCloseTo(sumSq, 12);
  });
});
