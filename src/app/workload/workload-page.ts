import { DatePipe, Location } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, forkJoin, map, of } from 'rxjs';
import type { RequestState } from '../../../shared/api/types';
import type { Workload } from '../../../shared/api/workflow';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { expertiseLabel } from '../intake/assign-page';
import { AssignedNotice, assignedNoticeText, readAssignedNotice } from '../intake/assigned-notice';
import { OfficeSettingsService } from '../office-settings/office-settings-service';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { StateChip } from '../requests/state-chip';
import { DUE_STATUS_TEXT, dueStatus } from './due-status';
import { TurnaroundChart } from './turnaround-chart';
import { WorkloadService } from './workload-service';

// States in which the due date binds the reviewer (the server counts due-soon and overdue the same way).
const REVIEWER_CLOCK_STATES: readonly RequestState[] = ['assigned', 'in-review'];

// Used when the settings cannot be read; the server's own due-soon count stays authoritative.
const FALLBACK_DUE_SOON_DAYS = 3;

/** The head's workload board: each reviewer's open requests, due dates, expertise and turnaround. */
@Component({
  selector: 'as-workload-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, StateChip, EmptyState, LoadError, TurnaroundChart],
  templateUrl: './workload-page.html',
  styleUrl: './workload-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkloadPage implements OnInit {
  private readonly service = inject(WorkloadService);
  private readonly settings = inject(OfficeSettingsService);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly workload = signal<Workload | null>(null);
  protected readonly dueSoonDays = signal(FALLBACK_DUE_SOON_DAYS);
  /** Confirmation after returning from a reassignment. */
  protected readonly notice = signal<AssignedNotice | null>(readAssignedNotice(inject(Location).getState()));
  protected readonly noticeText = assignedNoticeText;
  protected readonly statusText = DUE_STATUS_TEXT;
  protected readonly expertiseLabel = expertiseLabel;

  protected readonly cards = computed(() => {
    const w = this.workload();
    if (!w) return [];
    const soon = this.dueSoonDays();
    return w.reviewers.map((r) => ({
      ...r,
      open: [...r.open]
        // The reviewer's clock runs only while the request is with them; a revision round pauses it.
        .map((o) => ({ ...o, status: REVIEWER_CLOCK_STATES.includes(o.state) ? dueStatus(o.dueAt, soon) : ('paused' as const) }))
        .sort((a, b) => (a.dueAt ?? '9999').localeCompare(b.dueAt ?? '9999')),
    }));
  });
  protected readonly totals = computed(() => {
    const rs = this.workload()?.reviewers ?? [];
    return {
      open: rs.reduce((s, r) => s + r.openCount, 0),
      dueSoon: rs.reduce((s, r) => s + r.dueSoon, 0),
      overdue: rs.reduce((s, r) => s + r.overdue, 0),
    };
  });

  ngOnInit(): void {
    this.load();
  }

  /** Loads the board (and the office's due-soon window for the markers). */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    forkJoin({
      workload: this.service.workload(),
      dueSoon: this.settings.get().pipe(map((s) => s.dueSoonDays), catchError(() => of(FALLBACK_DUE_SOON_DAYS))),
    })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ workload, dueSoon }) => {
          this.loading.set(false);
          this.dueSoonDays.set(dueSoon);
          this.workload.set(workload);
        },
        error: (err: unknown) => {
          this.loading.set(false);
          this.problem.set(toApiProblem(err));
        },
      });
  }

  /** "3 open" style counts. */
  protected plural(n: number, one: string, many: string): string {
    return `${n} ${n === 1 ? one : many}`;
  }
}
