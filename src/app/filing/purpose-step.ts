import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { DepartmentRef } from '../../../shared/api/types';
import { controlMessage } from './field-problems';
import type { FilingForm } from './filing-form';

/** Step 1: what the analysis is for, who reads it and by when. */
@Component({
  selector: 'as-purpose-step',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatDatepickerModule],
  providers: [provideNativeDateAdapter()],
  template: `
    @let c = group().controls;
    <div [formGroup]="group()" class="purpose">
      <mat-form-field appearance="outline" class="wide" data-field="title">
        <mat-label>Title</mat-label>
        <input matInput formControlName="title" required autocomplete="off" />
        <mat-hint>A short name the office will use, e.g. "Peer mentoring and first-year retention".</mat-hint>
        @if (message(c.title)) { <mat-error>{{ message(c.title) }}</mat-error> }
      </mat-form-field>
      <mat-form-field appearance="outline" class="wide" data-field="purpose">
        <mat-label>Purpose of the analysis</mat-label>
        <textarea matInput formControlName="purpose" rows="3"></textarea>
        <mat-hint>The question the analysis answers.</mat-hint>
        @if (message(c.purpose)) { <mat-error>{{ message(c.purpose) }}</mat-error> }
      </mat-form-field>
      <mat-form-field appearance="outline" class="wide" data-field="decisionInformed">
        <mat-label>Decision the analysis informs</mat-label>
        <textarea matInput formControlName="decisionInformed" rows="2"></textarea>
        <mat-hint>What will be decided with it, e.g. "whether to extend the pilot to all campuses".</mat-hint>
        @if (message(c.decisionInformed)) { <mat-error>{{ message(c.decisionInformed) }}</mat-error> }
      </mat-form-field>
      <div class="row">
        <mat-form-field appearance="outline" data-field="audience">
          <mat-label>Audience</mat-label>
          <input matInput formControlName="audience" autocomplete="off" />
          <mat-hint>Who reads the results, e.g. Academic Council.</mat-hint>
          @if (message(c.audience)) { <mat-error>{{ message(c.audience) }}</mat-error> }
        </mat-form-field>
        <mat-form-field appearance="outline" data-field="deadline">
          <mat-label>Your deadline</mat-label>
          <input matInput [matDatepicker]="picker" formControlName="deadline" />
          <mat-hint>Type the date or use the calendar.</mat-hint>
          <mat-datepicker-toggle matIconSuffix [for]="picker" />
          <mat-datepicker #picker />
          @if (message(c.deadline)) { <mat-error>{{ message(c.deadline) }}</mat-error> }
        </mat-form-field>
        <mat-form-field appearance="outline" data-field="departmentId">
          <mat-label>Department</mat-label>
          <mat-select formControlName="departmentId">
            <mat-option [value]="null">— none —</mat-option>
            @for (d of departments(); track d.id) { <mat-option [value]="d.id">{{ d.name }}</mat-option> }
          </mat-select>
          @if (departmentsFailed()) { <mat-hint>The department list could not be loaded; your other fields still save.</mat-hint> }
          @if (message(c.departmentId)) { <mat-error>{{ message(c.departmentId) }}</mat-error> }
        </mat-form-field>
      </div>
    </div>
  `,
  styles: `
    .purpose { display: flex; flex-direction: column; gap: 8px; }
    .wide { width: 100%; }
    .row { display: grid; grid-template-columns: repeat(auto-fill, minmax(240px, 1fr)); gap: 12px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PurposeStep {
  /** The purpose part of the filing form. */
  readonly group = input.required<FilingForm['controls']['purpose']>();
  /** Departments of the office. */
  readonly departments = input<DepartmentRef[]>([]);
  /** True when GET /api/departments failed. */
  readonly departmentsFailed = input(false);
  protected readonly message = controlMessage;
}
