/**
 * Turns the filing form's plan (PlanDraft, in the submitter's vocabulary of design
 * kinds) into the engine's AnalysisPlan, and names what is missing in plain words.
 */
import type { AnalysisPlan, Design, ReportedInput } from '../stats/contract';
import type { PlanDraft } from '../api/workflow';
import type { DesignKind } from '../api/types';

/** Engine design for each design kind the submitter can pick. */
export const ENGINE_DESIGN: Record<DesignKind, Design> = {
  'one-sample': 'one-sample',
  'two-independent': 'independent',
  paired: 'paired',
  'between-anova': 'anova',
  'repeated-measures': 'anova',
  mixed: 'anova',
  regression: 'regression',
};

/** Human labels for design kinds (our vocabulary). */
export const DESIGN_KIND_LABELS: Record<DesignKind, string> = {
  'one-sample': 'One sample',
  'two-independent': 'Two independent groups',
  paired: 'Paired (two conditions, same subjects)',
  'between-anova': 'Between-subjects ANOVA',
  'repeated-measures': 'Repeated measures',
  mixed: 'Mixed (between and within factors)',
  regression: 'Regression',
};

/** What each design kind needs, checked before the plan goes to the engine. */
export function planProblems(p: PlanDraft): Record<string, string> {
  const out: Record<string, string> = {};
  if (!p.designKind) {
    out['plan.designKind'] = 'Choose the kind of design.';
    return out;
  }
  if (!p.outcome) out['plan.outcome'] = 'Choose the outcome column.';
  if (!(p.alpha > 0 && p.alpha < 0.5)) out['plan.alpha'] = 'Alpha must be between 0 and 0.5 (usually 0.05).';
  const k = p.designKind;
  if (k === 'two-independent' && p.between.length !== 1) out['plan.between'] = 'Two independent groups need exactly one grouping column.';
  if (k === 'between-anova' && p.between.length < 1) out['plan.between'] = 'A between-subjects ANOVA needs at least one factor.';
  if ((k === 'paired' || k === 'repeated-measures' || k === 'mixed') && !p.subject) out['plan.subject'] = 'Choose the column that identifies each subject.';
  if (k === 'paired' && p.within.length !== 1) out['plan.within'] = 'A paired design needs exactly one column naming the two conditions.';
  if (k === 'repeated-measures' && p.within.length < 1) out['plan.within'] = 'Repeated measures need at least one within-subjects factor.';
  if (k === 'repeated-measures' && p.between.length > 0) out['plan.between'] = 'Repeated measures with a between-subjects factor is a mixed design: choose "Mixed".';
  if (k === 'mixed' && (p.between.length < 1 || p.within.length < 1)) out['plan.within'] = 'A mixed design needs at least one between-subjects and one within-subjects factor.';
  if (k === 'regression' && p.predictors.length < 1) out['plan.predictors'] = 'Choose at least one predictor column.';
  const factors = new Set([...p.between, ...p.within].map((f) => f.column));
  p.comparisons.forEach((c, i) => {
    if (!factors.has(c.factor)) out[`plan.comparisons.${i}`] = `Comparisons must be among the levels of a factor of the plan; "${c.factor}" is not one.`;
  });
  return out;
}

/** The engine plan for a draft; call planProblems first. */
export function toEnginePlan(p: PlanDraft, reported: ReportedInput[] = []): AnalysisPlan {
  if (!p.designKind || !p.outcome) throw new Error('The plan has no design kind or outcome.');
  const plan: AnalysisPlan = { design: ENGINE_DESIGN[p.designKind], outcome: p.outcome, alpha: p.alpha };
  if (p.between.length) plan.between = p.between.map((f) => f.column);
  if (p.within.length) plan.within = p.within.map((f) => f.column);
  if (p.subject && (p.within.length || p.designKind === 'paired')) plan.subject = p.subject;
  if (p.designKind === 'regression') plan.predictors = [...p.predictors];
  if (p.designKind === 'one-sample') {
    if (p.mu !== null && p.mu !== undefined) plan.mu = p.mu;
    if (p.sigma !== null && p.sigma !== undefined) plan.sigma = p.sigma;
  }
  if (p.ssType) plan.ssType = p.ssType;
  if (p.comparisons.length) plan.comparisons = p.comparisons.map((c) => ({ ...c }));
  const texts = reported.filter((r) => r.text.trim() !== '');
  if (texts.length) plan.reported = texts.map((r) => ({ ...r }));
  return plan;
}

/** An empty draft with the office's default alpha. */
export function emptyPlanDraft(alpha = 0.05): PlanDraft {
  return { designKind: null, outcome: null, between: [], within: [], subject: null, predictors: [], alpha, comparisons: [], submitterCorrection: null };
}
