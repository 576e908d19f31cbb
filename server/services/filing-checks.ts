/**
 * The checks a request must pass before it is filed: purpose fields, the plan, the data
 * (present, not blocked by identifiers, holding the plan's columns and levels), the
 * reported strings, and a dry run of the engine. Problems are plain words keyed by form field.
 */
import { reportedSchema } from '../../shared/api/filing-schemas';
import type { PlanDraft } from '../../shared/api/workflow';
import { planProblems, toEnginePlan } from '../../shared/review/plan-mapping';
import { parseReported } from '../../shared/stats/apa/parse';
import { InputError, type ReportedInput } from '../../shared/stats/contract';
import type { Dataset, ReviewRequest } from '../models/index';
import { datasetBytes, isBlocked, readerName } from './datasets';
import { runInWorker } from '../engine-worker/run-in-worker';

/** Field → message. */
export type Problems = Record<string, string>;

/** The stored reported results, dropping entries without text. */
export function storedReported(raw: unknown): ReportedInput[] {
  const parsed = reportedSchema.safeParse(raw ?? []);
  return parsed.success ? parsed.data.filter((x) => x.text.trim() !== '') : [];
}

/** Purpose fields that must be filled in before filing. */
export function purposeProblems(r: ReviewRequest): Problems {
  const out: Problems = {};
  if (!r.title.trim()) out['title'] = 'Give the request a title.';
  if (!r.purpose.trim()) out['purpose'] = 'Describe the purpose of the analysis.';
  if (!r.decisionInformed.trim()) out['decisionInformed'] = 'Say which decision the analysis informs.';
  if (!r.samplingNotes.trim()) out['samplingNotes'] = 'Describe how the sample was drawn and how observations were collected (the reviewer judges independence from this).';
  return out;
}

/** Every column the plan names, with the form field it comes from. */
export function planColumns(p: PlanDraft): { field: string; column: string; levels?: string[] }[] {
  const out: { field: string; column: string; levels?: string[] }[] = [];
  if (p.outcome) out.push({ field: 'plan.outcome', column: p.outcome });
  p.between.forEach((f, i) => out.push({ field: `plan.between.${i}`, column: f.column, levels: f.levels }));
  p.within.forEach((f, i) => out.push({ field: `plan.within.${i}`, column: f.column, levels: f.levels }));
  if (p.subject) out.push({ field: 'plan.subject', column: p.subject });
  if (p.designKind === 'regression') p.predictors.forEach((c, i) => out.push({ field: `plan.predictors.${i}`, column: c }));
  return out;
}

/** Distinct values of the named columns of a table (for checking listed factor levels). */
export function distinctValues(table: { header: string[]; columns: string[][] }, columns: string[]): Map<string, Set<string>> {
  const m = new Map<string, Set<string>>();
  for (const c of columns) {
    const i = table.header.indexOf(c);
    if (i >= 0) m.set(c, new Set(table.columns[i].map((v) => v.trim())));
  }
  return m;
}

/** The plan's columns and listed factor levels checked against the data's profiles and values. */
export function dataProblems(p: PlanDraft, d: Dataset, values: Map<string, Set<string>>): Problems {
  const out: Problems = {};
  const profiles = d.profiles ?? [];
  const names = profiles.map((c) => c.name);
  for (const { field, column, levels } of planColumns(p)) {
    const prof = profiles.find((c) => c.name === column);
    if (!prof) {
      out[field] = `Column "${column}" is not in the data file ${d.filename} (its columns: ${names.join(', ')}).`;
      continue;
    }
    if ((field === 'plan.outcome' || field.startsWith('plan.predictors')) && prof.kind !== 'numeric') {
      out[field] = prof.kind === 'empty'
        ? `Column "${column}" is empty in the data file.`
        : `Column "${column}" does not hold numbers (values such as ${prof.examples.slice(0, 3).map((e) => `"${e}"`).join(', ')}).`;
    }
    if (levels?.length) {
      const seen = values.get(column) ?? new Set<string>();
      const missing = levels.filter((l) => !seen.has(l));
      if (missing.length) {
        out[`${field}.levels`] = `${missing.length > 1 ? 'Levels' : 'Level'} ${missing.map((l) => `"${l}"`).join(', ')} of "${column}" ${missing.length > 1 ? 'do' : 'does'} not occur in the data (it has ${[...seen].slice(0, 10).map((l) => `"${l}"`).join(', ')}).`;
      }
    }
  }
  return out;
}

/** Reporting strings that cannot be read, keyed reported.<index in the stored list>. */
export function reportedProblems(raw: unknown): Problems {
  const out: Problems = {};
  const parsed = reportedSchema.safeParse(raw ?? []);
  if (!parsed.success) return { reported: 'The reported results are not in the expected form; enter them again.' };
  parsed.data.forEach((x, i) => {
    if (x.text.trim() === '') return;
    const p = parseReported(x.text);
    if (!p.ok) out[`reported.${i}`] = `Could not read "${x.text}": ${p.message}. Write it as usual, e.g. "t(28) = 2.10, p = .045" or "F(2, 57) = 4.31, p = .018".`;
  });
  return out;
}

/** The form field an engine InputError belongs to. */
export function fieldOfEngineError(err: InputError, p: PlanDraft): string {
  const f = err.field;
  const rep = /^plan\.reported(?:\.(\d+))?/.exec(f);
  if (rep) return rep[1] ? `reported.${rep[1]}` : 'reported';
  if (f.startsWith('plan.')) {
    const key = f.split('.').slice(0, 2).join('.');
    return key === 'plan.design' ? 'plan.designKind' : key;
  }
  const col = /^column (.+)$/.exec(f);
  if (col) {
    const named = col[1].split(', ');
    const hit = planColumns(p).find((c) => named.includes(c.column));
    if (hit) return hit.field;
  }
  return 'dataset';
}

/** Runs the engine on the plan and data in a worker; an InputError becomes a field problem. */
export async function dryRunProblems(p: PlanDraft, reported: ReportedInput[], d: Dataset): Promise<Problems> {
  try {
    // A dry run in a worker thread, like every rerun: never on the request thread.
    await runInWorker({ plan: toEnginePlan(p, reported), data: await datasetBytes(d), filename: readerName(d.format ?? null, d.filename) }, undefined, 2 * 60_000);
    return {};
  } catch (err) {
    if (err instanceof InputError) {
      const msg = err.message.charAt(0).toUpperCase() + err.message.slice(1);
      return { [fieldOfEngineError(err, p)]: `The analysis cannot run on these data: ${msg}` };
    }
    throw err;
  }
}

/** All problems short of the dry run, in form order. */
export function staticProblems(r: ReviewRequest, p: PlanDraft | null, d: Dataset | null, values: Map<string, Set<string>>): Problems {
  const out: Problems = { ...purposeProblems(r) };
  if (!p) out['plan.designKind'] = r.plan ? 'The saved plan could not be read; fill in the design step again.' : 'Describe the analysis plan: choose the kind of design.';
  else Object.assign(out, planProblems(p));
  if (!d) out['dataset'] = 'Upload the data file the analysis uses (CSV or .xlsx).';
  else {
    if (isBlocked(d)) {
      const confirmed = new Set((d.identifierConfirmations ?? []).map((c) => c.column));
      const open = (d.identifierFindings ?? []).filter((f) => !confirmed.has(f.column));
      out['dataset'] = `The data seem to hold direct identifiers: ${open.map((f) => f.reason).join(' ')} Remove ${open.length > 1 ? 'these columns' : 'the column'} and upload the file again, or confirm why ${open.length > 1 ? 'they are' : 'it is'} needed.`;
    }
    if (p) for (const [k, v] of Object.entries(dataProblems(p, d, values))) out[k] ??= v;
  }
  Object.assign(out, reportedProblems(r.reported));
  return out;
}
