import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatRadioModule } from '@angular/material/radio';
import { DECISIONS, type Criterion, type Decision, type RequestDetail } from '../../../shared/api/types';
import type { DecisionView, LetterView, SignBody } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { AuthService } from '../auth/auth-service';
import { missingVerdicts } from './missing-verdicts';
import { CRITERION_LABELS, DECISION_LABELS, LETTER_STATUS_LABELS, shortHash } from './review-labels';
import { ReviewService } from './review-service';
import { RevisionAnswer, RevisionDialog } from './revision-dialog';
import { SignDialog, SignDialogData } from './sign-dialog';

/**
 * The end of a review: ask for a revision, or decide (with conditions and rationale), then
 * sign the letter; the head countersigns when the office requires it. Letters are listed with
 * download and verification links.
 */
@Component({
  selector: 'as-decision-panel',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatRadioModule],
  templateUrl: './decision-panel.html',
  styleUrl: './decision-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecisionPanel implements OnInit {
  private readonly review = inject(ReviewService);
  private readonly dialog = inject(MatDialog);
  private readonly auth = inject(AuthService);
  private readonly destroyRef = inject(DestroyRef);
  private readonly announcer = inject(LiveAnnouncer);

  /** The request under review. */
  readonly request = input.required<RequestDetail>();
  /** Criteria the server said still need a verdict (shown beside the checklist too). */
  readonly missingChange = output<Criterion[]>();
  /** Something changed the request (state, version): the page reloads it. */
  readonly changed = output<void>();

  protected readonly decisions = DECISIONS;
  protected readonly decisionLabels = DECISION_LABELS;
  protected readonly criterionLabels = CRITERION_LABELS;
  protected readonly letterStatus = LETTER_STATUS_LABELS;
  protected readonly shortHash = shortHash;

  protected readonly decision = signal<DecisionView | null>(null);
  protected readonly letters = signal<LetterView[]>([]);
  protected readonly loading = signal(true);
  protected readonly choice = signal<Decision | null>(null);
  protected readonly conditions = signal('');
  protected readonly rationale = signal('');
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly missing = signal<Criterion[]>([]);
  protected readonly tried = signal(false);
  protected readonly notice = signal<string | null>(null);

  protected readonly isReviewer = computed(() => {
    const me = this.auth.me();
    return !!me && me.id === this.request().reviewer?.id;
  });
  protected readonly isHead = computed(() => this.auth.hasAnyRole(['head']));
  protected readonly canDecide = computed(() => this.isReviewer() && (this.request().can.decide || this.request().can.review));
  protected readonly current = computed(() => this.letters().find((l) => l.status !== 'superseded') ?? null);
  protected readonly canSign = computed(() => !!this.decision() && this.isReviewer() && !this.current());
  protected readonly canCountersign = computed(() => this.isHead() && this.current()?.status === 'awaiting-countersign');
  protected readonly conditionList = computed(() => this.conditions().split('\n').map((l) => l.replace(/^\s*[-*]\s*/, '').trim()).filter(Boolean));
  protected readonly formProblem = computed(() => {
    if (!this.choice()) return 'Choose a decision.';
    if (this.choice() === 'endorse-with-conditions' && !this.conditionList().length) return 'List at least one condition for an endorsement with conditions.';
    if (!this.rationale().trim()) return 'Give the reasoning; it appears in the letter.';
    return '';
  });

  ngOnInit(): void {
    this.load();
  }

  /** Fetches the decision (404 before one exists) and the letters. */
  load(): void {
    const id = this.request().id;
    this.review.decision(id).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (d) => { this.decision.set(d ?? null); this.loading.set(false); },
      error: (err: unknown) => {
        const p = toApiProblem(err);
        this.decision.set(null);
        this.loading.set(false);
        if (p.status !== 404) this.error.set(`Could not load the decision: ${p.message}`);
      },
    });
    this.review.letters(id).pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (l) => this.letters.set(l),
      error: () => this.letters.set([]),
    });
  }

  /** Sends the decision; a 422 lists the criteria still without a verdict. */
  protected decide(): void {
    this.tried.set(true);
    if (this.formProblem() || this.busy()) return;
    this.busy.set(true);
    this.error.set(null);
    const r = this.request();
    this.review.decide(r.id, { decision: this.choice()!, conditions: this.conditionList(), rationale: this.rationale().trim(), version: r.version })
      .pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
        next: (d) => {
          this.busy.set(false);
          this.decision.set(d);
          this.setMissing([]);
          this.notice.set(`Decision recorded: ${DECISION_LABELS[d.decision]}. Sign the letter to issue it.`);
          void this.announcer.announce('Decision recorded.');
          this.changed.emit();
        },
        error: (err: unknown) => {
          this.busy.set(false);
          const missing = missingVerdicts(err);
          this.setMissing(missing);
          const p = toApiProblem(err);
          this.error.set(missing.length
            ? `The checklist is not complete: ${missing.length} ${missing.length === 1 ? 'criterion needs' : 'criteria need'} a verdict first.`
            : p.message);
          void this.announcer.announce('The decision was not recorded.', 'assertive');
        },
      });
  }

  /** Opens the revision dialog and sends the request. */
  protected askRevision(): void {
    const r = this.request();
    this.dialog.open<RevisionDialog, { reference: string }, RevisionAnswer>(RevisionDialog, { data: { reference: r.reference }, width: '640px', autoFocus: 'first-tabbable' })
      .afterClosed().subscribe((answer) => {
        if (!answer) return;
        this.busy.set(true);
        this.review.requestRevision(r.id, { changes: answer.changes, message: answer.message || undefined, version: r.version })
          .pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
            next: () => {
              this.busy.set(false);
              this.notice.set('Revision requested. The submitter has been told what to change.');
              void this.announcer.announce('Revision requested.');
              this.changed.emit();
            },
            error: (err: unknown) => { this.busy.set(false); this.error.set(toApiProblem(err).message); },
          });
      });
  }

  /** The deliberate signing step, then POST sign or countersign. */
  protected openSign(mode: 'sign' | 'countersign'): void {
    const r = this.request();
    const d = this.decision();
    const data: SignDialogData = { reference: r.reference, decisionLabel: d ? DECISION_LABELS[d.decision] : '', mode, askPassword: true };
    this.dialog.open<SignDialog, SignDialogData, SignBody>(SignDialog, { data, width: '560px', autoFocus: 'first-tabbable' })
      .afterClosed().subscribe((body) => {
        if (!body) return;
        this.busy.set(true);
        this.error.set(null);
        const call = mode === 'sign' ? this.review.sign(r.id, body) : this.review.countersign(r.id, body);
        call.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
          next: ({ letter, message }) => {
            this.busy.set(false);
            this.letters.update((l) => [letter, ...l.filter((x) => x.code !== letter.code)]);
            this.notice.set(letter.status === 'awaiting-countersign'
              ? `Signed. The letter now waits for the office head’s countersignature. ${message}`
              : `The letter is issued. Verification code ${letter.code}. ${message}`);
            void this.announcer.announce(mode === 'sign' ? 'Letter signed.' : 'Letter countersigned.');
            this.changed.emit();
          },
          error: (err: unknown) => { this.busy.set(false); this.error.set(`Not signed: ${toApiProblem(err).message}`); },
        });
      });
  }

  /** Public path of the verification page for a letter. */
  protected verifyPath(l: LetterView): string {
    try {
      return new URL(l.verifyUrl, 'http://x').pathname;
    } catch {
      return `/verify/${l.code}`;
    }
  }

  private setMissing(list: Criterion[]): void {
    this.missing.set(list);
    this.missingChange.emit(list);
  }
}
