import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ColumnProfile } from '../../../shared/api/workflow';

const KIND_WORDS: Record<ColumnProfile['kind'], string> = { numeric: 'numbers', categorical: 'categories', 'identifier-like': 'identifier-like', empty: 'empty' };

/** A column choice: a dropdown of the uploaded data's columns, or free text before any data exists. */
@Component({
  selector: 'as-column-field',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <mat-form-field appearance="outline" class="field" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      @if (columns().length) {
        <mat-select [formControl]="control()">
          <mat-select-trigger><span class="as-mono">{{ control().value }}</span></mat-select-trigger>
          <mat-option value="">— none —</mat-option>
          @for (c of columns(); track c.name) {
            <mat-option [value]="c.name"><span class="as-mono">{{ c.name }}</span> <span class="kind">· {{ kindWord(c) }}</span></mat-option>
          }
          @if (unknown()) { <mat-option [value]="control().value">{{ control().value }} (not in the data)</mat-option> }
        </mat-select>
      } @else {
        <input matInput [formControl]="control()" autocomplete="off" spellcheck="false" />
      }
      @if (hint()) { <mat-hint>{{ hint() }}</mat-hint> }
      @if (error()) { <mat-error>{{ error() }}</mat-error> }
    </mat-form-field>
    @if (error() && !control().invalid) { <p class="problem" role="note">{{ error() }}</p> }
  `,
  styles: `
    :host { display: block; }
    .field { width: 100%; }
    .kind { color: var(--mat-sys-on-surface-variant); font-size: 12px; }
    .problem { color: var(--mat-sys-error); font-size: 13px; margin: 2px 0 0 16px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnField {
  /** The control holding the column name. */
  readonly control = input.required<FormControl<string>>();
  /** Field label. */
  readonly label = input.required<string>();
  /** Columns of the uploaded data (empty before an upload). */
  readonly columns = input<ColumnProfile[]>([]);
  /** Plain help under the field. */
  readonly hint = input('');
  /** A problem with the choice (from the plan check or the server). */
  readonly error = input('');

  /** True when the saved choice is not a column of the current data (kept so nothing typed is lost). */
  protected unknown(): boolean {
    const v = this.control().value;
    return !!v && !this.columns().some((c) => c.name === v);
  }

  protected kindWord(c: ColumnProfile): string {
    return KIND_WORDS[c.kind] ?? c.kind;
  }
}
