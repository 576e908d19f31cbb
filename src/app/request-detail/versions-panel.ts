import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import type { RequestVersionSummary } from '../../../shared/api/workflow';
import { toApiProblem } from '../api-client/api-error';
import { RequestRecordService } from './request-record-service';
import { VersionDialog, type VersionDialogData } from './version-dialog';

/** The saved revisions of a request; each opens read-only as it was filed. */
@Component({
  selector: 'as-versions-panel',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  template: `
    <h2 id="versions-h">Versions</h2>
    @if (loading()) { <p class="none" role="status">Loading versions…</p> }
    @else if (error()) { <p class="err" role="alert">Could not load the versions: {{ error() }} <button mat-button type="button" (click)="load()">Try again</button></p> }
    @else if (!items().length) { <p class="none">No version filed yet. A version is kept each time the request is submitted.</p> }
    @else {
      <ol class="list" reversed>
        @for (v of items(); track v.revisionNo) {
          <li>
            <div class="line">
              <span class="no">Version {{ v.revisionNo }}</span>
              <span class="when as-mono">{{ v.createdAt | date: 'd MMM y, HH:mm' }}</span>
              <button mat-button type="button" (click)="open(v)" [attr.aria-label]="'Read version ' + v.revisionNo">Read</button>
            </div>
            <span class="meta">{{ v.createdBy?.name ?? '' }}@if (v.reason) { · {{ v.reason }} } · {{ v.rerunIds.length }} {{ v.rerunIds.length === 1 ? 'rerun' : 'reruns' }}</span>
          </li>
        }
      </ol>
    }
  `,
  styles: `
    h2 { font: var(--mat-sys-title-medium); margin: 0 0 8px; color: var(--as-ink); }
    .list { list-style: none; margin: 0; padding: 0; display: flex; flex-direction: column; gap: 6px; }
    .line { display: flex; align-items: center; gap: 10px; }
    .no { font-weight: 500; }
    .when, .meta { font-size: 12px; color: var(--mat-sys-on-surface-variant); }
    .line button { margin-left: auto; }
    .none { color: var(--mat-sys-on-surface-variant); font-style: italic; margin: 0; }
    .err { color: var(--mat-sys-error); margin: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VersionsPanel implements OnInit {
  private readonly api = inject(RequestRecordService);
  private readonly dialog = inject(MatDialog);
  /** The request. */
  readonly requestId = input.required<string>();
  /** Its reference, for the dialog title. */
  readonly reference = input('');
  protected readonly items = signal<RequestVersionSummary[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal('');

  ngOnInit(): void {
    this.load();
  }

  /** Loads the list, newest first. */
  load(): void {
    this.loading.set(true);
    this.error.set('');
    this.api.versions(this.requestId()).subscribe({
      next: (list) => { this.items.set([...list].sort((a, b) => b.revisionNo - a.revisionNo)); this.loading.set(false); },
      error: (err: unknown) => { this.error.set(toApiProblem(err).message); this.loading.set(false); },
    });
  }

  /** Opens one version read-only. */
  protected open(v: RequestVersionSummary): void {
    this.dialog.open<VersionDialog, VersionDialogData>(VersionDialog, { data: { requestId: this.requestId(), reference: this.reference(), revisionNo: v.revisionNo }, width: '760px', maxWidth: '95vw' });
  }
}
