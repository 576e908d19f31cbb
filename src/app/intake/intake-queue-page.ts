import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe, Location } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { RequestSummary } from '../../../shared/api/types';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { EmptyState } from '../page-state/empty-state';
import { LoadError } from '../page-state/load-error';
import { AssignedNotice, assignedNoticeText, readAssignedNotice } from './assigned-notice';
import { daysSince, daysUntil } from './calendar-days';
import { IntakeService } from './intake-service';

/** A request waiting for a reviewer, with what the head weighs: age and the submitter's deadline. */
interface WaitingRow {
  request: RequestSummary;
  ageDays: number;
  ageText: string;
  deadlineDays: number | null;
  deadlineText: string | null;
  design: string;
}

/** The head's intake queue: filed requests waiting for a reviewer, with their age and deadline and an Assign action. */
@Component({
  selector: 'as-intake-queue-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, EmptyState, LoadError],
  templateUrl: './intake-queue-page.html',
  styleUrl: './intake-queue-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IntakeQueuePage implements OnInit {
  private readonly intake = inject(IntakeService);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly waiting = signal<RequestSummary[]>([]);
  protected readonly total = signal(0);
  /** Confirmation after returning from the assignment page. */
  protected readonly notice = signal<AssignedNotice | null>(readAssignedNotice(inject(Location).getState()));
  protected readonly rows = computed<WaitingRow[]>(() =>
    this.waiting().map((r) => {
      const ageDays = r.filedAt ? daysSince(r.filedAt) : 0;
      const deadlineDays = r.deadline ? daysUntil(r.deadline) : null;
      return {
        request: r,
        ageDays,
        ageText: ageDays === 0 ? 'Filed today' : ageDays === 1 ? '1 day' : `${ageDays} days`,
        deadlineDays,
        deadlineText: deadlineDays === null ? null
          : deadlineDays < 0 ? `${-deadlineDays} ${-deadlineDays === 1 ? 'day' : 'days'} past`
          : deadlineDays === 0 ? 'today' : `in ${deadlineDays} ${deadlineDays === 1 ? 'day' : 'days'}`,
        design: r.designKind ? DESIGN_KIND_LABELS[r.designKind] : 'Design not stated',
      };
    }),
  );

  ngOnInit(): void {
    this.load();
    const n = this.notice();
    if (n) void this.announcer.announce(assignedNoticeText(n), 'polite');
  }

  /** Loads the requests waiting for a reviewer. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.intake.waiting().pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (page) => {
        this.loading.set(false);
        this.waiting.set(page.items);
        this.total.set(page.total);
      },
      error: (err: unknown) => {
        this.loading.set(false);
        this.problem.set(toApiProblem(err));
      },
    });
  }

  /** Hides the confirmation banner. */
  protected dismissNotice(): void {
    this.notice.set(null);
  }

  protected readonly noticeText = assignedNoticeText;
}
