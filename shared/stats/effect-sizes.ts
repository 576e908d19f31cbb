/**
 * Standardised mean differences with confidence intervals.
 *
 * Intervals come from inverting the noncentral t distribution: the observed t
 * is a draw from a noncentral t with df and noncentrality δ = d / scale
 * (scale = √(1/n₁ + 1/n₂) for two groups, 1/√n for one sample or paired
 * differences). The 1 − alpha interval for δ holds the values whose
 * distribution puts t at its alpha/2 and 1 − alpha/2 quantiles; d's interval is
 * that interval times the scale. Hedges' g multiplies d and its bounds by the
 * exact small-sample correction J(df) = Γ(df/2) / (√(df/2) Γ((df−1)/2)).
 */
import { lgamma, noncentralTCdf } from './dist';
import { solveIncreasing } from './dist/root';

/** A standardised effect with its interval. */
export interface EffectWithCi {
  value: number;
  ci: [number, number];
}

/** Cohen's d and Hedges' g for two independent groups (pooled SD), with noncentral-t intervals. */
export function independentD(meanDiff: number, pooledSd: number, n1: number, n2: number, alpha: number): { d: EffectWithCi; g: EffectWithCi } {
  const scale = Math.sqrt(1 / n1 + 1 / n2);
  const df = n1 + n2 - 2;
  const d = meanDiff / pooledSd;
  const ci = ncpInterval(d / scale, df, alpha).map((x) => x * scale) as [number, number];
  const j = hedgesCorrection(df);
  return { d: { value: d, ci }, g: { value: d * j, ci: [ci[0] * j, ci[1] * j] } };
}

/** Cohen's d for one sample (or d_z for paired differences): mean / SD, with a noncentral-t interval. */
export function oneSampleD(meanDiff: number, sd: number, n: number, alpha: number): EffectWithCi {
  const scale = 1 / Math.sqrt(n);
  const d = meanDiff / sd;
  const ci = ncpInterval(d / scale, n - 1, alpha).map((x) => x * scale) as [number, number];
  return { value: d, ci };
}

/** Hedges' exact small-sample correction factor J(df). */
export function hedgesCorrection(df: number): number {
  return Math.exp(lgamma(df / 2) - lgamma((df - 1) / 2)) / Math.sqrt(df / 2);
}

/**
 * Confidence interval for the noncentrality of a t statistic: [δL, δU] with
 * P(T ≤ t | δL) = 1 − alpha/2 and P(T ≤ t | δU) = alpha/2.
 */
export function ncpInterval(t: number, df: number, alpha: number): [number, number] {
  if (!Number.isFinite(t)) return [t, t];
  return [solveNcp(t, df, 1 - alpha / 2), solveNcp(t, df, alpha / 2)];
}

/** δ such that P(T ≤ t | df, δ) = target (the cdf decreases in δ). */
function solveNcp(t: number, df: number, target: number): number {
  const f = (ncp: number) => target - noncentralTCdf(t, df, ncp);
  let step = 1 + Math.abs(t) * 0.5;
  let lo = t - step;
  while (f(lo) > 0) {
    step *= 2;
    lo = t - step;
  }
  step = 1 + Math.abs(t) * 0.5;
  let hi = t + step;
  while (f(hi) < 0) {
    step *= 2;
    hi = t + step;
  }
  return solveIncreasing(f, lo, hi, { relTol: 1e-12, absTol: 1e-14 });
}
