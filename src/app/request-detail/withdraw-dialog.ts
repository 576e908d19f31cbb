import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { RequestDetail } from '../../../shared/api/types';
import { withdrawSchema } from '../../../shared/api/filing-schemas';
import { toApiProblem } from '../api-client/api-error';
import { RequestRecordService } from './request-record-service';

/** Confirms withdrawing a request, with the reason the office will see. */
@Component({
  selector: 'as-withdraw-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Withdraw {{ data.reference }}?</h2>
    <mat-dialog-content>
      <p>The request stops here: the office will not review it further. It stays readable, with its versions and data, but it cannot be submitted again.</p>
      <form id="withdraw-form" (ngSubmit)="withdraw()" novalidate>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Why are you withdrawing it?</mat-label>
          <textarea matInput rows="3" [formControl]="reason" required></textarea>
          <mat-hint>The office and reviewer see this.</mat-hint>
          @if (reasonError()) { <mat-error>{{ reasonError() }}</mat-error> }
        </mat-form-field>
        <p class="err" aria-live="assertive">{{ error() }}</p>
      </form>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Keep the request</button>
      <button mat-flat-button type="submit" form="withdraw-form" class="danger" [disabled]="busy()">Withdraw</button>
    </mat-dialog-actions>
  `,
  styles: `
    .wide { width: 100%; min-width: min(480px, 75vw); }
    .err { color: var(--mat-sys-error); margin: 0; min-height: 20px; }
    .danger { --mdc-filled-button-container-color: var(--mat-sys-error); --mat-button-filled-container-color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WithdrawDialog {
  protected readonly data = inject<RequestDetail>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<WithdrawDialog, RequestDetail>>(MatDialogRef);
  private readonly api = inject(RequestRecordService);
  protected readonly reason = new FormControl('', { nonNullable: true });
  protected readonly reasonError = signal('');
  protected readonly error = signal('');
  protected readonly busy = signal(false);

  /** Checks the reason with the shared schema, then withdraws. */
  protected withdraw(): void {
    const check = withdrawSchema.shape.reason.safeParse(this.reason.value);
    if (!check.success) {
      this.reasonError.set(check.error.issues[0]?.message ?? 'Give a reason.');
      this.reason.setErrors({ reason: true });
      this.reason.markAsTouched();
      return;
    }
    this.reasonError.set('');
    this.busy.set(true);
    this.api.withdraw(this.data.id, this.data.version, check.data).subscribe({
      next: (r) => this.ref.close(r),
      error: (err: unknown) => {
        const p = toApiProblem(err);
        this.error.set(p.status === 409 ? 'The request changed since you opened it. Close this, reload the page and try again.' : p.fields['reason'] ?? p.message);
        this.busy.set(false);
      },
    });
  }
}
