/**
 * Sphericity of a within-subjects term: Mauchly's test and the
 * Greenhouse–Geisser, Huynh–Feldt and lower-bound epsilons, computed from the
 * error SSCP matrix of the term's orthonormal contrast scores.
 */
import type { SphericityCorrection, TestRow } from './contract';
import { chiSquare, fisherF } from './dist/index';
import { symmetricEigenvalues, type Matrix } from './matrix';

/** Mauchly's test result as reported on a test row. */
export type MauchlyResult = NonNullable<TestRow['sphericity']>;

/** Epsilons of one within term (HF as computed, possibly above 1). */
export interface Epsilons {
  gg: number;
  hf: number;
  lb: number;
}

/** Everything the engine reports about sphericity for one within term. */
export interface SphericityAssessment {
  /** Null when the error SSCP is singular (fewer error df than contrasts, or a constant contrast). */
  mauchly: MauchlyResult | null;
  epsilons: Epsilons;
}

/**
 * Assess sphericity from the error SSCP `e` (p × p, p ≥ 2) of a term's
 * orthonormal contrasts with `errorDf` = N − g (subjects minus between cells).
 *
 * Mauchly (1940) W = det(E) / (tr(E)/p)^p with Anderson's (1958, §10.7)
 * chi-square approximation and its second-order term, so p matches the
 * usual asymptotic expansion. The second-order weight uses the number of
 * contrasts p in every place: under the null the distribution of W depends only
 * on p and ν, never on how many raw within cells the contrasts came from.
 * Greenhouse–Geisser ε = (Σλ)² / (p Σλ²) over the
 * eigenvalues λ of E. Huynh–Feldt ε with Lecoutre's (1991) correction:
 * ((ν + 1) p ε_GG − 2) / (p (ν − p ε_GG)) with ν = N − g. Lower bound 1/p.
 */
export function assessSphericity(e: Matrix, errorDf: number): SphericityAssessment {
  const p = e.rows;
  if (p < 2) throw new RangeError('sphericity needs at least two contrasts');
  const lambda = symmetricEigenvalues(e);
  let sum = 0;
  let sumSq = 0;
  let max = 0;
  for (const l of lambda) {
    const lp = Math.max(l, 0);
    sum += lp;
    sumSq += lp * lp;
    max = Math.max(max, lp);
  }
  const gg = (sum * sum) / (p * sumSq);
  const nu = errorDf;
  const hf = ((nu + 1) * p * gg - 2) / (p * (nu - p * gg));
  const epsilons: Epsilons = { gg, hf, lb: 1 / p };
  const singular = nu < p || lambda[0] <= 1e-12 * max;
  if (singular) return { mauchly: null, epsilons };
  let logDet = 0;
  for (const l of lambda) logDet += Math.log(l);
  const logW = logDet - p * Math.log(sum / p);
  const rho = 1 - (2 * p * p + p + 2) / (6 * p * nu);
  const w2 = ((p + 2) * (p - 1) * (p - 2) * (2 * p ** 3 + 6 * p * p + 3 * p + 2)) / (288 * (nu * p * rho) ** 2);
  const chiSq = -nu * rho * logW;
  const df = (p * (p + 1)) / 2 - 1;
  const pr1 = chiSquare(df).sf(chiSq);
  const pr2 = chiSquare(df + 4).sf(chiSq);
  const pValue = Math.min(1, Math.max(0, pr1 + w2 * (pr2 - pr1)));
  return { mauchly: { W: Math.exp(logW), chiSq, df, p: pValue }, epsilons };
}

/** Corrected df and p for an F test under each epsilon (HF capped at 1 when applied). */
export function correctedTests(
  f: number,
  df1: number,
  df2: number,
  eps: Epsilons,
): { gg: SphericityCorrection; hf: SphericityCorrection; lb: SphericityCorrection } {
  const apply = (epsilon: number, applied: number): SphericityCorrection => ({
    epsilon,
    df1: df1 * applied,
    df2: df2 * applied,
    p: fisherF(df1 * applied, df2 * applied).sf(f),
  });
  return {
    gg: apply(eps.gg, eps.gg),
    hf: apply(eps.hf, Math.min(1, eps.hf)),
    lb: apply(eps.lb, eps.lb),
  };
}
