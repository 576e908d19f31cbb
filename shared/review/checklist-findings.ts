/**
 * Automatic evidence for each checklist criterion, drawn from a rerun result.
 *
 * The finding suggests a verdict; the reviewer decides. Every threshold that is a
 * convention rather than a theorem is labelled "common practice" in `basis`, so
 * the reviewer (and the letter) can see where it comes from.
 */
import type { RerunResult, TestRow } from '../stats/contract';
import type { Criterion, Verdict } from '../api/types';

/** One piece of evidence, shown as a labelled value. */
export interface Evidence {
  label: string;
  value: string;
}

/** The automatic finding for one criterion. */
export interface AutoFinding {
  criterion: Criterion;
  /** Suggested verdict, or null when only the reviewer can judge. */
  suggested: Verdict | null;
  /** One or two sentences in plain words. */
  summary: string;
  evidence: Evidence[];
  /** Where thresholds come from. */
  basis: string[];
}

/** What the server knows beyond the rerun result. */
export interface FindingContext {
  /** Correction the submitter says they used for their comparisons (e.g. "holm", "none"). */
  submitterCorrection?: string | null;
  /** Number of tests the submitter reports as one family (defaults to the rerun's comparisons). */
  plannedFamilySize?: number | null;
  /** Flags found in the data, e.g. "subject S0012 appears in two groups". */
  independenceFlags?: string[];
  /** The submitter's free text on sampling and data collection. */
  samplingNotes?: string | null;
}

/** Variance ratio above which pooled-variance tests are doubtful (common practice; some offices use 3). */
export const VARIANCE_RATIO_LIMIT = 4;
/** Power below which a study is flagged as underpowered (common practice: 80%). */
export const POWER_TARGET = 0.8;
/** Standardized residual magnitude treated as an outlier (common practice). */
export const OUTLIER_Z = 3;
/** Greenhouse–Geisser epsilon below which GG rather than HF is applied (common practice). */
export const GG_PREFERRED_BELOW = 0.75;

const fmt = (x: number | undefined | null, digits = 3): string => (x === undefined || x === null || !Number.isFinite(x) ? '—' : Number(x.toPrecision(digits)).toString());
const fmtP = (p: number | undefined | null): string => (p === undefined || p === null || !Number.isFinite(p) ? '—' : p < 0.001 ? '< .001' : p.toFixed(3).replace(/^0/, ''));

function finding(criterion: Criterion, suggested: Verdict | null, summary: string, evidence: Evidence[] = [], basis: string[] = []): AutoFinding {
  return { criterion, suggested, summary, evidence, basis };
}

function independence(r: RerunResult, ctx: FindingContext): AutoFinding {
  const flags = ctx.independenceFlags ?? [];
  const fromWarnings = r.warnings.filter((w) => /subject|duplicate|repeated id/i.test(w));
  const all = [...flags, ...fromWarnings];
  const evidence: Evidence[] = all.map((f, i) => ({ label: `Flag ${i + 1}`, value: f }));
  if (ctx.samplingNotes) evidence.push({ label: 'Sampling notes', value: ctx.samplingNotes });
  if (all.length > 0) return finding('independence', 'concern', `The data show ${all.length} sign(s) that observations may not be independent; check the design description.`, evidence);
  return finding('independence', null, 'No automatic flags (no subject in two groups, no repeated ids in a between-subjects layout). Independence depends on how the data were collected: judge it from the sampling notes.', evidence);
}

function varianceHomogeneity(r: RerunResult): AutoFinding {
  const a = r.assumptions;
  const basis = [`Largest/smallest variance ratio above ${VARIANCE_RATIO_LIMIT} (common practice)`, "Levene's test, Brown–Forsythe variant (center = median)"];
  if (!a?.levene && !a?.brownForsythe) return finding('variance-homogeneity', 'not-applicable', 'The design has no groups whose variances must be equal.', [], []);
  const alpha = r.alpha;
  const ev: Evidence[] = [];
  if (a.levene) ev.push({ label: "Levene's test (mean)", value: `F(${a.levene.df1}, ${a.levene.df2}) = ${fmt(a.levene.value)}, p = ${fmtP(a.levene.p)}` });
  if (a.brownForsythe) ev.push({ label: 'Brown–Forsythe (median)', value: `F(${a.brownForsythe.df1}, ${a.brownForsythe.df2}) = ${fmt(a.brownForsythe.value)}, p = ${fmtP(a.brownForsythe.p)}` });
  if (a.varianceRatio !== undefined) ev.push({ label: 'Largest / smallest variance', value: fmt(a.varianceRatio) });
  const welch = r.tests.find((t) => t.variant === 'welch');
  if (welch) ev.push({ label: 'Welch alternative', value: describeTest(welch) });
  const bfBad = a.brownForsythe ? a.brownForsythe.p < alpha : false;
  const ratioBad = a.varianceRatio !== undefined && a.varianceRatio > VARIANCE_RATIO_LIMIT;
  if (bfBad || ratioBad) {
    return finding('variance-homogeneity', 'concern', `Variances differ across groups${bfBad ? ' (Brown–Forsythe p below alpha)' : ''}${ratioBad ? ` (variance ratio ${fmt(a.varianceRatio)})` : ''}.${welch ? ' The Welch result above does not assume equal variances.' : ''}`, ev, basis);
  }
  return finding('variance-homogeneity', 'met', 'No sign that group variances differ enough to matter.', ev, basis);
}

function sphericity(r: RerunResult): AutoFinding {
  const rows = r.tests.filter((t) => t.sphericity);
  if (rows.length === 0) {
    const within = r.tests.some((t) => t.corrections);
    return finding('sphericity', 'not-applicable', within ? 'Every within-subjects term has two levels, so sphericity holds trivially.' : 'No within-subjects factor with more than two levels.');
  }
  const ev: Evidence[] = [];
  let violated = 0;
  for (const t of rows) {
    const s = t.sphericity!;
    const c = t.corrections;
    const bad = s.p < r.alpha;
    if (bad) violated++;
    const apply = c ? (c.gg.epsilon < GG_PREFERRED_BELOW ? 'Greenhouse–Geisser' : 'Huynh–Feldt') : '—';
    ev.push({ label: `${t.term}: Mauchly`, value: `W = ${fmt(s.W)}, χ²(${s.df}) = ${fmt(s.chiSq)}, p = ${fmtP(s.p)}` });
    if (c) ev.push({ label: `${t.term}: epsilons`, value: `GG ${fmt(c.gg.epsilon)}, HF ${fmt(c.hf.epsilon)}, lower bound ${fmt(c.lb.epsilon)}; ${bad ? `apply ${apply}: F(${fmt(apply === 'Greenhouse–Geisser' ? c.gg.df1 : c.hf.df1)}, ${fmt(apply === 'Greenhouse–Geisser' ? c.gg.df2 : c.hf.df2)}), p = ${fmtP(apply === 'Greenhouse–Geisser' ? c.gg.p : c.hf.p)}` : 'no correction needed'}` });
  }
  const basis = ["Mauchly's test at the plan's alpha", `Greenhouse–Geisser when its epsilon is below ${GG_PREFERRED_BELOW}, otherwise Huynh–Feldt (common practice)`];
  if (violated) return finding('sphericity', 'concern', `Sphericity is doubtful for ${violated} term(s); the reported F tests must use a corrected df.`, ev, basis);
  return finding('sphericity', 'met', 'Mauchly\'s test does not reject sphericity for any term.', ev, basis);
}

function multiplicity(r: RerunResult, ctx: FindingContext): AutoFinding {
  const comps = r.comparisons ?? [];
  const familySize = ctx.plannedFamilySize ?? comps.length;
  if (familySize <= 1) return finding('multiplicity-control', 'not-applicable', 'One comparison or none: no family to control.');
  const methods = [...new Set(comps.map((c) => c.method))];
  const ev: Evidence[] = [
    { label: 'Family size', value: String(familySize) },
    { label: 'Method in rerun', value: methods.join(', ') || '—' },
    { label: 'Method the submitter used', value: ctx.submitterCorrection ?? 'not stated' },
  ];
  const changed = comps.filter((c) => c.p !== null && (c.p < r.alpha) !== (c.pAdjusted < r.alpha));
  if (changed.length) ev.push({ label: 'Decisions changed by adjustment', value: changed.map((c) => `${c.a} vs ${c.b}`).join('; ') });
  const used = (ctx.submitterCorrection ?? '').toLowerCase();
  if (!used || used === 'none') return finding('multiplicity-control', 'not-met', `${familySize} comparisons were made without a stated correction for multiplicity.`, ev, ['Family-wise or false-discovery-rate control for more than one comparison']);
  if (methods.length && !methods.some((m) => used.includes(m))) return finding('multiplicity-control', 'concern', `The submitter used "${ctx.submitterCorrection}", the rerun used ${methods.join(', ')}; compare the adjusted p-values.`, ev);
  return finding('multiplicity-control', 'met', `The ${familySize} comparisons are adjusted (${methods.join(', ')}).`, ev);
}

function normality(r: RerunResult): AutoFinding {
  const n = r.assumptions?.normality;
  if (!n) return finding('residual-normality', null, 'No residual normality test in this rerun.');
  const ev = [{ label: 'Shapiro–Wilk on residuals', value: `W = ${fmt(n.W, 4)}, p = ${fmtP(n.p)}` }];
  const basis = ['Shapiro–Wilk test (Royston 1995 algorithm)', 'With large samples the test flags trivial departures; look at the Q-Q plot (common practice)'];
  if (n.p < r.alpha) return finding('residual-normality', 'concern', `Residuals depart from normality (p = ${fmtP(n.p)}); with n = ${r.n} judge the size of the departure on the Q-Q plot and consider the rank-based result.`, ev, basis);
  return finding('residual-normality', 'met', 'No evidence against normal residuals.', ev, basis);
}

function outliers(r: RerunResult): AutoFinding {
  if (!r.outliers) return finding('outliers', null, 'This rerun did not report standardized residuals.');
  const basis = [`|standardized residual| > ${OUTLIER_Z} (common practice)`];
  const ev = r.outliers.slice(0, 10).map((o) => ({ label: `Row ${o.row}`, value: fmt(o.value) }));
  if (r.outliers.length === 0) return finding('outliers', 'met', `No standardized residual beyond ±${OUTLIER_Z}.`, ev, basis);
  return finding('outliers', 'concern', `${r.outliers.length} observation(s) with a standardized residual beyond ±${OUTLIER_Z}; check whether they are errors or real and whether conclusions depend on them.`, ev, basis);
}

function effectSizes(r: RerunResult): AutoFinding {
  const ev: Evidence[] = [];
  for (const t of r.tests) {
    const parts: string[] = [];
    if (t.cohensD !== undefined) parts.push(`d = ${fmt(t.cohensD)}${t.cohensDCi ? ` [${fmt(t.cohensDCi[0])}, ${fmt(t.cohensDCi[1])}]` : ''}`);
    if (t.hedgesG !== undefined) parts.push(`g = ${fmt(t.hedgesG)}`);
    if (t.dz !== undefined) parts.push(`d_z = ${fmt(t.dz)}`);
    if (t.partialEtaSq !== undefined) parts.push(`ηp² = ${fmt(t.partialEtaSq)}`);
    if (t.generalizedEtaSq !== undefined) parts.push(`ηG² = ${fmt(t.generalizedEtaSq)}`);
    if (t.omegaSq !== undefined) parts.push(`ω² = ${fmt(t.omegaSq)}`);
    if (t.estimate !== undefined && t.ciLower !== undefined) parts.push(`estimate ${fmt(t.estimate)} [${fmt(t.ciLower)}, ${fmt(t.ciUpper)}]`);
    if (parts.length) ev.push({ label: `${t.term}${t.variant ? ` (${t.variant})` : ''}`, value: parts.join(', ') });
  }
  if (r.coefficients) for (const c of r.coefficients) ev.push({ label: c.term, value: `${fmt(c.estimate)} [${fmt(c.ciLower)}, ${fmt(c.ciUpper)}]` });
  return finding('effect-size-precision', null, 'The rerun computed these effect sizes and intervals; check that the report states them beside the p-values.', ev, ['APA reporting standards ask for effect sizes with confidence intervals']);
}

function power(r: RerunResult): AutoFinding {
  const rows = r.power ?? [];
  if (rows.length === 0) return finding('sample-size-power', null, 'No power computation for this design.');
  const basis = [`Target power ${POWER_TARGET * 100}% (common practice)`, 'Power at the observed effect says little after the fact; the detectable effect is the more useful figure'];
  const ev = rows.map((p) => ({ label: p.term, value: `power ${fmt(p.power, 2)} at observed ${p.metric} = ${fmt(p.observed)}; ${POWER_TARGET * 100}% power for ${p.metric} ≥ ${fmt(p.detectable80)}` }));
  const low = rows.filter((p) => p.power < POWER_TARGET);
  if (low.length) return finding('sample-size-power', 'concern', `The sample detects effects of ${low.map((p) => `${p.metric} ≥ ${fmt(p.detectable80)}`).join(', ')} with ${POWER_TARGET * 100}% power; judge whether smaller effects would matter.`, ev, basis);
  return finding('sample-size-power', 'met', 'The sample is large enough for the effects of interest at the plan\'s alpha.', ev, basis);
}

function agreement(r: RerunResult): AutoFinding {
  const rows = r.reconciliation ?? [];
  if (rows.length === 0) return finding('reported-agreement', null, 'The submitter reported no statistics to compare.');
  const ev = rows.map((row) => ({ label: row.text, value: `${row.verdict}: ${row.explanation}` }));
  if (rows.some((x) => x.verdict === 'decision-changing')) return finding('reported-agreement', 'not-met', 'At least one reported result does not reproduce and the difference changes the conclusion at the plan\'s alpha.', ev);
  if (rows.some((x) => x.verdict === 'inconsistent' || x.verdict === 'unparsed')) return finding('reported-agreement', 'concern', 'Some reported results do not match the rerun or could not be read.', ev);
  return finding('reported-agreement', 'met', 'Every reported result matches the rerun (up to rounding).', ev);
}

/** A test row as a short reporting string for evidence lists. */
export function describeTest(t: TestRow): string {
  const df = t.statistic === 'F' ? `(${fmt(t.df1)}, ${fmt(t.df2)})` : t.df !== undefined ? `(${fmt(t.df)})` : '';
  return `${t.statistic}${df} = ${fmt(t.value)}, p = ${fmtP(t.p)}`;
}

/** All automatic findings, one per criterion, in checklist order. */
export function autoFindings(r: RerunResult, ctx: FindingContext = {}): AutoFinding[] {
  return [independence(r, ctx), varianceHomogeneity(r), sphericity(r), multiplicity(r, ctx), normality(r), outliers(r), effectSizes(r), power(r), agreement(r)];
}
