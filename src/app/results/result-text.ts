import { formatBounded, formatCoefficient, formatComparison, formatDf, formatNumber, formatP, formatTest } from '../../../shared/stats/apa/format';
import type { ComparisonMethod, NonparametricRow, ReconcileVerdict, RerunResult, TestRow } from '../../../shared/stats/contract';

/** Pairwise procedures in our words. */
export const METHOD_LABELS: Record<ComparisonMethod, string> = {
  tukey: 'Tukey HSD',
  'games-howell': 'Games–Howell',
  bonferroni: 'Bonferroni',
  holm: 'Holm',
  bh: 'Benjamini–Hochberg',
};

/** Rank-based procedures in our words. */
export const RANK_METHOD_LABELS: Record<NonparametricRow['method'], string> = {
  'mann-whitney': 'Mann–Whitney U',
  wilcoxon: 'Wilcoxon signed-rank',
  'kruskal-wallis': 'Kruskal–Wallis H',
  friedman: 'Friedman χ²',
};

/** Reconciliation verdicts as chips: a short label and a colour key. */
export const RECONCILE_LABELS: Record<ReconcileVerdict, { label: string; tone: 'good' | 'fair' | 'bad' | 'none' }> = {
  consistent: { label: 'Agrees', tone: 'good' },
  rounding: { label: 'Agrees within rounding', tone: 'good' },
  inconsistent: { label: 'Does not agree', tone: 'fair' },
  'decision-changing': { label: 'Disagrees: changes the conclusion', tone: 'bad' },
  unparsed: { label: 'Could not be read', tone: 'none' },
};

/** A table number: fixed decimals, "—" when absent. */
export function num(x: number | null | undefined, decimals = 2): string {
  return x === null || x === undefined ? '—' : formatNumber(x, decimals);
}

/** A quantity bounded by 1 (η², ω², W) without its leading zero. */
export function bounded(x: number | null | undefined, decimals = 2): string {
  return x === null || x === undefined ? '—' : formatBounded(x, decimals);
}

/** Degrees of freedom for a table cell. */
export function df(x: number | null | undefined): string {
  return x === null || x === undefined ? '—' : formatDf(x);
}

/** A p-value cell: ".004", "< .001", "> .999". */
export function pCell(p: number | null | undefined): string {
  if (p === null || p === undefined) return '—';
  return formatP(p).replace(/^p = /, '').replace(/^p /, '');
}

/** Term names as people read them: "a:b" becomes "a × b". */
export function termLabel(term: string): string {
  if (term === 'mean') return 'Mean';
  if (term === 'model') return 'Whole model';
  return term.split(':').join(' × ');
}

/** The test's name for the table: "F", "Welch F", "t (paired)". */
export function testName(t: TestRow): string {
  const v = t.variant;
  if (!v) return t.statistic;
  if (v === 'welch') return `Welch ${t.statistic}`;
  if (v === 'student') return `Student ${t.statistic}`;
  return `${t.statistic} (${v})`;
}

/** The df cell: "2, 86" for F, "28" for t, "—" for z. */
export function dfCell(t: TestRow): string {
  if (t.statistic === 'F') return `${df(t.df1)}, ${df(t.df2)}`;
  return t.df === undefined ? '—' : df(t.df);
}

/** Effect sizes of a test row in short form, e.g. "ηp² .12 · ω² .10". */
export function effectCell(t: TestRow): string {
  const parts: string[] = [];
  if (t.partialEtaSq !== undefined) parts.push(`ηp² ${bounded(t.partialEtaSq)}`);
  if (t.generalizedEtaSq !== undefined) parts.push(`ηG² ${bounded(t.generalizedEtaSq)}`);
  if (t.omegaSq !== undefined) parts.push(`ω² ${bounded(t.omegaSq)}`);
  if (t.dz !== undefined) parts.push(`dz ${num(t.dz)}`);
  if (t.cohensD !== undefined) parts.push(`d ${num(t.cohensD)}${t.cohensDCi ? ` [${num(t.cohensDCi[0])}, ${num(t.cohensDCi[1])}]` : ''}`);
  if (t.hedgesG !== undefined) parts.push(`g ${num(t.hedgesG)}${t.hedgesGCi ? ` [${num(t.hedgesGCi[0])}, ${num(t.hedgesGCi[1])}]` : ''}`);
  return parts.length ? parts.join(' · ') : '—';
}

/** The interval of the estimate, e.g. "1.23 [0.45, 2.01]". */
export function estimateCell(t: TestRow): string {
  if (t.estimate === undefined) return '—';
  const ci = t.ciLower !== undefined && t.ciUpper !== undefined ? ` [${num(t.ciLower)}, ${num(t.ciUpper)}]` : '';
  return `${num(t.estimate)}${ci}`;
}

/**
 * The headline list: one APA-style sentence per test, then comparisons below alpha after
 * adjustment, then coefficients and model fit, so the reviewer reads the outcome first.
 */
export function headlines(r: RerunResult): string[] {
  const out: string[] = [];
  for (const t of r.tests) {
    const label = t.variant && t.variant !== 'student' && t.variant !== 'paired' ? `${termLabel(t.term)} (${testName(t)})` : termLabel(t.term);
    let line = `${label}: ${formatTest(t)}`;
    const gg = t.corrections?.gg;
    if (gg && t.sphericity && t.sphericity.p < r.alpha) {
      line += `; with Greenhouse–Geisser correction (ε = ${bounded(gg.epsilon)}) F(${formatDf(gg.df1)}, ${formatDf(gg.df2)}), ${formatP(gg.p)}`;
    }
    out.push(line);
  }
  for (const c of r.comparisons ?? []) {
    if (c.pAdjusted < r.alpha) out.push(`${termLabel(c.factor)}, ${formatComparison(c)}`);
  }
  for (const c of r.coefficients ?? []) {
    if (c.term !== '(intercept)') out.push(`${c.term}: ${formatCoefficient(c)}`);
  }
  if (r.rSquared !== undefined) {
    out.push(`Model fit: R² = ${bounded(r.rSquared)}${r.adjRSquared !== undefined ? `, adjusted R² = ${bounded(r.adjRSquared)}` : ''}`);
  }
  return out;
}
