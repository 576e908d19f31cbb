import type { AnalysisPlan } from '../../../shared/stats/contract';

/** One labelled line of a plan summary. */
export interface PlanLine {
  label: string;
  value: string;
  mono?: boolean;
}

const DESIGN_LABELS: Record<string, string> = {
  'one-sample': 'One sample',
  independent: 'Two independent groups',
  paired: 'Paired',
  anova: 'Analysis of variance',
  regression: 'Regression',
};

const METHOD_LABELS: Record<string, string> = {
  tukey: 'Tukey HSD',
  'games-howell': 'Games–Howell',
  bonferroni: 'Bonferroni',
  holm: 'Holm',
  bh: 'Benjamini–Hochberg',
};

/** Reads a stored plan (engine contract shape, checked loosely) into labelled lines for the detail page. */
export function summarisePlan(raw: Record<string, unknown> | null): PlanLine[] {
  if (!raw) return [];
  const plan = raw as Partial<AnalysisPlan>;
  const lines: PlanLine[] = [];
  if (typeof plan.design === 'string') lines.push({ label: 'Design', value: DESIGN_LABELS[plan.design] ?? plan.design });
  if (typeof plan.outcome === 'string') lines.push({ label: 'Outcome', value: plan.outcome, mono: true });
  if (plan.between?.length) lines.push({ label: 'Between-subjects factors', value: plan.between.join(', '), mono: true });
  if (plan.within?.length) lines.push({ label: 'Within-subjects factors', value: plan.within.join(', '), mono: true });
  if (plan.predictors?.length) lines.push({ label: 'Predictors', value: plan.predictors.join(', '), mono: true });
  if (typeof plan.subject === 'string') lines.push({ label: 'Subject identifier', value: plan.subject, mono: true });
  if (typeof plan.mu === 'number') lines.push({ label: 'Hypothesised mean', value: String(plan.mu), mono: true });
  lines.push({ label: 'Alpha', value: String(typeof plan.alpha === 'number' ? plan.alpha : 0.05), mono: true });
  if (plan.comparisons?.length) {
    const value = plan.comparisons.map((c) => `${c.factor} (${METHOD_LABELS[c.method] ?? c.method})`).join('; ');
    lines.push({ label: 'Planned comparisons', value });
  }
  if (plan.reported?.length) lines.push({ label: 'Reported results', value: plan.reported.map((r) => r.text).join(' · '), mono: true });
  return lines;
}
