import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Title } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import type { Criterion, RequestDetail } from '../../../shared/api/types';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { AuthService } from '../auth/auth-service';
import { CommentThread } from '../comments/comment-thread';
import { openDeclineDialog } from '../intake/decline-dialog';
import { LoadError } from '../page-state/load-error';
import { RequestService } from '../requests/request-service';
import { StateChip } from '../requests/state-chip';
import { ChecklistPanel } from './checklist-panel';
import { DecisionPanel } from './decision-panel';
import { planLines } from './plan-lines';
import { RerunPanel } from './rerun-panel';

/**
 * The reviewer's workspace for one request: what was filed (left), the reruns and their
 * results (centre), the checklist (right), then the conversation and the decision.
 * The office head sees the same page read-only and can countersign.
 */
@Component({
  selector: 'as-review-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, LoadError, StateChip, RerunPanel, ChecklistPanel, CommentThread, DecisionPanel],
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage implements OnInit {
  private readonly requests = inject(RequestService);
  private readonly auth = inject(AuthService);
  private readonly destroyRef = inject(DestroyRef);
  private readonly title = inject(Title);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);

  /** Route parameter. */
  readonly id = input.required<string>();

  protected readonly request = signal<RequestDetail | null>(null);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly missing = signal<Criterion[]>([]);
  protected readonly plan = computed(() => planLines(this.request()?.plan ?? null));
  /** Only the assigned reviewer works here; the head (and anyone else allowed to look) reads. */
  protected readonly readOnly = computed(() => {
    const r = this.request();
    return !r || !r.can.review || this.auth.me()?.id !== r.reviewer?.id;
  });
  protected readonly staff = computed(() => this.auth.hasAnyRole(['reviewer', 'head']));
  private readonly checklist = viewChild(ChecklistPanel);

  ngOnInit(): void {
    this.load();
  }

  /** Fetches the request (again), e.g. after a decision changed its state. */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.requests.get(this.id()).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (r) => {
        this.request.set(r);
        this.loading.set(false);
        this.title.setTitle(`Review ${r.reference} · Assayer`);
      },
      error: (err: unknown) => {
        const p = toApiProblem(err);
        this.problem.set(p);
        this.loading.set(false);
        void this.announcer.announce(`Could not load the request. ${p.message}`, 'assertive');
      },
    });
  }

  /** The assigned reviewer hands the request back (conflict of interest, capacity); it returns to the head's queue. */
  protected declineAssignment(r: RequestDetail): void {
    openDeclineDialog(this.dialog, { requestId: r.id, reference: r.reference, title: r.title }).subscribe((declined) => {
      if (!declined) return;
      void this.announcer.announce(`${r.reference} went back to the office head.`, 'polite');
      void this.router.navigate(['/requests/assigned']);
    });
  }

  /** A rerun finished: the checklist's automatic findings are new. */
  protected rerunFinished(): void {
    this.checklist()?.load();
  }
}
