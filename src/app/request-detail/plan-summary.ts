import type { DesignKind } from '../../../shared/api/types';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
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

/** A factor as stored: a column name (engine plan) or a column with its expected levels (filing form's plan). */
type StoredFactor = string | { column: string; levels?: string[] };

function factorText(list: StoredFactor[]): string {
  return list.map((f) => (typeof f === 'string' ? f : f.levels?.length ? `${f.column} (${f.levels.join(', ')})` : f.column)).join(', ');
}

/**
 * Reads a stored plan into labelled lines for the detail page. Accepts both the engine's
 * plan and the filing form's plan (design kind, factors with levels, correction used).
 */
export function summarisePlan(raw: Record<string, unknown> | null): PlanLine[] {
  if (!raw) return [];
  const plan = raw as Partial<Omit<AnalysisPlan, 'between' | 'within'>> & {
    between?: StoredFactor[]; within?: StoredFactor[]; designKind?: DesignKind | null; submitterCorrection?: string | null;
  };
  const lines: PlanLine[] = [];
  if (typeof plan.designKind === 'string') lines.push({ label: 'Design', value: DESIGN_KIND_LABELS[plan.designKind] ?? plan.designKind });
  else if (typeof plan.design === 'string') lines.push({ label: 'Design', value: DESIGN_LABELS[plan.design] ?? plan.design });
  if (typeof plan.outcome === 'string') lines.push({ label: 'Outcome', value: plan.outcome, mono: true });
  if (plan.between?.length) lines.push({ label: 'Between-subjects factors', value: factorText(plan.between), mono: true });
  if (plan.within?.length) lines.push({ label: 'Within-subjects factors', value: factorText(plan.within), mono: true });
  if (plan.predictors?.length) lines.push({ label: 'Predictors', value: plan.predictors.join(', '), mono: true });
  if (typeof plan.subject === 'string') lines.push({ label: 'Subject identifier', value: plan.subject, mono: true });
  if (typeof plan.mu === 'number') lines.push({ label: 'Hypothesised mean', value: String(plan.mu), mono: true });
  lines.push({ label: 'Alpha', value: String(typeof plan.alpha === 'number' ? plan.alpha : 0.05), mono: true });
  if (plan.comparisons?.length) {
    const value = plan.comparisons.map((c) => `${c.factor} (${METHOD_LABELS[c.method] ?? c.method})`).join('; ');
    lines.push({ label: 'Planned comparisons', value });
  }
  if (typeof plan.submitterCorrection === 'string') {
    lines.push({ label: 'Correction used', value: plan.submitterCorrection === 'none' ? 'None' : METHOD_LABELS[plan.submitterCorrection] ?? plan.submitterCorrection });
  }
  if (plan.reported?.length) lines.push({ label: 'Reported results', value: plan.reported.map((r) => r.text).join(' · '), mono: true });
  return lines;
}
