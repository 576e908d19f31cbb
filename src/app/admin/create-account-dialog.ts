import { ChangeDetectionStrategy, Component, inject, signal, type OnInit } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { ROLES, type DepartmentRef, type Role, type UserAdminRow } from '../../../shared/api/types';
import { toApiProblem } from '../api-client/api-error';
import { ROLE_LABELS } from '../shell/role-labels';
import { AdminService } from './admin-service';

/** Minimum length of a first password for a local account (the person changes it later). */
export const MIN_PASSWORD_LENGTH = 12;

/** Dialog that creates a local (password) account with its first roles. */
@Component({
  selector: 'as-create-account-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule, MatButtonModule, MatIconModule],
  templateUrl: './create-account-dialog.html',
  styles: `
    form { display: flex; flex-direction: column; gap: 4px; padding-top: 4px; }
    fieldset { border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; padding: 8px 12px; margin: 4px 0 8px; }
    legend { font-size: 13px; font-weight: 600; padding: 0 4px; }
    .roles { display: flex; flex-wrap: wrap; gap: 0 12px; }
    .error { color: var(--mat-sys-error); display: flex; gap: 6px; align-items: center; margin: 0; min-height: 20px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CreateAccountDialog implements OnInit {
  private readonly admin = inject(AdminService);
  private readonly ref = inject<MatDialogRef<CreateAccountDialog, UserAdminRow>>(MatDialogRef);

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly minLength = MIN_PASSWORD_LENGTH;
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', [Validators.required, Validators.maxLength(120)]],
    email: ['', [Validators.required, Validators.email]],
    departmentId: [null as string | null],
    password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH)]],
    roles: [['submitter'] as Role[]],
  });
  protected readonly saving = signal(false);
  protected readonly formError = signal('');
  protected readonly departments = signal<DepartmentRef[]>([]);

  ngOnInit(): void {
    // Without the list the account is simply created without a department.
    this.admin.departments().subscribe({ next: (d) => this.departments.set(d), error: () => this.departments.set([]) });
  }

  /** Adds or removes a role from the new account's first roles. */
  protected toggleRole(role: Role, checked: boolean): void {
    const current = this.form.controls.roles.value;
    this.form.controls.roles.setValue(checked ? ROLES.filter((r) => r === role || current.includes(r)) : current.filter((r) => r !== role));
  }

  /** Sends the new account; field errors from the server appear beside their fields. */
  protected createAccount(): void {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    const v = this.form.getRawValue();
    this.admin.createLocalAccount({ ...v, name: v.name.trim(), email: v.email.trim() }).subscribe({
      next: (user) => this.ref.close(user),
      error: (err: unknown) => {
        this.saving.set(false);
        const p = toApiProblem(err);
        let placed = false;
        for (const [field, message] of Object.entries(p.fields)) {
          const control = this.form.get(field);
          if (control) {
            control.setErrors({ server: message });
            control.markAsTouched();
            placed = true;
          }
        }
        this.formError.set(placed ? 'Check the highlighted fields.' : p.message);
      },
    });
  }
}
