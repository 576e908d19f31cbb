import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { DecisionView, LetterView } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { DECISION_LABELS, LETTER_STATUS_LABELS } from './decision-labels';
import { RequestRecordService } from './request-record-service';

/** The latest decision (if any) and the letters issued for it, with download and verify links. */
@Component({
  selector: 'as-outcome-panel',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule],
  template: `
    <h2 id="outcome-h">Decision and letters</h2>
    @if (decisionError()) { <p class="err" role="alert">Could not load the decision: {{ decisionError() }}</p> }
    @if (decision(); as d) {
      <div class="decision" [attr.data-decision]="d.decision">
        <span class="label">{{ decisionLabels[d.decision] }}</span>
        <span class="meta">{{ d.decidedBy?.name ?? 'Reviewer' }}, {{ d.decidedAt | date: 'd MMMM y' }}</span>
      </div>
      @if (d.conditions.length) {
        <p class="sub">Conditions</p>
        <ol class="conds">@for (c of d.conditions; track $index) { <li>{{ c }}</li> }</ol>
      }
      @if (d.rationale) { <p class="sub">Reasoning</p><p class="pre">{{ d.rationale }}</p> }
    } @else if (!decisionLoading() && !decisionError()) {
      <p class="none">No decision yet.</p>
    }

    @if (lettersError()) { <p class="err" role="alert">Could not load the letters: {{ lettersError() }}</p> }
    @if (letters().length) {
      <ul class="letters" aria-label="Letters">
        @for (l of letters(); track l.code) {
          <li>
            <div class="lhead">
              <span class="no">Letter {{ l.letterNo }}</span>
              <span class="chip" [attr.data-status]="l.status">{{ statusLabels[l.status] }}</span>
            </div>
            <span class="meta">{{ decisionLabels[l.decision] }}@if (l.signedBy) { · signed by {{ l.signedBy.name }} }@if (l.signedAt) { on {{ l.signedAt | date: 'd MMM y' }} }</span>
            <span class="meta as-mono">Code {{ l.code }}</span>
            <div class="links">
              <a mat-stroked-button [href]="l.downloadUrl" download><mat-icon>download</mat-icon>Download PDF</a>
              <a mat-button [routerLink]="['/verify', l.code]"><mat-icon>verified</mat-icon>Verify</a>
            </div>
          </li>
        }
      </ul>
    } @else if (decision() && !lettersError()) {
      <p class="none">The letter has not been signed yet.</p>
    }
  `,
  styles: `
    h2 { font: var(--mat-sys-title-medium); margin: 0 0 8px; color: var(--as-ink); }
    .decision { display: flex; flex-direction: column; padding: 8px 12px; border-radius: 8px; background: var(--as-state-decided-bg); color: var(--as-state-decided-fg); }
    .decision[data-decision='revise-and-resubmit'] { background: var(--as-state-revision-requested-bg); color: var(--as-state-revision-requested-fg); }
    .decision[data-decision='not-endorsed'] { background: var(--as-state-withdrawn-bg); color: var(--as-state-withdrawn-fg); }
    .label { font-weight: 600; }
    .meta { font-size: 12px; color: var(--mat-sys-on-surface-variant); display: block; }
    .decision .meta { color: inherit; }
    .sub { font-size: 12px; font-weight: 600; margin: 10px 0 2px; color: var(--mat-sys-on-surface-variant); }
    .conds { margin: 0; padding-left: 20px; }
    .pre { white-space: pre-line; margin: 0; }
    .letters { list-style: none; margin: 12px 0 0; padding: 0; display: flex; flex-direction: column; gap: 10px; }
    .letters li { border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; padding: 8px 10px; }
    .lhead { display: flex; justify-content: space-between; align-items: center; }
    .no { font-weight: 500; }
    .chip { font-size: 12px; padding: 1px 8px; border-radius: 999px; background: var(--as-state-decided-bg); color: var(--as-state-decided-fg); }
    .chip[data-status='awaiting-countersign'] { background: var(--as-state-revision-requested-bg); color: var(--as-state-revision-requested-fg); }
    .chip[data-status='superseded'] { background: var(--as-state-draft-bg); color: var(--as-state-draft-fg); text-decoration: line-through; }
    .links { display: flex; gap: 6px; flex-wrap: wrap; margin-top: 6px; }
    .none { color: var(--mat-sys-on-surface-variant); font-style: italic; margin: 0; }
    .err { color: var(--mat-sys-error); margin: 0 0 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutcomePanel implements OnInit {
  private readonly api = inject(RequestRecordService);
  /** The request. */
  readonly requestId = input.required<string>();
  protected readonly decisionLabels = DECISION_LABELS;
  protected readonly statusLabels = LETTER_STATUS_LABELS;
  protected readonly decision = signal<DecisionView | null>(null);
  protected readonly decisionLoading = signal(true);
  protected readonly decisionError = signal('');
  protected readonly letters = signal<LetterView[]>([]);
  protected readonly lettersError = signal('');

  ngOnInit(): void {
    const id = this.requestId();
    this.api.decision(id).subscribe({
      next: (d) => { this.decision.set(d); this.decisionLoading.set(false); },
      error: (err: unknown) => {
        const p = toApiProblem(err);
        // 404 means no decision has been recorded yet.
        if (p.status !== 404) this.decisionError.set(p.message);
        this.decisionLoading.set(false);
      },
    });
    this.api.letters(id).subscribe({
      next: (l) => this.letters.set([...l].sort((a, b) => b.letterNo - a.letterNo)),
      error: (err: unknown) => { const p = toApiProblem(err); if (p.status !== 404) this.lettersError.set(p.message); },
    });
  }
}
