import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { Router, RouterLink } from '@angular/router';
import { catchError, forkJoin, map, of } from 'rxjs';
import type { RequestDetail } from '../../../shared/api/types';
import type { AssignmentCandidate } from '../../../shared/api/workflow';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { OfficeSettingsService } from '../office-settings/office-settings-service';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { RequestService } from '../requests/request-service';
import { StateChip } from '../requests/state-chip';
import { addDaysIso, daysSince, todayIso } from './calendar-days';
import { IntakeService } from './intake-service';
import type { AssignedNotice } from './assigned-notice';

/** Labels for declared expertise values; unknown values show as typed. */
export function expertiseLabel(value: string): string {
  return (DESIGN_KIND_LABELS as Record<string, string>)[value] ?? value;
}

/** Assigns (or reassigns) a reviewer to one request: candidates with load, expertise and conflicts, due date, note. */
@Component({
  selector: 'as-assign-page',
  imports: [
    DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule,
    MatProgressBarModule, MatRadioModule, StateChip, EmptyState, LoadError,
  ],
  templateUrl: './assign-page.html',
  styleUrl: './assign-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AssignPage implements OnInit {
  private readonly requests = inject(RequestService);
  private readonly intake = inject(IntakeService);
  private readonly settings = inject(OfficeSettingsService);
  private readonly router = inject(Router);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly destroyRef = inject(DestroyRef);

  /** Route parameter: the request id. */
  readonly id = input.required<string>();

  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly request = signal<RequestDetail | null>(null);
  protected readonly candidates = signal<AssignmentCandidate[]>([]);
  protected readonly serviceLevelDays = signal<number | null>(null);
  protected readonly saving = signal(false);
  /** Conflict-of-interest refusal from the server, shown beside the reviewer choice. */
  protected readonly conflictMessage = signal<string | null>(null);
  /** Any other failure to save (stale version, validation, network). */
  protected readonly saveProblem = signal<ApiProblem | null>(null);

  protected readonly form = new FormGroup({
    reviewerId: new FormControl<string | null>(null, Validators.required),
    dueAt: new FormControl('', { nonNullable: true }),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
  });
  protected readonly today = todayIso();
  protected readonly reassigning = computed(() => !!this.request()?.reviewer);
  /** A reassignment starts and ends on the workload board; a first assignment on the intake queue. */
  protected readonly backLink = computed(() =>
    this.reassigning() ? { path: '/workload', label: 'Workload' } : { path: '/requests/intake', label: 'Intake queue' },
  );
  protected readonly ageDays = computed(() => {
    const filed = this.request()?.filedAt;
    return filed ? daysSince(filed) : null;
  });
  protected readonly designLabel = computed(() => {
    const k = this.request()?.designKind;
    return k ? DESIGN_KIND_LABELS[k] : 'Not stated';
  });
  private readonly chosenId = signal<string | null>(null);
  protected readonly chosen = computed(() => this.candidates().find((c) => c.reviewer.id === this.chosenId()) ?? null);
  protected readonly expertiseLabel = expertiseLabel;

  constructor() {
    this.form.controls.reviewerId.valueChanges.pipe(takeUntilDestroyed()).subscribe((v) => {
      this.chosenId.set(v);
      this.conflictMessage.set(null);
    });
  }

  ngOnInit(): void {
    this.load();
  }

  /** Loads the request, its candidates and the office's service-level days. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.saveProblem.set(null);
    this.conflictMessage.set(null);
    forkJoin({
      request: this.requests.get(this.id()),
      candidates: this.intake.candidates(this.id()),
      // Without settings the due date stays empty and the server applies the service level itself.
      sla: this.settings.get().pipe(map((s) => s.serviceLevelDays), catchError(() => of(null))),
    })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ request, candidates, sla }) => {
          this.loading.set(false);
          this.request.set(request);
          this.candidates.set(candidates);
          this.serviceLevelDays.set(sla);
          this.preset(candidates, sla);
        },
        error: (err: unknown) => {
          this.loading.set(false);
          this.problem.set(toApiProblem(err));
        },
      });
  }

  /** Sends the assignment; on success returns to the intake queue with a confirmation. */
  assign(): void {
    const req = this.request();
    const chosen = this.chosen();
    if (!req || this.saving()) return;
    if (!chosen || chosen.conflict) {
      this.form.controls.reviewerId.markAsTouched();
      void this.announcer.announce('Choose a reviewer who can take this request.', 'assertive');
      return;
    }
    if (this.form.invalid) return;
    const { dueAt, note } = this.form.getRawValue();
    this.saving.set(true);
    this.saveProblem.set(null);
    this.conflictMessage.set(null);
    this.intake
      .assign(req.id, { reviewerId: chosen.reviewer.id, dueAt: dueAt || null, note: note.trim() || undefined, version: req.version })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.saving.set(false);
          const notice: AssignedNotice = {
            reference: req.reference, reviewer: chosen.reviewer.name, dueAt: dueAt || null, reassigned: this.reassigning(),
          };
          void this.router.navigate([this.backLink().path], { state: { assigned: notice } });
        },
        error: (err: unknown) => {
          this.saving.set(false);
          const p = toApiProblem(err);
          if (p.status === 409 && p.code === 'conflict-of-interest') {
            this.conflictMessage.set(p.message);
            void this.announcer.announce(p.message, 'assertive');
          } else {
            this.saveProblem.set(p);
            void this.announcer.announce(p.message, 'assertive');
          }
        },
      });
  }

  /** The reviewer's open load in words. */
  protected loadText(c: AssignmentCandidate): string {
    return c.openCount === 1 ? '1 open request' : `${c.openCount} open requests`;
  }

  // Suggested reviewer and default due date, so the common case is one click.
  private preset(candidates: AssignmentCandidate[], sla: number | null): void {
    const current = this.request()?.reviewer?.id;
    const suggested = candidates.find((c) => c.suggested && !c.conflict && c.reviewer.id !== current);
    this.form.reset({
      reviewerId: suggested?.reviewer.id ?? null,
      dueAt: sla != null ? addDaysIso(this.today, sla) : '',
      note: '',
    });
    this.chosenId.set(suggested?.reviewer.id ?? null);
  }
}
