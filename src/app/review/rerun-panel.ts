import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { RerunBody, RerunDetail, RerunSummary } from '../../../shared/api/workflow';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { LoadError } from '../page-state/load-error';
import { RerunResultView } from '../results/rerun-result-view';
import { RerunStream } from './rerun-stream';
import { RERUN_STATUS_LABELS, shortHash, stageText } from './review-labels';
import { ReviewService } from './review-service';
import { VariantForm } from './variant-form';

/** Progress of the rerun being watched. */
interface Live {
  id: string;
  label: string;
  progress: number;
  stage: string | null;
}

/** Outcome of a reproduction, per original rerun. */
type Reproduction =
  | { state: 'running' }
  | { state: 'identical' | 'different'; otherId: string; differences: string[] }
  | { state: 'error'; message: string };

/**
 * The rerun part of the review workspace: start a rerun, follow its progress, list the
 * reruns and variants, open one, make a new variant, reproduce a rerun.
 */
@Component({
  selector: 'as-rerun-panel',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, LoadError, RerunResultView, VariantForm],
  templateUrl: './rerun-panel.html',
  styleUrl: './rerun-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RerunPanel implements OnInit {
  private readonly review = inject(ReviewService);
  private readonly stream = inject(RerunStream);
  private readonly destroyRef = inject(DestroyRef);
  private readonly announcer = inject(LiveAnnouncer);

  /** The request under review. */
  readonly requestId = input.required<string>();
  /** True for viewers who may look but not run (the head). */
  readonly readOnly = input(false);
  /** Emitted with the rerun id whenever a rerun finishes (the checklist reloads its findings). */
  readonly finished = output<string>();

  protected readonly statusLabels = RERUN_STATUS_LABELS;
  protected readonly shortHash = shortHash;
  protected readonly stageText = stageText;
  protected readonly reruns = signal<RerunSummary[]>([]);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly startError = signal<string | null>(null);
  protected readonly starting = signal(false);
  protected readonly live = signal<Live | null>(null);
  protected readonly selected = signal<RerunDetail | null>(null);
  protected readonly selectedLoading = signal(false);
  protected readonly selectedError = signal<string | null>(null);
  protected readonly variantOpen = signal(false);
  protected readonly reproductions = signal<Record<string, Reproduction>>({});
  protected readonly percent = computed(() => Math.round((this.live()?.progress ?? 0) * 100));

  ngOnInit(): void {
    this.load(true);
  }

  /** Fetches the list; on first load opens the newest finished rerun and follows one still running. */
  load(first = false): void {
    if (first) this.loading.set(true);
    this.problem.set(null);
    this.review.reruns(this.requestId()).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (list) => {
        this.reruns.set(list);
        this.loading.set(false);
        if (first) {
          const active = list.find((r) => r.status === 'queued' || r.status === 'running');
          if (active) this.follow(active);
          const latest = this.latestDone(list);
          if (latest) this.open(latest.id);
        }
      },
      error: (err: unknown) => {
        this.problem.set(toApiProblem(err));
        this.loading.set(false);
      },
    });
  }

  /** Starts a rerun of the filed plan, or of a variant. */
  protected start(body?: RerunBody): void {
    const n = this.reruns().length;
    body ??= { label: n === 0 ? 'as filed' : `as filed, run ${n + 1}` };
    if (this.starting() || this.live()) return;
    this.starting.set(true);
    this.startError.set(null);
    this.review.startRerun(this.requestId(), body).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (summary) => {
        this.starting.set(false);
        this.variantOpen.set(false);
        this.reruns.update((list) => [summary, ...list.filter((r) => r.id !== summary.id)]);
        this.follow(summary);
      },
      error: (err: unknown) => {
        this.starting.set(false);
        this.startError.set(toApiProblem(err).message);
        void this.announcer.announce('The rerun could not be started.', 'assertive');
      },
    });
  }

  /** Opens one rerun's full result. */
  protected open(id: string): void {
    this.selectedLoading.set(true);
    this.selectedError.set(null);
    this.review.rerun(id).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (d) => { this.selected.set(d); this.selectedLoading.set(false); },
      error: (err: unknown) => { this.selectedError.set(toApiProblem(err).message); this.selectedLoading.set(false); },
    });
  }

  /** Runs a finished rerun again with its stored plan and data; the server waits and compares the results. */
  protected reproduce(r: RerunSummary): void {
    this.setReproduction(r.id, { state: 'running' });
    this.review.reproduce(r.id).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (answer) => {
        this.reruns.update((list) => [answer.rerun, ...list.filter((x) => x.id !== answer.rerun.id)]);
        this.setReproduction(r.id, answer.identical
          ? { state: 'identical', otherId: answer.rerun.id, differences: [] }
          : { state: 'different', otherId: answer.rerun.id, differences: answer.differences });
        void this.announcer.announce(answer.identical ? `Reproduced “${r.label}”: the result is identical.` : `Reproduced “${r.label}”: the result differs.`);
      },
      error: (err: unknown) => this.setReproduction(r.id, { state: 'error', message: toApiProblem(err).message }),
    });
  }

  /** Reproduction state of one rerun, for the template. */
  protected reproduction(id: string): Reproduction | undefined {
    return this.reproductions()[id];
  }

  /** Total run time in seconds, for the list. */
  protected seconds(r: RerunSummary): string {
    const ms = r.timings?.totalMs;
    return ms === undefined ? '—' : `${(ms / 1000).toFixed(ms < 10000 ? 2 : 1)} s`;
  }

  private follow(r: RerunSummary): void {
    this.live.set({ id: r.id, label: r.label, progress: 0, stage: r.status === 'queued' ? 'queued' : 'starting' });
    void this.announcer.announce(`Rerun “${r.label}” started.`);
    // Finish on the final event, not on completion: takeUntilDestroyed also completes the stream when the page is left.
    this.stream.watch(r.id).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (ev) => {
        this.live.update((l) => (l ? { ...l, progress: ev.progress, stage: ev.stage } : l));
        this.reruns.update((list) => list.map((x) => (x.id === r.id ? { ...x, status: ev.status } : x)));
        if (ev.status === 'failed') {
          this.live.set(null);
          this.startError.set(`The rerun “${r.label}” failed: ${ev.error ?? 'no reason given'}.`);
          this.load();
        } else if (ev.status === 'done') {
          this.live.set(null);
          this.load();
          this.open(r.id);
          this.finished.emit(r.id);
        }
      },
      error: (err: unknown) => {
        this.live.set(null);
        this.startError.set(`Lost track of the rerun: ${toApiProblem(err).message}`);
      },
    });
  }

  private setReproduction(id: string, r: Reproduction): void {
    this.reproductions.update((m) => ({ ...m, [id]: r }));
  }

  private latestDone(list: RerunSummary[]): RerunSummary | undefined {
    return list.filter((r) => r.status === 'done').sort((a, b) => (b.finishedAt ?? '').localeCompare(a.finishedAt ?? ''))[0];
  }
}
