import type { PlanDraft } from '../../../shared/api/workflow';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import { PlanLine, summarisePlan } from '../request-detail/plan-summary';
import { METHOD_LABELS } from '../results/result-text';

/**
 * Labelled lines for the plan on the review workspace. The request's plan is the filing
 * form's draft (with `designKind`); older records hold the engine shape, which the
 * request page's summary already reads.
 */
export function planLines(raw: Record<string, unknown> | null): PlanLine[] {
  if (!raw) return [];
  if (!('designKind' in raw)) return summarisePlan(raw);
  const p = raw as unknown as PlanDraft;
  const lines: PlanLine[] = [];
  if (p.designKind) lines.push({ label: 'Design', value: DESIGN_KIND_LABELS[p.designKind] ?? p.designKind });
  if (p.outcome) lines.push({ label: 'Outcome', value: p.outcome, mono: true });
  const factor = (f: { column: string; levels: string[] }) => (f.levels?.length ? `${f.column} (${f.levels.join(', ')})` : f.column);
  if (p.between?.length) lines.push({ label: 'Between-subjects factors', value: p.between.map(factor).join('; '), mono: true });
  if (p.within?.length) lines.push({ label: 'Within-subjects factors', value: p.within.map(factor).join('; '), mono: true });
  if (p.predictors?.length) lines.push({ label: 'Predictors', value: p.predictors.join(', '), mono: true });
  if (p.subject) lines.push({ label: 'Subject identifier', value: p.subject, mono: true });
  if (p.mu !== null && p.mu !== undefined) lines.push({ label: 'Hypothesised mean', value: String(p.mu), mono: true });
  lines.push({ label: 'Alpha', value: String(p.alpha ?? 0.05), mono: true });
  if (p.ssType) lines.push({ label: 'Sums of squares', value: `Type ${p.ssType}` });
  if (p.comparisons?.length) lines.push({ label: 'Planned comparisons', value: p.comparisons.map((c) => `${c.factor} (${METHOD_LABELS[c.method] ?? c.method})`).join('; ') });
  if (p.submitterCorrection) lines.push({ label: 'Correction the submitter used', value: p.submitterCorrection === 'none' ? 'None' : METHOD_LABELS[p.submitterCorrection] ?? p.submitterCorrection });
  if (p.familySize) lines.push({ label: 'Tests in the family', value: String(p.familySize), mono: true });
  return lines;
}
