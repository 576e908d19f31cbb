import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { RequestVersionDetail } from '../../../shared/api/filing-types';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import { toApiProblem } from '../api-client/api-error';
import { summarisePlan } from './plan-summary';
import { RequestRecordService } from './request-record-service';

/** Which version to show. */
export interface VersionDialogData {
  requestId: string;
  reference: string;
  revisionNo: number;
}

/** One filed version of a request, read-only, as it was when submitted. */
@Component({
  selector: 'as-version-dialog',
  imports: [DatePipe, MatDialogModule, MatButtonModule, MatProgressBarModule],
  template: `
    <h2 mat-dialog-title>{{ data.reference }} · version {{ data.revisionNo }}</h2>
    <mat-dialog-content>
      @if (loading()) { <mat-progress-bar mode="indeterminate" aria-label="Loading the version" /> }
      @if (error()) { <p class="err" role="alert">{{ error() }}</p> }
      @if (version(); as v) {
        @let s = v.snapshot;
        <p class="meta">Filed {{ v.createdAt | date: 'd MMMM y, HH:mm' }}@if (v.createdBy) { by {{ v.createdBy.name }} }. This is a frozen copy; later edits do not change it.</p>
        @if (s.note) { <p class="note"><strong>What changed:</strong> {{ s.note }}</p> }
        <dl>
          <dt>Title</dt><dd>{{ s.title ?? '—' }}</dd>
          <dt>Purpose</dt><dd class="pre">{{ s.purpose || '—' }}</dd>
          <dt>Decision informed</dt><dd class="pre">{{ s.decisionInformed || '—' }}</dd>
          <dt>Audience</dt><dd>{{ s.audience || '—' }}</dd>
          <dt>Deadline</dt><dd class="as-mono">{{ s.deadline || '—' }}</dd>
          <dt>Design</dt><dd>{{ s.designKind ? kinds[s.designKind] : '—' }}</dd>
          @for (l of planLines(); track l.label) { <dt>{{ l.label }}</dt><dd [class.as-mono]="l.mono">{{ l.value }}</dd> }
          <dt>Sampling and collection</dt><dd class="pre">{{ s.samplingNotes || '—' }}</dd>
          <dt>Reported results</dt>
          <dd>@if (s.reported?.length) { <ul class="as-mono">@for (r of s.reported; track $index) { <li>{{ r.text }}@if (r.term) { [{{ r.term }}] }</li> }</ul> } @else { — }</dd>
          <dt>Data</dt><dd class="as-mono">@if (s.datasetSha256) { SHA-256 {{ s.datasetSha256 }} } @else { — }</dd>
          <dt>Reruns on this version</dt><dd>{{ v.rerunIds.length }}</dd>
        </dl>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end"><button mat-button type="button" mat-dialog-close cdkFocusInitial>Close</button></mat-dialog-actions>
  `,
  styles: `
    dl { display: grid; grid-template-columns: 170px 1fr; gap: 6px 12px; margin: 8px 0 0; }
    dt { font-size: 13px; color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; overflow-wrap: anywhere; }
    ul { margin: 0; padding-left: 18px; font-size: 13px; }
    .pre { white-space: pre-line; }
    .meta { color: var(--mat-sys-on-surface-variant); margin: 0; }
    .note { background: var(--mat-sys-surface-container); padding: 8px 12px; border-radius: 8px; }
    .err { color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VersionDialog implements OnInit {
  protected readonly data = inject<VersionDialogData>(MAT_DIALOG_DATA);
  private readonly api = inject(RequestRecordService);
  protected readonly kinds = DESIGN_KIND_LABELS;
  protected readonly version = signal<RequestVersionDetail | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal('');
  protected readonly planLines = computed(() => {
    const s = this.version()?.snapshot;
    return summarisePlan((s?.plan ?? s?.enginePlan ?? null) as Record<string, unknown> | null).filter((l) => l.label !== 'Design' && l.label !== 'Reported results');
  });

  ngOnInit(): void {
    this.api.version(this.data.requestId, this.data.revisionNo).subscribe({
      next: (v) => { this.version.set(v); this.loading.set(false); },
      error: (err: unknown) => { this.error.set(toApiProblem(err).message); this.loading.set(false); },
    });
  }
}
