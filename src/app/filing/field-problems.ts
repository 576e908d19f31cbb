import type { AbstractControl } from '@angular/forms';
import type { FilingForm } from './filing-form';

/** Steps of the filing form, in order. */
export const FILING_STEPS = ['purpose', 'design', 'data', 'reported', 'review'] as const;

const PURPOSE_KEYS = ['title', 'purpose', 'decisionInformed', 'audience', 'deadline', 'departmentId'];

/** The step (index into {@link FILING_STEPS}) where the field named by an API key lives. */
export function stepOfField(key: string): number {
  const head = key.split('.')[0];
  if (PURPOSE_KEYS.includes(head)) return 0;
  if (head === 'plan' || head === 'designKind' || head === 'samplingNotes') return 1;
  if (head === 'dataset' || head === 'datasets' || head === 'identifiers') return 2;
  if (head === 'reported') return 3;
  return 4;
}

/** The first step that has a problem, or -1. */
export function firstProblemStep(problems: Record<string, string>): number {
  const steps = Object.keys(problems).map(stepOfField);
  return steps.length ? Math.min(...steps) : -1;
}

/**
 * The control an API key names, or null for keys about a whole group ("plan.between",
 * "dataset"). Reported lines are numbered among the non-empty lines, as they were saved.
 */
export function controlForField(form: FilingForm, key: string): AbstractControl | null {
  const parts = key.split('.');
  const p = form.controls.purpose.controls as Record<string, AbstractControl>;
  const d = form.controls.design.controls;
  if (parts.length === 1 && p[key]) return p[key];
  if (key === 'samplingNotes') return d.samplingNotes;
  if (key === 'designKind') return d.designKind;
  if (parts[0] === 'plan' && parts.length === 2) {
    const c = (d as Record<string, AbstractControl>)[parts[1]];
    return c && !('controls' in c && Array.isArray((c as { controls: unknown }).controls)) ? c : null;
  }
  if (parts[0] === 'plan' && parts[1] === 'comparisons' && parts.length >= 3) return d.comparisons.at(Number(parts[2]))?.controls.factor ?? null;
  if (parts[0] === 'reported' && parts.length >= 2) {
    const lines = form.controls.reported.controls.filter((r) => r.controls.text.value.trim() !== '');
    return lines[Number(parts[1])]?.controls.text ?? null;
  }
  return null;
}

/** Marks each named control with its server message (error key `server`); returns keys with no control. */
export function placeFieldProblems(form: FilingForm, problems: Record<string, string>): string[] {
  const unplaced: string[] = [];
  for (const [key, message] of Object.entries(problems)) {
    const c = controlForField(form, key);
    if (c) {
      c.setErrors({ ...(c.errors ?? {}), server: message });
      c.markAsTouched();
    } else unplaced.push(key);
  }
  return unplaced;
}

/** The message to show under a field: the local validation message, or the server's. */
export function controlMessage(c: AbstractControl | null | undefined): string {
  if (!c?.errors || !c.touched) return '';
  const e = c.errors;
  if (typeof e['server'] === 'string') return e['server'];
  if (typeof e['zod'] === 'string') return e['zod'];
  if (e['min'] || e['max']) return 'Alpha must be between 0 and 0.5 (usually 0.05).';
  return 'Check this value.';
}
