import type { DepartmentRef, DesignKind, RequestDetail } from '../../../shared/api/types';
import type { PlanDraft } from '../../../shared/api/workflow';
import type { ReportedInput } from '../../../shared/stats/contract';
import { emptyPlanDraft } from '../../../shared/review/plan-mapping';
import { comparisonForm, factorForm, reportedForm, type FilingForm } from './filing-form';

/** Everything the filing form saves (PATCH /api/requests/:id without the version). */
export interface DraftFields {
  title: string;
  purpose: string;
  decisionInformed: string;
  audience: string;
  samplingNotes: string;
  deadline: string | null;
  departmentId: string | null;
  designKind: DesignKind | null;
  plan: PlanDraft;
  reported: ReportedInput[];
}

/** Body of PATCH /api/requests/:id: the changed fields and the version last read. */
export type DraftPatch = Partial<DraftFields> & { version: number };

/** A request detail as the server may send it to its submitter: the plan as the form saved it, plus reported results. */
export type DraftDetail = RequestDetail & { reported?: ReportedInput[] | null; departmentId?: string | null };

/** Writes a Date as YYYY-MM-DD in local time (what the person picked on the calendar). */
export function isoDay(d: Date | null): string | null {
  if (!d || Number.isNaN(d.getTime())) return null;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** Splits typed levels "control, pilot" into a list. */
export function splitLevels(text: string): string[] {
  return text.split(',').map((l) => l.trim()).filter((l) => l !== '');
}

/** The plan as the form currently holds it. */
export function planFromForm(form: FilingForm): PlanDraft {
  const d = form.controls.design.getRawValue();
  const factors = (rows: { column: string; levels: string }[]) =>
    rows.filter((f) => f.column.trim() !== '').map((f) => ({ column: f.column.trim(), levels: splitLevels(f.levels) }));
  const plan: PlanDraft = {
    designKind: d.designKind,
    outcome: d.outcome.trim() || null,
    between: factors(d.between),
    within: factors(d.within),
    subject: d.subject.trim() || null,
    predictors: d.predictors,
    alpha: Number(d.alpha),
    comparisons: d.comparisons.filter((c) => c.factor.trim() !== '').map((c) => ({ factor: c.factor.trim(), method: c.method })),
    submitterCorrection: d.submitterCorrection,
  };
  if (d.designKind === 'one-sample') plan.mu = d.mu === null || (d.mu as unknown) === '' ? null : Number(d.mu);
  return plan;
}

/** Everything the form saves, read from the form. */
export function fieldsFromForm(form: FilingForm): DraftFields {
  const p = form.controls.purpose.getRawValue();
  const plan = planFromForm(form);
  return {
    title: p.title.trim(),
    purpose: p.purpose,
    decisionInformed: p.decisionInformed,
    audience: p.audience,
    samplingNotes: form.controls.design.controls.samplingNotes.value,
    deadline: isoDay(p.deadline),
    departmentId: p.departmentId,
    designKind: plan.designKind,
    plan,
    reported: form.controls.reported.getRawValue().filter((r) => r.text.trim() !== '').map((r) => (r.term.trim() ? { term: r.term.trim(), text: r.text.trim() } : { text: r.text.trim() })),
  };
}

/** The fields that differ between two saves (compared as JSON), so a PATCH carries only what changed. */
export function changedFields(before: DraftFields | null, after: DraftFields): Partial<DraftFields> {
  if (!before) return { ...after };
  const out: Partial<DraftFields> = {};
  for (const key of Object.keys(after) as (keyof DraftFields)[]) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) (out as Record<string, unknown>)[key] = after[key];
  }
  return out;
}

/** Reads a stored plan loosely: the form's own shape, or defaults for anything missing. */
export function planFromDetail(raw: Record<string, unknown> | null, alpha: number): PlanDraft {
  const base = emptyPlanDraft(alpha);
  if (!raw) return base;
  const r = raw as Partial<PlanDraft> & { between?: unknown[]; within?: unknown[] };
  const factors = (list: unknown[] | undefined) =>
    (list ?? []).map((f) => (typeof f === 'string' ? { column: f, levels: [] } : (f as PlanDraft['between'][number])));
  return {
    ...base,
    ...r,
    between: factors(r.between),
    within: factors(r.within),
    predictors: Array.isArray(r.predictors) ? r.predictors : [],
    comparisons: Array.isArray(r.comparisons) ? r.comparisons : [],
    alpha: typeof r.alpha === 'number' ? r.alpha : alpha,
  };
}

/** Fills the form from a loaded request without marking it as changed by the person. */
export function fillForm(form: FilingForm, r: DraftDetail, departments: DepartmentRef[], alpha: number): void {
  const dept = r.departmentId ?? departments.find((d) => d.name === r.department)?.id ?? null;
  form.controls.purpose.setValue({
    title: r.title, purpose: r.purpose ?? '', decisionInformed: r.decisionInformed ?? '', audience: r.audience ?? '',
    deadline: r.deadline ? new Date(`${r.deadline}T00:00:00`) : null, departmentId: dept,
  }, { emitEvent: false });
  const plan = planFromDetail(r.plan, alpha);
  const d = form.controls.design.controls;
  d.designKind.setValue(plan.designKind ?? r.designKind ?? null, { emitEvent: false });
  d.outcome.setValue(plan.outcome ?? '', { emitEvent: false });
  d.subject.setValue(plan.subject ?? '', { emitEvent: false });
  d.predictors.setValue(plan.predictors, { emitEvent: false });
  d.mu.setValue(plan.mu ?? null, { emitEvent: false });
  d.alpha.setValue(plan.alpha, { emitEvent: false });
  d.submitterCorrection.setValue(plan.submitterCorrection ?? null, { emitEvent: false });
  d.samplingNotes.setValue(r.samplingNotes ?? '', { emitEvent: false });
  d.between.clear({ emitEvent: false });
  plan.between.forEach((f) => d.between.push(factorForm(f.column, f.levels.join(', ')), { emitEvent: false }));
  d.within.clear({ emitEvent: false });
  plan.within.forEach((f) => d.within.push(factorForm(f.column, f.levels.join(', ')), { emitEvent: false }));
  d.comparisons.clear({ emitEvent: false });
  plan.comparisons.forEach((c) => d.comparisons.push(comparisonForm(c.factor, c.method), { emitEvent: false }));
  form.controls.reported.clear({ emitEvent: false });
  (r.reported ?? []).forEach((x) => form.controls.reported.push(reportedForm(x.text, x.term ?? ''), { emitEvent: false }));
  form.updateValueAndValidity({ emitEvent: false });
}
