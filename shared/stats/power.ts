/**
 * Power and sensitivity for t tests and between-subjects F tests.
 *
 * Conventions (stated because programs differ):
 * - t tests use Cohen's d: one-sample d = (mean − mu)/sd, paired d_z = mean
 *   difference / SD of differences, independent d = difference / pooled SD.
 *   Noncentrality: ncp = d·√n (one-sample, paired), d·√(n1·n2/(n1+n2)) (independent).
 *   Two-sided power counts both rejection regions (R's power.t.test with strict = TRUE).
 * - F tests use Cohen's f = √(ηp² / (1 − ηp²)) from the term's partial eta squared,
 *   with noncentrality λ = f²·N where N is the total sample size (the convention of
 *   Cohen 1988, ch. 8, as common practice in power software), df1 and df2 as tested.
 * - "Detectable" is the smallest effect with 80% power at the plan's alpha.
 */
import type { PowerRow, RerunResult, TestRow } from './contract';
import type { PreparedData } from './prepared';
import { fisherF, noncentralFSf, noncentralTCdf, noncentralTSf, studentT } from './dist';
import { solveIncreasing } from './dist/root';

/** Inputs of {@link powerT}. */
export interface PowerTInput {
  /** Effect size d (≥ 0; the sign is ignored for two-sided tests). */
  d: number;
  /** Sample size (one-sample / paired: number of pairs) or size of group 1. */
  n1: number;
  /** Size of group 2 for independent samples. */
  n2?: number;
  /** Paired design: n1 is the number of pairs. */
  paired?: boolean;
  alpha: number;
  tails: 1 | 2;
}

/** Inputs of {@link powerF}. */
export interface PowerFInput {
  /** Cohen's f. */
  f: number;
  df1: number;
  df2: number;
  /** Total sample size N (λ = f²·N). */
  nTotal: number;
  alpha: number;
}

const TARGET_POWER = 0.8;

function tDesign(input: Omit<PowerTInput, 'd'>): { df: number; scale: number } {
  const { n1, n2, paired } = input;
  if (!(n1 >= 2)) throw new RangeError(`power needs at least 2 observations (n1 = ${n1})`);
  if (n2 !== undefined && !paired) {
    if (!(n2 >= 1) || n1 + n2 < 3) throw new RangeError(`power needs two groups with n1 + n2 ≥ 3 (n2 = ${n2})`);
    return { df: n1 + n2 - 2, scale: Math.sqrt((n1 * n2) / (n1 + n2)) };
  }
  return { df: n1 - 1, scale: Math.sqrt(n1) };
}

function checkAlpha(alpha: number): void {
  if (!(alpha > 0 && alpha < 1)) throw new RangeError(`alpha must lie between 0 and 1 (got ${alpha})`);
}

/** Power of a t test at effect size d (noncentral t). */
export function powerT(input: PowerTInput): number {
  checkAlpha(input.alpha);
  const { df, scale } = tDesign(input);
  const ncp = Math.abs(input.d) * scale;
  const crit = studentT(df).quantile(1 - input.alpha / input.tails);
  const upper = noncentralTSf(crit, df, ncp);
  return input.tails === 2 ? upper + noncentralTCdf(-crit, df, ncp) : upper;
}

/** Power of an F test at Cohen's f (noncentral F, λ = f²·N). */
export function powerF(input: PowerFInput): number {
  checkAlpha(input.alpha);
  const { f, df1, df2, nTotal } = input;
  if (!(df1 > 0) || !(df2 > 0)) throw new RangeError(`power needs positive df (df1 = ${df1}, df2 = ${df2})`);
  const crit = fisherF(df1, df2).quantile(1 - input.alpha);
  return noncentralFSf(crit, df1, df2, f * f * nTotal);
}

/** Smallest effect (≥ 0) whose power reaches `power`, for an increasing power curve. */
function smallestEffect(powerAt: (e: number) => number, alpha: number, power: number): number {
  if (!(power > alpha && power < 1)) throw new RangeError(`target power must lie between alpha and 1 (got ${power})`);
  const g = (e: number) => powerAt(e) - power;
  let hi = 0.5;
  while (g(hi) <= 0) {
    hi *= 2;
    if (hi > 1e6) return Infinity;
  }
  return solveIncreasing(g, 0, hi, { relTol: 1e-10 });
}

/** Smallest d detectable with the given power (default 80%). */
export function detectableT(input: Omit<PowerTInput, 'd'> & { power?: number }): number {
  return smallestEffect((d) => powerT({ ...input, d }), input.alpha, input.power ?? TARGET_POWER);
}

/** Smallest Cohen's f detectable with the given power (default 80%). */
export function detectableF(input: Omit<PowerFInput, 'f'> & { power?: number }): number {
  return smallestEffect((f) => powerF({ ...input, f }), input.alpha, input.power ?? TARGET_POWER);
}

/** Cohen's f from partial eta squared: f = √(ηp² / (1 − ηp²)). */
export function cohensFFromPartialEta(partialEtaSq: number): number {
  return Math.sqrt(partialEtaSq / (1 - partialEtaSq));
}

function groupSizes(result: RerunResult): [number, number] | undefined {
  const cells = result.descriptives.filter((c) => Object.keys(c.levels).length > 0);
  if (cells.length !== 2) return undefined;
  return [cells[0].n, cells[1].n];
}

function tRow(row: TestRow, result: RerunResult, d: PreparedData, alpha: number): PowerRow | undefined {
  const base = { alpha, tails: 2 as const };
  let effect: number | undefined;
  let input: Omit<PowerTInput, 'd'> | undefined;
  if (result.design === 'one-sample' && row.term === 'mean') {
    effect = row.cohensD;
    input = { ...base, n1: d.n };
  } else if (result.design === 'paired' && row.variant !== 'welch') {
    effect = row.dz ?? row.cohensD;
    input = { ...base, n1: (row.df ?? NaN) + 1, paired: true };
  } else if (result.design === 'independent' && row.variant === 'student') {
    const sizes = groupSizes(result);
    effect = row.cohensD;
    if (sizes) input = { ...base, n1: sizes[0], n2: sizes[1] };
  }
  if (effect === undefined || !Number.isFinite(effect) || !input) return undefined;
  return {
    term: row.term,
    metric: 'd',
    observed: Math.abs(effect),
    power: powerT({ ...input, d: effect }),
    detectable80: detectableT(input),
    alpha,
  };
}

function fRow(row: TestRow, d: PreparedData, alpha: number): PowerRow | undefined {
  if (row.partialEtaSq === undefined || row.df1 === undefined || row.df2 === undefined) return undefined;
  if (!(row.partialEtaSq >= 0 && row.partialEtaSq < 1)) return undefined;
  const f = cohensFFromPartialEta(row.partialEtaSq);
  const input = { df1: row.df1, df2: row.df2, nTotal: d.n, alpha };
  return { term: row.term, metric: 'f', observed: f, power: powerF({ ...input, f }), detectable80: detectableF(input), alpha };
}

/**
 * Achieved power at the observed effect and the 80%-power detectable effect
 * for every t test (one-sample, Student independent, paired) and every
 * between-subjects F term of an ANOVA without within factors.
 */
export function computePower(result: RerunResult, d: PreparedData): PowerRow[] {
  const alpha = d.plan.alpha;
  const rows: PowerRow[] = [];
  const betweenOnly = result.design === 'anova' && d.within.length === 0;
  for (const row of result.tests) {
    let out: PowerRow | undefined;
    if (row.statistic === 't') out = tRow(row, result, d, alpha);
    else if (row.statistic === 'F' && betweenOnly && row.variant === undefined && row.term !== 'model') out = fRow(row, d, alpha);
    if (out) rows.push(out);
  }
  return rows;
}
