/**
 * Turns a RerunResult into the APA-style sentences and rows a letter prints.
 * Numbers go through the shared APA formatter (shared/stats/apa/format.ts) so the letter
 * and the review screen agree; this module adds what only a letter needs: corrected df
 * when a sphericity correction applies, effect-size intervals, and the choice of lines.
 */
import { formatBounded, formatDf, formatNumber, formatP } from '../../shared/stats/apa/format';
import type { ComparisonMethod, ComparisonRow, RerunResult, TestRow } from '../../shared/stats/contract';

/** Number with fixed decimals, or a dash when absent. */
export function num(x: number | undefined | null, digits = 2): string {
  return x === undefined || x === null ? '—' : formatNumber(x, digits);
}

/** Number bounded by 1 in absolute value, without the leading zero (APA: p, η², ε). */
export function bounded(x: number | undefined | null, digits = 2): string {
  return x === undefined || x === null ? '—' : formatBounded(x, digits);
}

/** APA p: exact to three decimals, "< .001" below that. */
export const pText = formatP;

/** Degrees of freedom: integers plainly, fractional df to at most two decimals. */
export function dfText(df: number | undefined): string {
  return df === undefined ? '—' : formatDf(df);
}

/** Confidence label from alpha, e.g. "95% CI". */
export function ciLabel(alpha: number): string {
  const level = (1 - alpha) * 100;
  return `${Number.isInteger(Math.round(level * 10) / 10) ? Math.round(level) : level.toFixed(1)}% CI`;
}

/** Human label of a term ("a:b" becomes "a × b"). */
export function termLabel(term: string): string {
  if (term === 'mean') return 'Mean against the test value';
  if (term === 'model') return 'Model';
  return term.split(':').join(' × ');
}

/** Human label of a comparison procedure. */
export function methodLabel(m: ComparisonMethod): string {
  return { tukey: 'Tukey HSD', 'games-howell': 'Games–Howell', bonferroni: 'Bonferroni', holm: 'Holm', bh: 'Benjamini–Hochberg' }[m];
}

/** Which sphericity correction a letter reports for a within term, or null when none is needed. */
export function chosenCorrection(t: TestRow, alpha: number): { name: string; key: 'gg' | 'hf' } | null {
  if (!t.sphericity || !t.corrections || !(t.sphericity.p < alpha)) return null;
  // Common practice: Greenhouse–Geisser when its epsilon is below .75, Huynh–Feldt otherwise.
  return t.corrections.gg.epsilon < 0.75 ? { name: 'Greenhouse–Geisser', key: 'gg' } : { name: 'Huynh–Feldt', key: 'hf' };
}

/** One test as an APA reporting string, with the sphericity correction applied when one is due. */
export function testString(t: TestRow, alpha: number, contrast?: string): string {
  const ci = ciLabel(alpha);
  const parts: string[] = [];
  if (t.statistic === 'F') {
    const corr = chosenCorrection(t, alpha);
    if (corr && t.corrections) {
      const c = t.corrections[corr.key];
      parts.push(`F(${dfText(c.df1)}, ${dfText(c.df2)}) = ${num(t.value)}`, pText(c.p));
    } else {
      parts.push(`F(${dfText(t.df1)}, ${dfText(t.df2)}) = ${num(t.value)}`, pText(t.p));
    }
    if (t.partialEtaSq !== undefined) parts.push(`ηp² = ${bounded(t.partialEtaSq)}`);
    if (t.generalizedEtaSq !== undefined) parts.push(`ηG² = ${bounded(t.generalizedEtaSq)}`);
    if (t.partialEtaSq === undefined && t.etaSq !== undefined) parts.push(`η² = ${bounded(t.etaSq)}`);
    if (t.omegaSq !== undefined) parts.push(`ω² = ${bounded(t.omegaSq)}`);
    if (corr && t.corrections) parts.push(`${corr.name} ε = ${bounded(t.corrections[corr.key].epsilon)}`);
  } else {
    const sym = t.statistic;
    parts.push(t.df !== undefined ? `${sym}(${dfText(t.df)}) = ${num(t.value)}` : `${sym} = ${num(t.value)}`, pText(t.p));
    if (t.estimate !== undefined) {
      const diff = t.term === 'mean' ? 'M' : contrast ? `M diff (${contrast})` : 'M diff';
      parts.push(`${diff} = ${num(t.estimate)}` + (t.ciLower !== undefined ? `, ${ci} [${num(t.ciLower)}, ${num(t.ciUpper)}]` : ''));
    }
    if (t.dz !== undefined) parts.push(`dz = ${num(t.dz)}`);
    else if (t.cohensD !== undefined) {
      parts.push(`d = ${num(t.cohensD)}` + (t.cohensDCi ? `, ${ci} [${num(t.cohensDCi[0])}, ${num(t.cohensDCi[1])}]` : ''));
    }
    if (t.hedgesG !== undefined) {
      parts.push(`g = ${num(t.hedgesG)}` + (t.hedgesGCi ? `, ${ci} [${num(t.hedgesGCi[0])}, ${num(t.hedgesGCi[1])}]` : ''));
    }
  }
  return parts.join(', ');
}

/** Name of the test family for a row, e.g. "Welch's t test". */
export function testName(t: TestRow): string {
  if (t.statistic === 'z') return 'z test';
  if (t.statistic === 't') {
    if (t.variant === 'welch') return "Welch's t test";
    if (t.variant === 'paired') return 'Paired t test';
    if (t.variant === 'student') return "Student's t test";
    return 't test';
  }
  if (t.variant === 'welch') return "Welch's ANOVA";
  return t.sphericity ? 'Within-subjects F test' : 'F test';
}

/** One line of the main results: a label and its reporting string. */
export interface ResultLine {
  label: string;
  text: string;
}

/** One comparison as a table row of strings. */
export interface ComparisonLine {
  factor: string;
  method: string;
  pair: string;
  difference: string;
  interval: string;
  statistic: string;
  pAdjusted: string;
}

/** The parts of a rerun a letter prints. */
export interface LetterResults {
  ciLabel: string;
  sampleLine: string;
  mainTests: ResultLine[];
  fit: string | null;
  coefficients: ResultLine[];
  assumptions: ResultLine[];
  corrections: string[];
  comparisons: ComparisonLine[];
  nonparametric: ResultLine[];
  descriptives: { cell: string; n: string; mean: string; sd: string; interval: string }[];
  warnings: string[];
}

function comparisonLine(c: ComparisonRow): ComparisonLine {
  return {
    factor: c.factor,
    method: methodLabel(c.method),
    pair: `${c.a} − ${c.b}`,
    difference: num(c.estimate),
    interval: `[${num(c.ciLower)}, ${num(c.ciUpper)}]`,
    statistic: `t(${dfText(c.df)}) = ${num(c.statistic)}`,
    pAdjusted: pText(c.pAdjusted).replace(/^p/, 'p adj'),
  };
}

/** "a − b" for a two-level t test, read from the order of the rerun's cells (estimate = first − second). */
function contrastOf(r: RerunResult, t: TestRow): string | undefined {
  if (t.statistic === 'F' || t.term === 'mean' || t.term === 'model') return undefined;
  const levels = [...new Set(r.descriptives.map((d) => d.levels[t.term]).filter((v): v is string => v !== undefined))];
  return levels.length === 2 ? `${levels[0]} − ${levels[1]}` : undefined;
}

/** Builds the letter's result section from a rerun. */
export function letterResults(r: RerunResult): LetterResults {
  const alpha = r.alpha;
  const mainTests = r.tests.map((t) => ({ label: `${termLabel(t.term)} — ${testName(t)}`, text: testString(t, alpha, contrastOf(r, t)) }));

  const assumptions: ResultLine[] = [];
  const a = r.assumptions;
  if (a?.levene) assumptions.push({ label: "Levene's test (mean-centred)", text: `F(${dfText(a.levene.df1)}, ${dfText(a.levene.df2)}) = ${num(a.levene.value)}, ${pText(a.levene.p)}` });
  if (a?.brownForsythe) assumptions.push({ label: 'Brown–Forsythe (median-centred)', text: `F(${dfText(a.brownForsythe.df1)}, ${dfText(a.brownForsythe.df2)}) = ${num(a.brownForsythe.value)}, ${pText(a.brownForsythe.p)}` });
  if (a?.varianceRatio !== undefined) assumptions.push({ label: 'Largest / smallest cell variance', text: num(a.varianceRatio) });
  if (a?.normality) assumptions.push({ label: 'Shapiro–Wilk on residuals', text: `W = ${bounded(a.normality.W, 3)}, ${pText(a.normality.p)}` });
  for (const t of r.tests) {
    if (!t.sphericity) continue;
    const s = t.sphericity;
    const eps = t.corrections ? `; ε GG = ${bounded(t.corrections.gg.epsilon, 3)}, ε HF = ${bounded(t.corrections.hf.epsilon, 3)}` : '';
    assumptions.push({ label: `Mauchly's test, ${termLabel(t.term)}`, text: `W = ${bounded(s.W, 3)}, χ²(${dfText(s.df)}) = ${num(s.chiSq)}, ${pText(s.p)}${eps}` });
  }
  if (r.outliers) {
    assumptions.push({
      label: 'Standardized residuals beyond ±3',
      text: r.outliers.length === 0 ? 'none' : r.outliers.map((o) => `row ${o.row} (${num(o.value)})`).join(', '),
    });
  }

  const corrections: string[] = [];
  for (const t of r.tests) {
    const c = chosenCorrection(t, alpha);
    if (c && t.corrections) {
      corrections.push(`${c.name} correction applied to ${termLabel(t.term)} (ε = ${bounded(t.corrections[c.key].epsilon, 3)}) because Mauchly's test rejected sphericity.`);
    } else if (t.sphericity && t.corrections) {
      corrections.push(`No sphericity correction needed for ${termLabel(t.term)} (Mauchly ${pText(t.sphericity.p)}).`);
    }
    if (t.variant === 'welch') corrections.push(`${testName(t)} also reported for ${termLabel(t.term)}: it does not assume equal variances.`);
  }
  const families = new Map<string, ComparisonMethod>();
  for (const c of r.comparisons ?? []) families.set(c.factor, c.method);
  for (const [factor, m] of families) {
    const size = (r.comparisons ?? []).filter((c) => c.factor === factor).length;
    corrections.push(`Pairwise comparisons of ${factor}: ${methodLabel(m)} adjustment over a family of ${size}.`);
  }

  const coefficients = (r.coefficients ?? []).map((c) => ({
    label: c.term,
    text: `b = ${num(c.estimate)}, SE = ${num(c.se)}, t(${dfText(c.df)}) = ${num(c.value)}, ${pText(c.p)}, ${ciLabel(alpha)} [${num(c.ciLower)}, ${num(c.ciUpper)}]${c.vif !== undefined ? `, VIF = ${num(c.vif)}` : ''}`,
  }));
  const fit = r.rSquared !== undefined ? `R² = ${bounded(r.rSquared)}${r.adjRSquared !== undefined ? `, adjusted R² = ${bounded(r.adjRSquared)}` : ''}` : null;

  const nonparametric = (r.nonparametric ?? []).map((n) => {
    const name = { 'mann-whitney': 'Mann–Whitney U', wilcoxon: 'Wilcoxon signed-rank', 'kruskal-wallis': 'Kruskal–Wallis H', friedman: 'Friedman χ²' }[n.method];
    const sym = { 'mann-whitney': 'U', wilcoxon: 'V', 'kruskal-wallis': 'H', friedman: 'χ²' }[n.method];
    return { label: `${termLabel(n.term)} — ${name}`, text: `${sym}${n.df !== undefined ? `(${dfText(n.df)})` : ''} = ${num(n.value)}, ${pText(n.p)}` };
  });

  const descriptives = r.descriptives.map((d) => ({
    cell: Object.values(d.levels).join(' · ') || 'All observations',
    n: String(d.n),
    mean: num(d.mean),
    sd: num(d.sd),
    interval: `[${num(d.ciLower)}, ${num(d.ciUpper)}]`,
  }));

  const sampleLine =
    `${r.n} observation${r.n === 1 ? '' : 's'} used` +
    (r.subjects !== undefined ? ` from ${r.subjects} subjects` : '') +
    (r.excluded > 0 ? `; ${r.excluded} excluded` : '; none excluded') +
    `; α\u00a0=\u00a0${bounded(alpha, 3).replace(/0+$/, '')}.`;

  return {
    ciLabel: ciLabel(alpha),
    sampleLine,
    mainTests,
    fit,
    coefficients,
    assumptions,
    corrections,
    comparisons: (r.comparisons ?? []).map(comparisonLine),
    nonparametric,
    descriptives,
    warnings: r.warnings,
  };
}
