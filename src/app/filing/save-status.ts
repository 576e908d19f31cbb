import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { SaveStatus } from './draft-autosave';

/** The draft's save state in a few words, announced politely to screen readers. */
@Component({
  selector: 'as-save-status',
  imports: [DatePipe, MatIconModule],
  template: `
    <span class="s" role="status" aria-live="polite" [attr.data-status]="status()">
      @switch (status()) {
        @case ('saving') { <mat-icon aria-hidden="true">sync</mat-icon>Saving… }
        @case ('pending') { <mat-icon aria-hidden="true">edit</mat-icon>Unsaved changes }
        @case ('saved') { <mat-icon aria-hidden="true">cloud_done</mat-icon>Saved {{ savedAt() | date: 'HH:mm' }} }
        @case ('needs-title') { <mat-icon aria-hidden="true">info</mat-icon>Not saved yet: give the request a title }
        @case ('conflict') { <mat-icon aria-hidden="true">warning</mat-icon>Not saved: changed elsewhere }
        @case ('error') { <mat-icon aria-hidden="true">error</mat-icon>Not saved }
        @default { @if (savedAt()) { Saved {{ savedAt() | date: 'HH:mm' }} } @else { Drafts save as you type } }
      }
    </span>
  `,
  styles: `
    .s { display: inline-flex; gap: 6px; align-items: center; font-size: 13px; color: var(--mat-sys-on-surface-variant); }
    mat-icon { font-size: 18px; width: 18px; height: 18px; }
    [data-status='error'], [data-status='conflict'] { color: var(--mat-sys-error); font-weight: 500; }
    [data-status='saved'] { color: #24531c; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveStatusLine {
  /** Current save state. */
  readonly status = input.required<SaveStatus>();
  /** Time of the last successful save. */
  readonly savedAt = input<Date | null>(null);
}
