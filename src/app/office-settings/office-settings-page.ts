import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { OfficeSettings } from '../../../shared/api/workflow';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { AuthService } from '../auth/auth-service';
import { LoadError } from '../page-state/load-error';
import { OfficeSettingsService } from './office-settings-service';
import { buildSettingsForm, fieldMessage, fillSettingsForm, settingsFromForm } from './settings-form';

/** Office settings: the head edits; reviewers and administrators read. */
@Component({
  selector: 'as-office-settings-page',
  imports: [
    ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule,
    MatProgressBarModule, LoadError,
  ],
  templateUrl: './office-settings-page.html',
  styleUrl: './office-settings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OfficeSettingsPage implements OnInit {
  private readonly service = inject(OfficeSettingsService);
  private readonly auth = inject(AuthService);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly form = buildSettingsForm();
  protected readonly canEdit = computed(() => this.auth.hasAnyRole(['head']));
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly saveProblem = signal<ApiProblem | null>(null);
  protected readonly savedAt = signal<Date | null>(null);
  protected readonly stale = signal(false);
  protected readonly settings = signal<OfficeSettings | null>(null);
  // Bumped on every status change so template messages recompute under OnPush.
  private readonly tick = signal(0);

  constructor() {
    this.form.statusChanges.pipe(takeUntilDestroyed()).subscribe(() => this.tick.update((n) => n + 1));
  }

  ngOnInit(): void {
    this.load();
  }

  /** Reads the settings (again), dropping unsaved edits. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.saveProblem.set(null);
    this.stale.set(false);
    this.service.get().pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (s) => {
        this.loading.set(false);
        this.settings.set(s);
        fillSettingsForm(this.form, s);
        if (!this.canEdit()) this.form.disable();
        this.tick.update((n) => n + 1);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        this.problem.set(toApiProblem(err));
      },
    });
  }

  /** Saves the settings with the version they were read at. */
  save(): void {
    const current = this.settings();
    if (!current || !this.canEdit() || this.saving()) return;
    this.savedAt.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.tick.update((n) => n + 1);
      void this.announcer.announce('Some settings need correcting; see the messages next to the fields.', 'assertive');
      this.focusFirstInvalid();
      return;
    }
    this.saving.set(true);
    this.saveProblem.set(null);
    this.service.save(settingsFromForm(this.form, current.version)).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.settings.set(saved);
        fillSettingsForm(this.form, saved);
        this.savedAt.set(new Date());
        void this.announcer.announce('Office settings saved.', 'polite');
      },
      error: (err: unknown) => this.failed(toApiProblem(err)),
    });
  }

  /** The message for one field, or null; shown only after the field was touched. */
  protected message(path: string): string | null {
    this.tick();
    const c = this.form.get(path);
    if (!c || !c.touched) return null;
    return fieldMessage(path, c.errors);
  }

  /** The cross-field message about the due-soon warning. */
  protected dueSoonMessage(): string | null {
    this.tick();
    const own = this.message('dueSoonDays');
    if (own) return own;
    return this.form.hasError('dueSoonTooLong') && this.form.get('dueSoonDays')!.touched
      ? 'The due-soon warning must be shorter than the service level, or every request is "due soon" from the start.'
      : null;
  }

  private failed(p: ApiProblem): void {
    this.saving.set(false);
    this.saveProblem.set(p);
    if (p.status === 409) this.stale.set(true);
    // The server names fields by their path; put each message beside its field.
    for (const [path, msg] of Object.entries(p.fields)) {
      const c: AbstractControl | null = this.form.get(path.replace(/\.\d+$/, ''));
      if (c) {
        c.setErrors({ ...(c.errors ?? {}), server: msg });
        c.markAsTouched();
      }
    }
    this.tick.update((n) => n + 1);
    void this.announcer.announce(p.message, 'assertive');
  }

  private focusFirstInvalid(): void {
    setTimeout(() => document.querySelector<HTMLElement>('as-office-settings-page .ng-invalid input, as-office-settings-page input.ng-invalid, as-office-settings-page textarea.ng-invalid')?.focus());
  }
}
