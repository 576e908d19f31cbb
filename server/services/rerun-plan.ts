/**
 * The engine plan a rerun runs: the request's filed plan (the filing form's PlanDraft, or an
 * engine plan for requests filed before the form existed) with the reported results, and
 * the reviewer's override merged over it and checked by the engine's own plan schema.
 */
import type { PlanDraft } from '../../shared/api/workflow';
import { planProblems, toEnginePlan } from '../../shared/review/plan-mapping';
import type { AnalysisPlan, ReportedInput } from '../../shared/stats/contract';
import { planProblem } from '../../shared/stats/plan-schema';
import { badRequest, HttpError } from '../middleware/errors';
import type { ReviewRequest } from '../models/index';

/** True when the stored plan is the filing form's draft rather than an engine plan. */
export const isPlanDraft = (plan: unknown): plan is PlanDraft =>
  typeof plan === 'object' && plan !== null && 'designKind' in plan && !('design' in plan);

/** The plan draft of a request, when it was filed through the form. */
export const planDraftOf = (r: ReviewRequest): PlanDraft | null => (isPlanDraft(r.plan) ? r.plan : null);

function reportedOf(r: ReviewRequest): ReportedInput[] {
  const rep = r.reported as unknown;
  if (!Array.isArray(rep)) return [];
  return rep.filter((x): x is ReportedInput => typeof x === 'object' && x !== null && typeof (x as ReportedInput).text === 'string');
}

/** The engine plan as filed; 422 when the request has no usable plan. */
export function filedEnginePlan(r: ReviewRequest): AnalysisPlan {
  const stored = r.plan as unknown;
  if (!stored || typeof stored !== 'object') throw new HttpError(422, 'no-plan', 'The request has no analysis plan yet, so there is nothing to rerun.');
  const reported = reportedOf(r);
  if (isPlanDraft(stored)) {
    const problems = planProblems(stored);
    const first = Object.entries(problems)[0];
    if (first) throw new HttpError(422, 'invalid-plan', `The filed plan is incomplete: ${first[1]}`, problems);
    return toEnginePlan(stored, reported);
  }
  const plan = { ...(stored as AnalysisPlan) };
  const texts = reported.filter((x) => x.text.trim() !== '');
  if (!plan.reported && texts.length) plan.reported = texts.map((x) => ({ ...x }));
  return plan;
}

/**
 * Merges the override over the plan (a null value removes the field) and validates the
 * result; a 400 names the field at fault, as "planOverride.<field>" when the override set it.
 */
export function mergePlan(base: AnalysisPlan, override: Record<string, unknown> | undefined): AnalysisPlan {
  const merged: Record<string, unknown> = { ...base };
  for (const [k, v] of Object.entries(override ?? {})) {
    if (v === null) delete merged[k];
    else merged[k] = v;
  }
  const problem = planProblem(merged);
  if (problem) {
    const top = /^plan\.(\w+)/.exec(problem.field)?.[1];
    const field = top && override && top in override ? problem.field.replace(/^plan\./, 'planOverride.') : problem.field;
    throw badRequest(`The adjusted plan cannot be run: ${problem.message}`, { [field]: problem.message });
  }
  return merged as unknown as AnalysisPlan;
}
