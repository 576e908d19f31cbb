import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import type { SignBody } from '../../../shared/api/workflow';

/** Input of the signing dialog. */
export interface SignDialogData {
  reference: string;
  decisionLabel: string;
  /** "sign" for the reviewer, "countersign" for the head. */
  mode: 'sign' | 'countersign';
  /** Whether to ask for the password (local accounts). */
  askPassword: boolean;
}

/**
 * The deliberate signing step: says what signing means, asks the signer to type the
 * request reference and (for local accounts) their password.
 */
@Component({
  selector: 'as-sign-dialog',
  imports: [MatButtonModule, MatDialogModule, MatIconModule],
  template: `
    <h2 mat-dialog-title>{{ data.mode === 'sign' ? 'Sign the recommendation letter' : 'Countersign the recommendation letter' }}</h2>
    <mat-dialog-content>
      <div class="explain">
        <mat-icon aria-hidden="true">verified_user</mat-icon>
        <p>The letter for <strong class="as-mono">{{ data.reference }}</strong> ({{ data.decisionLabel }}) will be signed with the office’s key.
          Anyone who receives it can check it on the public verification page. A signed letter cannot be changed: a correction
          makes a new letter that supersedes this one.</p>
      </div>
      <label for="sign-ref" class="lbl">Type the request reference to confirm</label>
      <input id="sign-ref" autocomplete="off" class="as-mono" [value]="typed()" (input)="typed.set($any($event.target).value)"
             [attr.aria-invalid]="tried() && !matches()" aria-describedby="sign-ref-hint" />
      <p id="sign-ref-hint" class="hint">Exactly <span class="as-mono">{{ data.reference }}</span>.</p>
      @if (data.askPassword) {
        <label for="sign-pw" class="lbl">Your password (for accounts that sign in with an Assayer password)</label>
        <input id="sign-pw" type="password" autocomplete="current-password" [value]="password()" (input)="password.set($any($event.target).value)" />
      }
      @if (tried() && !matches()) { <p class="error" role="alert">The reference does not match {{ data.reference }}.</p> }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="button" (click)="confirm()">{{ data.mode === 'sign' ? 'Sign the letter' : 'Countersign' }}</button>
    </mat-dialog-actions>
  `,
  styles: `
    .explain { display: flex; gap: 10px; background: #eef5f5; border-radius: 8px; padding: 10px 12px; margin-bottom: 14px;
      mat-icon { color: var(--mat-sys-primary); flex: none; } p { margin: 0; line-height: 1.5; } }
    .lbl { display: block; font-weight: 600; margin: 10px 0 4px; }
    input { font: inherit; padding: 8px; border: 1px solid var(--mat-sys-outline); border-radius: 6px; width: 100%; box-sizing: border-box; }
    .hint { margin: 4px 0 0; font-size: 12px; color: var(--mat-sys-on-surface-variant); }
    .error { color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignDialog {
  protected readonly data = inject<SignDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject(MatDialogRef<SignDialog, SignBody>);
  protected readonly typed = signal('');
  protected readonly password = signal('');
  protected readonly tried = signal(false);
  protected readonly matches = computed(() => this.typed().trim().toUpperCase() === this.data.reference.toUpperCase());

  /** Closes with the confirmation when the reference matches. */
  protected confirm(): void {
    this.tried.set(true);
    if (!this.matches()) return;
    this.ref.close({ confirmReference: this.typed().trim(), ...(this.data.askPassword && this.password() ? { password: this.password() } : {}) });
  }
}
