import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { Observable } from 'rxjs';
import type { DeclineBody } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { IntakeService } from './intake-service';

/** What the decline dialog needs to know about the request. */
export interface DeclineDialogData {
  requestId: string;
  reference: string;
  title?: string;
}

/** Reasons a reviewer gives for handing a request back, in their words. */
export const DECLINE_REASONS: readonly { value: DeclineBody['reason']; label: string; hint: string }[] = [
  { value: 'conflict', label: 'I have a conflict of interest', hint: 'For example I advised on this analysis, or work closely with the submitter.' },
  { value: 'capacity', label: 'I do not have capacity', hint: 'I cannot review it by the due date.' },
  { value: 'other', label: 'Another reason', hint: 'Explain in the note.' },
];

/**
 * The assigned reviewer declines a request or declares a conflict of interest; the request goes back to the
 * office head's intake queue. Closes with `true` after the server accepted it. Open it with {@link openDeclineDialog}.
 */
@Component({
  selector: 'as-decline-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatRadioModule],
  template: `
    <h2 mat-dialog-title>Decline {{ data.reference }}</h2>
    <form [formGroup]="form" (ngSubmit)="decline()" novalidate>
      <mat-dialog-content>
        <p class="lede">The request goes back to the office head for a new assignment. The head sees your reason and note;
          the submitter does not.</p>
        <fieldset>
          <legend>Reason</legend>
          <mat-radio-group formControlName="reason" class="reasons" aria-label="Reason">
            @for (r of reasons; track r.value) {
              <mat-radio-button [value]="r.value" [attr.aria-describedby]="'reason-hint-' + r.value">
                {{ r.label }}<span class="hint" [id]="'reason-hint-' + r.value">{{ r.hint }}</span>
              </mat-radio-button>
            }
          </mat-radio-group>
          @if (form.controls.reason.touched && form.controls.reason.invalid) {
            <p class="error" role="alert">Choose a reason.</p>
          }
        </fieldset>
        <mat-form-field appearance="outline" class="note">
          <mat-label>Note for the office head</mat-label>
          <textarea matInput formControlName="note" rows="3" maxlength="1000"></textarea>
          @if (form.controls.note.hasError('required')) {
            <mat-error>Say briefly why, so the head can pick someone else.</mat-error>
          }
          <mat-hint align="end">{{ form.controls.note.value.length }} / 1000</mat-hint>
        </mat-form-field>
        @if (problem(); as p) {
          <p class="error" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ p }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Keep the assignment</button>
        <button mat-flat-button type="submit" [disabled]="saving()">
          <mat-icon aria-hidden="true">assignment_return</mat-icon>Decline
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .lede { margin-top: 0; }
    fieldset { border: 0; padding: 0; margin: 0 0 12px; }
    legend { font-weight: 600; margin-bottom: 4px; }
    .reasons { display: grid; gap: 2px; }
    .hint { display: block; font-size: 13px; color: var(--mat-sys-on-surface-variant); }
    .note { width: 100%; }
    .error { display: flex; gap: 6px; align-items: center; color: #8c1d18; font-weight: 500; margin: 4px 0 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeclineDialog {
  protected readonly data = inject<DeclineDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<DeclineDialog, boolean>>(MatDialogRef);
  private readonly intake = inject(IntakeService);

  protected readonly reasons = DECLINE_REASONS;
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly form = new FormGroup({
    reason: new FormControl<DeclineBody['reason'] | null>(null, Validators.required),
    note: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(1000)] }),
  });

  /** Sends the decline and closes the dialog with `true` once the server accepted it. */
  decline(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { reason, note } = this.form.getRawValue();
    this.saving.set(true);
    this.problem.set(null);
    this.intake.decline(this.data.requestId, { reason: reason!, note: note.trim() }).subscribe({
      next: () => this.ref.close(true),
      error: (err: unknown) => {
        this.saving.set(false);
        this.problem.set(toApiProblem(err).message);
      },
    });
  }
}

/** Opens the decline dialog; emits `true` when the reviewer declined, `undefined` when they kept the assignment. */
export function openDeclineDialog(dialog: MatDialog, data: DeclineDialogData): Observable<boolean | undefined> {
  return dialog.open<DeclineDialog, DeclineDialogData, boolean>(DeclineDialog, { data, width: '560px', autoFocus: 'first-tabbable' }).afterClosed();
}
