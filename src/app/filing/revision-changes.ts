import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { toApiProblem } from '../api-client/api-error';
import { FilingService, type RevisionRequestView } from './filing-service';

/** The reviewer's required changes for a request returned for revision. */
@Component({
  selector: 'as-revision-changes',
  imports: [DatePipe, MatIconModule],
  template: `
    @if (view(); as v) {
      <section class="box" aria-labelledby="rev-h">
        <h2 id="rev-h"><mat-icon aria-hidden="true">assignment_return</mat-icon>Changes the reviewer asked for</h2>
        <p class="by">{{ v.requestedBy?.name ?? 'The reviewer' }}, {{ v.requestedAt | date: 'd MMMM y' }}</p>
        <ol>@for (c of v.changes; track $index) { <li>{{ c }}</li> }</ol>
        @if (v.message) { <p class="msg">{{ v.message }}</p> }
      </section>
    } @else if (error()) {
      <p class="err" role="note">The reviewer's list of changes could not be loaded: {{ error() }}</p>
    }
  `,
  styles: `
    .box { background: var(--as-state-revision-requested-bg); color: var(--as-state-revision-requested-fg); border-radius: 12px; padding: 12px 18px; }
    h2 { display: flex; gap: 8px; align-items: center; font: var(--mat-sys-title-medium); margin: 0; }
    .by { margin: 2px 0 6px; font-size: 13px; }
    ol { margin: 0; padding-left: 22px; line-height: 1.6; }
    .msg { margin: 8px 0 0; white-space: pre-line; }
    .err { color: var(--mat-sys-on-surface-variant); font-style: italic; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionChanges implements OnInit {
  private readonly api = inject(FilingService);
  /** The request. */
  readonly requestId = input.required<string>();
  protected readonly view = signal<RevisionRequestView | null>(null);
  protected readonly error = signal('');

  ngOnInit(): void {
    this.api.revisionRequest(this.requestId()).subscribe({
      next: (v) => this.view.set(v),
      error: (err: unknown) => {
        const p = toApiProblem(err);
        if (p.status !== 404) this.error.set(p.message);
      },
    });
  }
}
