import { FormArray, FormControl, FormGroup, Validators } from '@angular/forms';
import { requestCreateSchema } from '../../../shared/api/schemas';
import type { DesignKind } from '../../../shared/api/types';
import type { ComparisonMethod } from '../../../shared/stats/contract';
import { zodValidator } from './zod-validator';

/** One factor row: its column and the expected levels as typed ("control, pilot"). */
export type FactorForm = FormGroup<{ column: FormControl<string>; levels: FormControl<string> }>;
/** One planned comparison row. */
export type ComparisonForm = FormGroup<{ factor: FormControl<string>; method: FormControl<ComparisonMethod> }>;
/** One reported result line. */
export type ReportedForm = FormGroup<{ term: FormControl<string>; text: FormControl<string> }>;

const s = requestCreateSchema.shape;

/** Builds the purpose step's controls, validated by the shared request schema. */
function purposeGroup() {
  return new FormGroup({
    title: new FormControl('', { nonNullable: true, validators: [zodValidator(s.title)] }),
    purpose: new FormControl('', { nonNullable: true, validators: [zodValidator(s.purpose)] }),
    decisionInformed: new FormControl('', { nonNullable: true, validators: [zodValidator(s.decisionInformed)] }),
    audience: new FormControl('', { nonNullable: true, validators: [zodValidator(s.audience)] }),
    deadline: new FormControl<Date | null>(null),
    departmentId: new FormControl<string | null>(null),
  });
}

/** Builds the design step's controls. */
function designGroup(alpha: number) {
  return new FormGroup({
    designKind: new FormControl<DesignKind | null>(null),
    outcome: new FormControl('', { nonNullable: true }),
    between: new FormArray<FactorForm>([]),
    within: new FormArray<FactorForm>([]),
    subject: new FormControl('', { nonNullable: true }),
    predictors: new FormControl<string[]>([], { nonNullable: true }),
    mu: new FormControl<number | null>(null),
    alpha: new FormControl(alpha, { nonNullable: true, validators: [Validators.min(0.0001), Validators.max(0.5)] }),
    comparisons: new FormArray<ComparisonForm>([]),
    submitterCorrection: new FormControl<ComparisonMethod | 'none' | null>(null),
    samplingNotes: new FormControl('', { nonNullable: true, validators: [zodValidator(s.samplingNotes)] }),
  });
}

/** The whole filing form: purpose, design and reported results (the data step works on uploads). */
export function createFilingForm(alpha = 0.05) {
  return new FormGroup({
    purpose: purposeGroup(),
    design: designGroup(alpha),
    reported: new FormArray<ReportedForm>([]),
  });
}
/** Type of {@link createFilingForm}'s result. */
export type FilingForm = ReturnType<typeof createFilingForm>;

/** A new factor row. */
export function factorForm(column = '', levels = ''): FactorForm {
  return new FormGroup({ column: new FormControl(column, { nonNullable: true }), levels: new FormControl(levels, { nonNullable: true }) });
}

/** A new comparison row. */
export function comparisonForm(factor = '', method: ComparisonMethod = 'tukey'): ComparisonForm {
  return new FormGroup({ factor: new FormControl(factor, { nonNullable: true }), method: new FormControl<ComparisonMethod>(method, { nonNullable: true }) });
}

/** A new reported-result line. */
export function reportedForm(text = '', term = ''): ReportedForm {
  return new FormGroup({ term: new FormControl(term, { nonNullable: true }), text: new FormControl(text, { nonNullable: true }) });
}
