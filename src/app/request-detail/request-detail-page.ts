import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Title } from '@angular/platform-browser';
import { MatDialog } from '@angular/material/dialog';
import { RouterLink } from '@angular/router';
import type { DesignKind, RequestDetail } from '../../../shared/api/types';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { AuthService } from '../auth/auth-service';
import { CommentThread } from '../comments/comment-thread';
import { RevisionChanges } from '../filing/revision-changes';
import { LoadError } from '../page-state/load-error';
import { StateChip } from '../requests/state-chip';
import { RequestService } from '../requests/request-service';
import { describeActions } from './action-reasons';
import { OutcomePanel } from './outcome-panel';
import { summarisePlan } from './plan-summary';
import { RequestRecordService } from './request-record-service';
import { VersionsPanel } from './versions-panel';
import { WithdrawDialog } from './withdraw-dialog';

const DESIGN_KIND_LABELS: Record<DesignKind, string> = {
  'one-sample': 'One sample',
  'two-independent': 'Two independent groups',
  paired: 'Paired',
  'between-anova': 'Between-subjects ANOVA',
  'repeated-measures': 'Repeated measures',
  mixed: 'Mixed',
  regression: 'Regression',
};

/** One request in full: state, purpose, plan, data files, people, dates and what the viewer may do. */
@Component({
  selector: 'as-request-detail-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, StateChip, LoadError,
    RevisionChanges, VersionsPanel, OutcomePanel, CommentThread],
  templateUrl: './request-detail-page.html',
  styleUrl: './request-detail-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestDetailPage implements OnInit {
  private readonly requests = inject(RequestService);
  private readonly destroyRef = inject(DestroyRef);
  private readonly title = inject(Title);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly dialog = inject(MatDialog);
  private readonly records = inject(RequestRecordService);
  private readonly auth = inject(AuthService);

  /** Route parameter. */
  readonly id = input.required<string>();
  /** Query parameter set by the filing form after a successful submit ("filed" or "revision"). */
  readonly submitted = input<string | undefined>(undefined);

  /** Set after a withdrawal in this visit, to confirm it. */
  protected readonly withdrawn = signal(false);
  /** Reviewers and the office head may write internal notes in the thread. */
  protected readonly allowInternal = computed(() => this.auth.hasAnyRole(['reviewer', 'head']));

  protected readonly request = signal<RequestDetail | null>(null);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly planLines = computed(() => summarisePlan(this.request()?.plan ?? null));
  protected readonly actions = computed(() => {
    const r = this.request();
    return r ? describeActions(r) : [];
  });
  /** Reported results, when the server includes them in the detail (the plan itself no longer carries them). */
  protected readonly reported = computed(() => {
    const r = this.request() as (RequestDetail & { reported?: { term?: string; text: string }[] | null }) | null;
    return r?.reported ?? [];
  });
  protected readonly designKind = computed(() => {
    const k = this.request()?.designKind;
    return k ? DESIGN_KIND_LABELS[k] ?? k : null;
  });

  ngOnInit(): void {
    this.load();
  }

  /** Fetches the request (again). */
  load(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.requests
      .get(this.id())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (r) => {
          this.request.set(r);
          this.loading.set(false);
          this.title.setTitle(`${r.reference} ${r.title} · Assayer`);
        },
        error: (err: unknown) => {
          const p = toApiProblem(err);
          this.problem.set(p);
          this.loading.set(false);
          void this.announcer.announce(`Could not load the request. ${p.message}`, 'assertive');
        },
      });
  }

  /** Download address of a data file. */
  protected fileUrl(datasetId: string): string {
    return this.records.datasetFileUrl(this.id(), datasetId);
  }

  /** Asks for a reason and confirmation, then withdraws the request. */
  protected confirmWithdraw(): void {
    const r = this.request();
    if (!r) return;
    this.dialog.open<WithdrawDialog, RequestDetail, RequestDetail>(WithdrawDialog, { data: r }).afterClosed().subscribe((next) => {
      if (!next) return;
      this.request.set(next);
      this.withdrawn.set(true);
      void this.announcer.announce(`${next.reference} was withdrawn.`, 'polite');
    });
  }

  /** Shortens a SHA-256 for display; the full value stays in the title and for copying. */
  protected shortHash(hash: string): string {
    return hash.length > 16 ? `${hash.slice(0, 12)}…${hash.slice(-4)}` : hash;
  }
}
