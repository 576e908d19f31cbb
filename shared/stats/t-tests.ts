/**
 * The t-test designs: one sample (plus a z test when the population SD is
 * known), two independent groups (Student and Welch), and paired conditions.
 *
 * Values arrive centred on an exact decimal offset. Spreads and differences are
 * shift-invariant and use the centred values; the offset is added back only
 * for means and one-sample estimates. Family results carry only the warnings
 * raised here; the dispatcher merges the preparation warnings.
 */
import type { NonparametricRow, RerunResult, TestRow } from './contract';
import { InputError } from './contract';
import { describeCell } from './descriptives';
import { normal, studentT } from './dist';
import { independentD, oneSampleD } from './effect-sizes';
import { leveneTest } from './levene';
import { meanAndSs } from './linear-model';
import type { PreparedData } from './prepared';
import { mannWhitney, wilcoxonSignedRank } from './rank-tests';
import { shapiroWilk } from './shapiro-wilk';
import { pairBySubject } from './paired-rows';

/** Two-sided p of a t statistic. */
function twoSidedT(t: number, df: number): number {
  return 2 * studentT(df).sf(Math.abs(t));
}

/** Shapiro–Wilk on a sample when its size allows (3 to 5000), else undefined with a warning above 5000. */
function normalityOf(x: ArrayLike<number>, warnings: string[]) {
  if (x.length > 5000) warnings.push(`The Shapiro–Wilk normality check was skipped: it is defined for at most 5000 values and there are ${x.length}.`);
  if (x.length < 3 || x.length > 5000) return undefined;
  const { W, p } = shapiroWilk(x);
  return { method: 'shapiro-wilk' as const, W, p, n: x.length };
}

/** One-sample t test of the outcome mean against plan.mu (and z test when plan.sigma is given). */
export function analyseOneSample(d: PreparedData): Partial<RerunResult> {
  const { alpha } = d.plan;
  const mu = d.plan.mu ?? 0;
  const x = d.outcome.values;
  const n = x.length;
  const name = d.outcome.name;
  if (n < 2) throw new InputError(`column ${name}`, `A one-sample test needs at least two values of "${name}"; found ${n}.`);
  const { mean, ss } = meanAndSs(x);
  const sd = Math.sqrt(ss / (n - 1));
  if (!(sd > 0)) throw new InputError(`column ${name}`, `Every value of "${name}" is the same (${d.outcome.offset + mean}); a t test needs variation.`);
  // (offset − mu) first: both are typed decimals, so the difference keeps the centred mean's digits.
  const estimate = d.outcome.offset - mu + mean;
  const se = sd / Math.sqrt(n);
  const df = n - 1;
  const t = estimate / se;
  const half = studentT(df).quantile(1 - alpha / 2) * se;
  const dz = oneSampleD(estimate, sd, n, alpha);
  const tests: TestRow[] = [
    { term: 'mean', statistic: 't', value: t, df, p: twoSidedT(t, df), estimate, ciLower: estimate - half, ciUpper: estimate + half, cohensD: dz.value, cohensDCi: dz.ci },
  ];
  if (d.plan.sigma !== undefined) {
    const sigma = d.plan.sigma;
    if (!(sigma > 0 && Number.isFinite(sigma))) throw new InputError('plan.sigma', `plan.sigma must be a positive number (the known population SD); got ${sigma}.`);
    const seZ = sigma / Math.sqrt(n);
    const z = estimate / seZ;
    const std = normal();
    const halfZ = std.quantile(1 - alpha / 2) * seZ;
    tests.push({ term: 'mean', statistic: 'z', value: z, p: 2 * std.sf(Math.abs(z)), estimate, ciLower: estimate - halfZ, ciUpper: estimate + halfZ, cohensD: estimate / sigma });
  }
  const shifted = new Float64Array(n);
  const shift = d.outcome.offset - mu;
  for (let i = 0; i < n; i++) shifted[i] = x[i] + shift;
  const w = wilcoxonSignedRank(shifted);
  const warnings: string[] = [];
  const normality = normalityOf(x, warnings);
  return {
    descriptives: [describeCell({ n, mean, ss }, {}, d.outcome.offset, alpha)],
    tests,
    assumptions: normality ? { normality } : {},
    nonparametric: [{ term: 'mean', method: 'wilcoxon', value: w.value, p: w.p }],
    warnings,
  };
}

/** Two independent groups: Student and Welch t, mean difference, d and g, variance tests, Mann–Whitney. */
export function analyseIndependent(d: PreparedData): Partial<RerunResult> {
  const { alpha } = d.plan;
  if (d.between.length !== 1) throw new InputError('plan.between', `An independent-groups test needs exactly one grouping column in plan.between; got ${d.between.length}.`);
  const f = d.between[0];
  if (f.levels.length !== 2)
    throw new InputError(`column ${f.name}`, `The grouping column "${f.name}" must have exactly two groups for an independent-groups test; found ${f.levels.length} (${f.levels.join(', ')}).`);
  const groups: Float64Array[] = [0, 1].map(() => new Float64Array(0));
  const counts = [0, 0];
  for (let i = 0; i < f.codes.length; i++) counts[f.codes[i]]++;
  groups[0] = new Float64Array(counts[0]);
  groups[1] = new Float64Array(counts[1]);
  const fill = [0, 0];
  const x = d.outcome.values;
  for (let i = 0; i < f.codes.length; i++) groups[f.codes[i]][fill[f.codes[i]]++] = x[i];
  groups.forEach((g, k) => {
    if (g.length < 2) throw new InputError(`column ${f.name}`, `Group "${f.levels[k]}" of "${f.name}" has ${g.length} observation(s); each group needs at least two.`);
  });
  const [a, b] = groups.map((g) => ({ n: g.length, ...meanAndSs(g) }));
  const diff = a.mean - b.mean;
  const dfS = a.n + b.n - 2;
  const pooledVar = (a.ss + b.ss) / dfS;
  if (!(pooledVar > 0)) throw new InputError(`column ${d.outcome.name}`, `"${d.outcome.name}" does not vary within either group; the t statistic is undefined.`);
  const seS = Math.sqrt(pooledVar * (1 / a.n + 1 / b.n));
  const tS = diff / seS;
  const halfS = studentT(dfS).quantile(1 - alpha / 2) * seS;
  const va = a.ss / (a.n - 1) / a.n;
  const vb = b.ss / (b.n - 1) / b.n;
  const seW = Math.sqrt(va + vb);
  const dfW = (va + vb) ** 2 / ((va * va) / (a.n - 1) + (vb * vb) / (b.n - 1));
  const tW = diff / seW;
  const halfW = studentT(dfW).quantile(1 - alpha / 2) * seW;
  const es = independentD(diff, Math.sqrt(pooledVar), a.n, b.n, alpha);
  const effect = { cohensD: es.d.value, cohensDCi: es.d.ci, hedgesG: es.g.value, hedgesGCi: es.g.ci };
  const tests: TestRow[] = [
    { term: f.name, statistic: 't', variant: 'student', value: tS, df: dfS, p: twoSidedT(tS, dfS), estimate: diff, ciLower: diff - halfS, ciUpper: diff + halfS, ...effect },
    { term: f.name, statistic: 't', variant: 'welch', value: tW, df: dfW, p: twoSidedT(tW, dfW), estimate: diff, ciLower: diff - halfW, ciUpper: diff + halfW, ...effect },
  ];
  const mw = mannWhitney(groups[0], groups[1]);
  const nonparametric: NonparametricRow[] = [{ term: f.name, method: 'mann-whitney', value: mw.value, p: mw.p }];
  const residuals = new Float64Array(a.n + b.n);
  groups[0].forEach((v, i) => (residuals[i] = v - a.mean));
  groups[1].forEach((v, i) => (residuals[a.n + i] = v - b.mean));
  const warnings: string[] = [];
  const normality = normalityOf(residuals, warnings);
  const varA = a.ss / (a.n - 1);
  const varB = b.ss / (b.n - 1);
  return {
    descriptives: [a, b].map((c, k) => describeCell(c, { [f.name]: f.levels[k] }, d.outcome.offset, alpha)),
    tests,
    assumptions: {
      levene: leveneTest(groups, 'mean'),
      brownForsythe: leveneTest(groups, 'median'),
      ...(normality ? { normality } : {}),
      varianceRatio: Math.max(varA, varB) / Math.min(varA, varB),
    },
    nonparametric,
    warnings,
  };
}

/** Paired conditions in long format: paired t on level 1 minus level 2, d_z, Wilcoxon signed-rank. */
export function analysePaired(d: PreparedData): Partial<RerunResult> {
  const { alpha } = d.plan;
  const pairs = pairBySubject(d);
  const w = d.within[0];
  const n = pairs.first.length;
  if (n < 2) throw new InputError(`column ${d.subject!.name}`, `A paired test needs at least two subjects with both "${w.levels[0]}" and "${w.levels[1]}"; found ${n}.`);
  const diffs = new Float64Array(n);
  for (let i = 0; i < n; i++) diffs[i] = pairs.first[i] - pairs.second[i];
  const { mean, ss } = meanAndSs(diffs);
  const sd = Math.sqrt(ss / (n - 1));
  if (!(sd > 0)) throw new InputError(`column ${d.outcome.name}`, `Every subject shows the same difference between "${w.levels[0]}" and "${w.levels[1]}"; the paired t statistic is undefined.`);
  const se = sd / Math.sqrt(n);
  const df = n - 1;
  const t = mean / se;
  const half = studentT(df).quantile(1 - alpha / 2) * se;
  const dz = oneSampleD(mean, sd, n, alpha);
  const wil = wilcoxonSignedRank(diffs);
  const warnings: string[] = [];
  if (pairs.droppedSubjects.length > 0) {
    const shown = pairs.droppedSubjects.slice(0, 10).join(', ');
    const more = pairs.droppedSubjects.length > 10 ? ` and ${pairs.droppedSubjects.length - 10} more` : '';
    warnings.push(`${pairs.droppedSubjects.length} subject(s) lacked a value for one of the two conditions and were left out: ${shown}${more}.`);
  }
  const normality = normalityOf(diffs, warnings);
  return {
    n: 2 * n,
    excluded: pairs.droppedSubjects.length,
    subjects: n,
    descriptives: [pairs.first, pairs.second].map((v, k) => describeCell({ n, ...meanAndSs(v) }, { [w.name]: w.levels[k] }, d.outcome.offset, alpha)),
    tests: [{ term: w.name, statistic: 't', variant: 'paired', value: t, df, p: twoSidedT(t, df), estimate: mean, ciLower: mean - half, ciUpper: mean + half, cohensD: dz.value, cohensDCi: dz.ci, dz: dz.value }],
    assumptions: normality ? { normality } : {},
    nonparametric: [{ term: w.name, method: 'wilcoxon', value: wil.value, p: wil.p }],
    warnings,
  };
}
