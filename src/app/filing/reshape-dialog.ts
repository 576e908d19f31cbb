import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import type { DatasetPreview, ReshapeBody } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { splitLevels } from './filing-draft';
import { FilingService } from './filing-service';

/** What the reshape dialog needs. */
export interface ReshapeDialogData {
  requestId: string;
  dataset: DatasetPreview;
}

/** Builds the reshape body from the dialog's fields; measure columns keep the order they were picked in. */
export function reshapeBody(v: { subjectColumn: string; measureColumns: string[]; factorName: string; valueName: string; levels: string; keepColumns: string[] }): ReshapeBody {
  const body: ReshapeBody = { subjectColumn: v.subjectColumn, measureColumns: v.measureColumns, factorName: v.factorName.trim(), valueName: v.valueName.trim() };
  const levels = splitLevels(v.levels);
  if (levels.length) body.levels = levels;
  if (v.keepColumns.length) body.keepColumns = v.keepColumns;
  return body;
}

/** Turns a wide repeated-measures file (one column per time or condition) into a long one, as a new dataset. */
@Component({
  selector: 'as-reshape-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  template: `
    <h2 mat-dialog-title>Reshape wide to long</h2>
    <mat-dialog-content>
      <p>Use this when each person is one row and each time or condition is its own column. Assayer keeps your file and adds a long copy with one row per person and measurement.</p>
      <form [formGroup]="form" id="reshape-form" (ngSubmit)="reshape()" class="form" novalidate>
        <mat-form-field appearance="outline">
          <mat-label>Subject column</mat-label>
          <mat-select formControlName="subjectColumn" required>
            @for (c of columns; track c) { <mat-option [value]="c">{{ c }}</mat-option> }
          </mat-select>
          @if (form.controls.subjectColumn.hasError('required')) { <mat-error>Choose the column that identifies each person.</mat-error> }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Measurement columns, in order</mat-label>
          <mat-select formControlName="measureColumns" multiple required (selectionChange)="keepPickOrder($event.value)">
            @for (c of columns; track c) { <mat-option [value]="c">{{ c }}</mat-option> }
          </mat-select>
          <mat-hint>Order: {{ form.controls.measureColumns.value.join(' → ') || 'pick at least two' }}</mat-hint>
          @if (form.controls.measureColumns.invalid) { <mat-error>Pick at least two measurement columns.</mat-error> }
        </mat-form-field>
        <div class="two">
          <mat-form-field appearance="outline">
            <mat-label>New factor name</mat-label>
            <input matInput formControlName="factorName" placeholder="wave" autocomplete="off" />
            @if (form.controls.factorName.invalid) { <mat-error>Name the new factor, e.g. wave.</mat-error> }
          </mat-form-field>
          <mat-form-field appearance="outline">
            <mat-label>New value name</mat-label>
            <input matInput formControlName="valueName" placeholder="belonging" autocomplete="off" />
            @if (form.controls.valueName.invalid) { <mat-error>Name the measured value, e.g. belonging.</mat-error> }
          </mat-form-field>
        </div>
        <mat-form-field appearance="outline">
          <mat-label>Level labels (optional)</mat-label>
          <input matInput formControlName="levels" autocomplete="off" />
          <mat-hint>One per measurement column, separated by commas; the column names are used otherwise.</mat-hint>
          @if (form.controls.levels.hasError('count')) { <mat-error>Give one label per measurement column, or none.</mat-error> }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Other columns to carry along (optional)</mat-label>
          <mat-select formControlName="keepColumns" multiple>
            @for (c of columns; track c) { <mat-option [value]="c">{{ c }}</mat-option> }
          </mat-select>
          <mat-hint>Grouping columns such as campus or cohort, repeated on each long row.</mat-hint>
        </mat-form-field>
        <p class="err" aria-live="assertive">{{ error() }}</p>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="submit" form="reshape-form" [disabled]="busy()">{{ busy() ? 'Reshaping…' : 'Reshape' }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    .form { display: flex; flex-direction: column; gap: 6px; min-width: min(560px, 80vw); }
    .two { display: grid; grid-template-columns: 1fr 1fr; gap: 10px; }
    .err { color: var(--mat-sys-error); margin: 0; min-height: 20px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReshapeDialog {
  private readonly data = inject<ReshapeDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<ReshapeDialog, DatasetPreview>>(MatDialogRef);
  private readonly api = inject(FilingService);

  protected readonly columns = this.data.dataset.columns.map((c) => c.name);
  protected readonly busy = signal(false);
  protected readonly error = signal('');
  private order: string[] = [];
  protected readonly form = new FormGroup({
    subjectColumn: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    measureColumns: new FormControl<string[]>([], { nonNullable: true, validators: [(c) => ((c.value as string[]).length >= 2 ? null : { few: true })] }),
    factorName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.pattern(/\S/)] }),
    valueName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.pattern(/\S/)] }),
    levels: new FormControl('', { nonNullable: true }),
    keepColumns: new FormControl<string[]>([], { nonNullable: true }),
  });

  /** mat-select reports options in list order; keep the order the person clicked them in. */
  protected keepPickOrder(picked: string[]): void {
    this.order = [...this.order.filter((c) => picked.includes(c)), ...picked.filter((c) => !this.order.includes(c))];
    this.form.controls.measureColumns.setValue(this.order, { emitEvent: false });
  }

  /** Sends the reshape and closes with the new dataset. */
  protected async reshape(): Promise<void> {
    const v = this.form.getRawValue();
    const levels = splitLevels(v.levels);
    if (levels.length && levels.length !== v.measureColumns.length) this.form.controls.levels.setErrors({ count: true });
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set('');
    try {
      this.ref.close(await firstValueFrom(this.api.reshape(this.data.requestId, this.data.dataset.id, reshapeBody(v))));
    } catch (err) {
      this.error.set(toApiProblem(err).message);
      this.busy.set(false);
    }
  }
}
