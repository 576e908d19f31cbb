/**
 * Small dense matrix helpers for the repeated-measures engine: row-major
 * Float64Array storage, sizes up to a few dozen. Not a general linear-algebra
 * library — just what the split-plot decomposition needs.
 */

/** A dense row-major matrix. */
export interface Matrix {
  rows: number;
  cols: number;
  data: Float64Array;
}

/** A zero-filled rows × cols matrix. */
export function zeros(rows: number, cols: number): Matrix {
  return { rows, cols, data: new Float64Array(rows * cols) };
}

/** Kronecker product a ⊗ b. */
export function kron(a: Matrix, b: Matrix): Matrix {
  const out = zeros(a.rows * b.rows, a.cols * b.cols);
  for (let i = 0; i < a.rows; i++)
    for (let j = 0; j < a.cols; j++) {
      const s = a.data[i * a.cols + j];
      if (s === 0) continue;
      for (let k = 0; k < b.rows; k++)
        for (let l = 0; l < b.cols; l++)
          out.data[(i * b.rows + k) * out.cols + j * b.cols + l] = s * b.data[k * b.cols + l];
    }
  return out;
}

/**
 * Orthonormal basis (k × (k − 1)) of the contrasts among k levels: normalised
 * Helmert columns. Any orthonormal basis gives the same F tests, Mauchly W and
 * epsilons, which are invariant to rotation of the contrast space.
 */
export function orthonormalContrasts(k: number): Matrix {
  const out = zeros(k, k - 1);
  for (let j = 1; j < k; j++) {
    const norm = Math.sqrt(j * (j + 1));
    for (let i = 0; i < j; i++) out.data[i * (k - 1) + j - 1] = 1 / norm;
    out.data[j * (k - 1) + j - 1] = -j / norm;
  }
  return out;
}

/** The unit-length averaging vector (k × 1) with entries 1/√k. */
export function unitAverage(k: number): Matrix {
  return { rows: k, cols: 1, data: new Float64Array(k).fill(1 / Math.sqrt(k)) };
}

/** C' S C for a symmetric S (n × n) and C (n × p). */
export function congruence(s: Matrix, c: Matrix): Matrix {
  const n = s.rows;
  const p = c.cols;
  const sc = zeros(n, p);
  for (let i = 0; i < n; i++)
    for (let k = 0; k < n; k++) {
      const v = s.data[i * n + k];
      if (v === 0) continue;
      for (let j = 0; j < p; j++) sc.data[i * p + j] += v * c.data[k * p + j];
    }
  const out = zeros(p, p);
  for (let i = 0; i < n; i++)
    for (let a = 0; a < p; a++) {
      const cia = c.data[i * p + a];
      if (cia === 0) continue;
      for (let b = 0; b < p; b++) out.data[a * p + b] += cia * sc.data[i * p + b];
    }
  return out;
}

/**
 * Eigenvalues of a symmetric matrix by the cyclic Jacobi method
 * (Golub & Van Loan, Matrix Computations, §8.5): slow for large n but
 * accurate to working precision, and the matrices here are at most a few dozen wide.
 */
export function symmetricEigenvalues(s: Matrix): Float64Array {
  const n = s.rows;
  const a = Float64Array.from(s.data);
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    let diag = 0;
    for (let i = 0; i < n; i++) {
      diag += a[i * n + i] * a[i * n + i];
      for (let j = i + 1; j < n; j++) off += a[i * n + j] * a[i * n + j];
    }
    if (off <= 1e-32 * diag || off === 0) break;
    for (let p = 0; p < n - 1; p++)
      for (let q = p + 1; q < n; q++) {
        const apq = a[p * n + q];
        if (apq === 0) continue;
        const theta = (a[q * n + q] - a[p * n + p]) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const sn = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k * n + p];
          const akq = a[k * n + q];
          a[k * n + p] = c * akp - sn * akq;
          a[k * n + q] = sn * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p * n + k];
          const aqk = a[q * n + k];
          a[p * n + k] = c * apk - sn * aqk;
          a[q * n + k] = sn * apk + c * aqk;
        }
      }
  }
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = a[i * n + i];
  return out.sort();
}

/**
 * Residual sum of squares, summed over the columns of Y, of the weighted
 * least-squares fit of Y (g × p) on X (g × q) with row weights w, via
 * Householder QR of √w·X (numerically stable; no normal equations).
 */
export function weightedRss(x: Matrix, y: Matrix, w: Float64Array): number {
  const g = x.rows;
  const q = x.cols;
  const p = y.cols;
  const a = new Float64Array(g * q);
  const b = new Float64Array(g * p);
  for (let i = 0; i < g; i++) {
    const sw = Math.sqrt(w[i]);
    for (let j = 0; j < q; j++) a[i * q + j] = sw * x.data[i * q + j];
    for (let j = 0; j < p; j++) b[i * p + j] = sw * y.data[i * p + j];
  }
  let rank = 0;
  const v = new Float64Array(g);
  let scale = 0;
  for (let i = 0; i < g * q; i++) scale = Math.max(scale, Math.abs(a[i]));
  for (let col = 0; col < q && rank < g; col++) {
    let norm = 0;
    for (let i = rank; i < g; i++) norm += a[i * q + col] * a[i * q + col];
    norm = Math.sqrt(norm);
    // A column already in the span of earlier ones adds nothing to the fit.
    if (norm <= 1e-12 * scale * Math.sqrt(g)) continue;
    const alpha = a[rank * q + col] > 0 ? -norm : norm;
    for (let i = 0; i < g; i++) v[i] = i < rank ? 0 : a[i * q + col];
    v[rank] -= alpha;
    let vv = 0;
    for (let i = rank; i < g; i++) vv += v[i] * v[i];
    if (vv === 0) continue;
    for (let j = col; j < q; j++) {
      let dot = 0;
      for (let i = rank; i < g; i++) dot += v[i] * a[i * q + j];
      const f = (2 * dot) / vv;
      for (let i = rank; i < g; i++) a[i * q + j] -= f * v[i];
    }
    for (let j = 0; j < p; j++) {
      let dot = 0;
      for (let i = rank; i < g; i++) dot += v[i] * b[i * p + j];
      const f = (2 * dot) / vv;
      for (let i = rank; i < g; i++) b[i * p + j] -= f * v[i];
    }
    rank++;
  }
  let rss = 0;
  for (let i = rank; i < g; i++) for (let j = 0; j < p; j++) rss += b[i * p + j] * b[i * p + j];
  return rss;
}
