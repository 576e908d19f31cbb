import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, OnInit, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ROLES, type Role, type RoleMapping } from '../../../shared/api/types';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { ROLE_LABELS } from '../shell/role-labels';
import { AdminService } from './admin-service';

/** Attribute names institutions commonly release; offered as suggestions, any name may be typed. */
export const COMMON_ATTRIBUTES = ['eduPersonAffiliation', 'eduPersonScopedAffiliation', 'eduPersonEntitlement', 'isMemberOf'];

/** Sign-in mappings: which single sign-on attribute values grant which roles. */
@Component({
  selector: 'as-sign-in-mappings-page',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, MatIconModule, MatProgressBarModule, EmptyState, LoadError],
  templateUrl: './sign-in-mappings-page.html',
  styleUrl: './sign-in-mappings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInMappingsPage implements OnInit {
  private readonly admin = inject(AdminService);
  private readonly announcer = inject(LiveAnnouncer);

  protected readonly roles = ROLES;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly attributes = COMMON_ATTRIBUTES;
  protected readonly mappings = signal<RoleMapping[]>([]);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly saving = signal(false);
  protected readonly message = signal('');
  protected readonly form = inject(FormBuilder).nonNullable.group({
    attribute: ['eduPersonAffiliation', [Validators.required, Validators.maxLength(200)]],
    value: ['', [Validators.required, Validators.maxLength(200)]],
    role: ['submitter' as Role, [Validators.required]],
  });

  ngOnInit(): void {
    this.load();
  }

  /** Fetches the mappings. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.admin.mappings().subscribe({
      next: (list) => {
        this.mappings.set(list);
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.problem.set(toApiProblem(err));
        this.loading.set(false);
      },
    });
  }

  /** Adds the mapping in the form. */
  addMapping(): void {
    this.message.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.saving.set(true);
    const created = { attribute: v.attribute.trim(), value: v.value.trim(), role: v.role };
    this.admin.replaceMappings([...this.mappings(), created]).subscribe({
      next: (stored) => {
        this.saving.set(false);
        this.mappings.set(stored);
        this.form.controls.value.reset('');
        this.say(`Added: ${created.attribute} = ${created.value} grants ${ROLE_LABELS[created.role]}.`);
      },
      error: (err: unknown) => {
        this.saving.set(false);
        const p = toApiProblem(err);
        // The server names fields of the whole list ("mappings.3.value"): the new row is the last one.
        for (const [field, msg] of Object.entries(p.fields)) this.form.get(field.split('.').pop() ?? field)?.setErrors({ server: msg });
        this.say(`Not added: ${p.message}`);
      },
    });
  }

  /** Removes one mapping. */
  removeMapping(m: RoleMapping): void {
    this.admin.replaceMappings(this.mappings().filter((x) => x.id !== m.id)).subscribe({
      next: (stored) => {
        this.mappings.set(stored);
        this.say(`Removed: ${m.attribute} = ${m.value} no longer grants ${ROLE_LABELS[m.role]}.`);
      },
      error: (err: unknown) => this.say(`Not removed: ${toApiProblem(err).message}`),
    });
  }

  private say(text: string): void {
    this.message.set(text);
    void this.announcer.announce(text, 'polite');
  }
}
