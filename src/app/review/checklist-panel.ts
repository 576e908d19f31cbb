import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatRadioModule } from '@angular/material/radio';
import { CRITERIA, VERDICTS, type Criterion, type Verdict } from '../../../shared/api/types';
import type { ChecklistEntryView } from '../../../shared/api/workflow';
import { ApiProblem, toApiProblem } from '../api-client/api-error';
import { LoadError } from '../page-state/load-error';
import { CRITERION_LABELS, VERDICT_LABELS } from './review-labels';
import { ReviewService } from './review-service';

/** What the panel holds for one criterion besides the saved entry. */
interface Row {
  entry: ChecklistEntryView;
  /** The note as the reviewer is typing it (may differ from the saved one). */
  note: string;
  status: 'idle' | 'saving' | 'saved' | 'conflict' | 'error';
  message: string;
}

/**
 * The nine checklist criteria in order: the automatic finding from the latest rerun, the
 * reviewer's verdict and note, saved as soon as they change (with the entry's version;
 * a 409 reloads that entry and keeps the reviewer's note text on screen).
 */
@Component({
  selector: 'as-checklist-panel',
  imports: [MatButtonModule, MatIconModule, MatRadioModule, LoadError],
  templateUrl: './checklist-panel.html',
  styleUrl: './checklist-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChecklistPanel implements OnInit {
  private readonly review = inject(ReviewService);
  private readonly destroyRef = inject(DestroyRef);
  private readonly announcer = inject(LiveAnnouncer);

  /** The request under review. */
  readonly requestId = input.required<string>();
  /** True for viewers who may read but not judge (the head, or after the decision). */
  readonly readOnly = input(false);
  /** Criteria the server said still need a verdict (from a refused decision). */
  readonly missing = input<readonly Criterion[]>([]);

  protected readonly labels = CRITERION_LABELS;
  protected readonly verdicts = VERDICTS;
  protected readonly verdictLabels = VERDICT_LABELS;
  protected readonly rows = signal<Row[]>([]);
  protected readonly loading = signal(true);
  protected readonly problem = signal<ApiProblem | null>(null);
  protected readonly done = computed(() => this.rows().filter((r) => r.entry.verdict !== null).length);

  ngOnInit(): void {
    this.load();
  }

  /** Fetches every entry (again), e.g. after a rerun has finished. Unsaved note text is kept. */
  load(): void {
    this.loading.set(this.rows().length === 0);
    this.problem.set(null);
    this.review.checklist(this.requestId()).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (entries) => {
        const old = new Map(this.rows().map((r) => [r.entry.criterion, r]));
        const byCriterion = new Map(entries.map((e) => [e.criterion, e]));
        this.rows.set(
          CRITERIA.filter((c) => byCriterion.has(c)).map((c) => {
            const entry = byCriterion.get(c)!;
            const prev = old.get(c);
            const keepNote = prev && prev.note !== prev.entry.note;
            return { entry, note: keepNote ? prev.note : entry.note, status: prev?.status === 'conflict' ? 'conflict' : 'idle', message: prev?.status === 'conflict' ? prev.message : '' };
          }),
        );
        this.loading.set(false);
      },
      error: (err: unknown) => {
        this.problem.set(toApiProblem(err));
        this.loading.set(false);
      },
    });
  }

  /** Whether a criterion is among those the decision is waiting for. */
  protected isMissing(c: Criterion): boolean {
    return this.missing().includes(c) && !this.rows().find((r) => r.entry.criterion === c)?.entry.verdict;
  }

  /** Does a basis line rest on a convention rather than a theorem? */
  protected isCommonPractice(line: string): boolean {
    return /common practice/i.test(line);
  }

  /** Basis text without the "(common practice)" marker, which is shown as a tag instead. */
  protected basisText(line: string): string {
    return line.replace(/\s*\(common practice[^)]*\)/i, '');
  }

  /** Radio change: save the verdict with the current note. */
  protected setVerdict(c: Criterion, v: Verdict): void {
    const row = this.row(c);
    if (row) this.save(c, v, row.note);
  }

  /** Note typed (kept locally until the field loses focus). */
  protected typeNote(c: Criterion, text: string): void {
    this.patch(c, { note: text });
  }

  /** Note committed (change event): save it with the current verdict. */
  protected commitNote(c: Criterion): void {
    const row = this.row(c);
    if (row && row.note !== row.entry.note) this.save(c, row.entry.verdict, row.note);
  }

  /** Saves again after a conflict, over the version just reloaded. */
  protected retry(c: Criterion): void {
    const row = this.row(c);
    if (row) this.save(c, row.entry.verdict, row.note);
  }

  private save(c: Criterion, verdict: Verdict | null, note: string): void {
    const row = this.row(c);
    if (!row || this.readOnly()) return;
    this.patch(c, { status: 'saving', message: 'Saving…' });
    this.review.saveEntry(this.requestId(), c, { verdict, note, version: row.entry.version }).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (saved) => {
        const current = this.row(c);
        const typedSince = current && current.note !== note;
        this.patch(c, { entry: saved, note: typedSince ? current.note : saved.note, status: 'saved', message: 'Saved.' });
        void this.announcer.announce(`${CRITERION_LABELS[c]}: saved.`);
      },
      error: (err: unknown) => {
        const p = toApiProblem(err);
        // A 409 "invalid-state" (e.g. not in review yet) is a plain refusal, not someone else's save.
        if (p.status === 409 && p.code !== 'invalid-state') {
          this.patch(c, {
            status: 'conflict',
            message: `Someone else saved this criterion in the meantime; their version is shown now. Your note is kept in the box — check the verdict and save again.`,
          });
          this.reloadEntry(c, note);
        } else {
          this.patch(c, { status: 'error', message: `Not saved: ${p.message}` });
        }
        void this.announcer.announce(`${CRITERION_LABELS[c]}: not saved.`, 'assertive');
      },
    });
  }

  private reloadEntry(c: Criterion, keepNote: string): void {
    this.review.checklist(this.requestId()).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (entries) => {
        const fresh = entries.find((e) => e.criterion === c);
        if (fresh) this.patch(c, { entry: fresh, note: keepNote });
      },
      error: () => this.patch(c, { status: 'error', message: 'Someone else saved this criterion and it could not be reloaded. Reload the page; copy your note first.' }),
    });
  }

  private row(c: Criterion): Row | undefined {
    return this.rows().find((r) => r.entry.criterion === c);
  }

  private patch(c: Criterion, change: Partial<Row>): void {
    this.rows.update((rows) => rows.map((r) => (r.entry.criterion === c ? { ...r, ...change } : r)));
  }
}
