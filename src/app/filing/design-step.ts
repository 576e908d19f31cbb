import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { DESIGN_KINDS, type DesignKind } from '../../../shared/api/types';
import type { ColumnProfile } from '../../../shared/api/workflow';
import { COMPARISON_METHODS } from '../../../shared/stats/contract';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import { ColumnField } from './column-field';
import { controlMessage } from './field-problems';
import { comparisonForm, factorForm, type FactorForm, type FilingForm } from './filing-form';
import { DESIGN_KIND_HINTS, DESIGN_USES, METHOD_LABELS } from './plan-texts';

/** Step 2: the analysis plan in the submitter's words, with what each design kind still needs shown beside the fields. */
@Component({
  selector: 'as-design-step',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule, MatSelectModule, ColumnField],
  templateUrl: './design-step.html',
  styleUrl: './design-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignStep {
  /** The design part of the filing form. */
  readonly group = input.required<FilingForm['controls']['design']>();
  /** Columns of the current dataset (empty before an upload). */
  readonly columns = input<ColumnProfile[]>([]);
  /** Problems keyed like "plan.outcome" (plan check and server). */
  readonly problems = input<Record<string, string>>({});

  protected readonly kinds = DESIGN_KINDS;
  protected readonly kindLabels = DESIGN_KIND_LABELS;
  protected readonly kindHints = DESIGN_KIND_HINTS;
  protected readonly methods = COMPARISON_METHODS;
  protected readonly methodLabels = METHOD_LABELS;
  protected readonly message = controlMessage;
  protected readonly factorKinds = ['between', 'within'] as const;

  /** The factor rows of one kind. */
  protected rows(kind: 'between' | 'within'): FactorForm[] {
    return this.group().controls[kind].controls;
  }

  /** What the chosen design kind uses (everything hidden until a kind is chosen). */
  protected uses(kind: DesignKind | null) {
    return kind ? DESIGN_USES[kind] : null;
  }

  /** Names of the factor columns in the plan, for the comparisons' factor choice. */
  protected factorNames(): string[] {
    const g = this.group().controls;
    return [...g.between.controls, ...g.within.controls].map((f) => f.controls.column.value).filter((c) => c !== '');
  }

  /** Problem text for a plan key. */
  protected problem(key: string): string {
    return this.problems()[key] ?? '';
  }

  /** Adds an empty factor row. */
  protected addFactor(kind: 'between' | 'within'): void {
    this.group().controls[kind].push(factorForm());
  }

  /** Removes a factor row. */
  protected removeFactor(kind: 'between' | 'within', i: number): void {
    this.group().controls[kind].removeAt(i);
  }

  /** Copies the levels found in the data into the factor's levels, when the data shows them all. */
  protected fillLevels(f: FactorForm): void {
    const col = this.columns().find((c) => c.name === f.controls.column.value);
    if (col && col.distinct <= col.examples.length) f.controls.levels.setValue(col.examples.join(', '));
  }

  /** True when the data shows every level of the factor's column. */
  protected canFillLevels(f: FactorForm): boolean {
    const col = this.columns().find((c) => c.name === f.controls.column.value);
    return !!col && col.distinct > 0 && col.distinct <= col.examples.length;
  }

  /** Adds a planned comparison row. */
  protected addComparison(): void {
    this.group().controls.comparisons.push(comparisonForm(this.factorNames()[0] ?? ''));
  }

  /** Removes a comparison row. */
  protected removeComparison(i: number): void {
    this.group().controls.comparisons.removeAt(i);
  }

  /** Sets predictors from typed text (used before any data exists). */
  protected setPredictorsText(text: string): void {
    this.group().controls.predictors.setValue(text.split(',').map((t) => t.trim()).filter((t) => t !== ''));
  }
}
