import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { DatasetPreview } from '../../../shared/api/workflow';

/** Shortest reason accepted for keeping an identifier column. */
export const MIN_IDENTIFIER_REASON = 10;

/**
 * The panel listing columns that look like direct identifiers, why each was flagged, and the two
 * ways out: upload a file without the column, or say why the column is needed.
 */
@Component({
  selector: 'as-identifier-block',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <section class="panel" [class.ok]="!dataset().blocked" aria-labelledby="idb-h">
      <h3 id="idb-h"><mat-icon aria-hidden="true">{{ dataset().blocked ? 'gpp_maybe' : 'verified_user' }}</mat-icon>
        {{ dataset().blocked ? 'Possible personal identifiers: submission is blocked' : 'Identifier columns: all accounted for' }}</h3>
      <p class="why">The office keeps only the data an analysis needs. Names, e-mail addresses, ID numbers and birth dates identify people directly;
        remove such columns, or say why the review needs them.</p>
      <ul>
        @for (f of dataset().identifierFindings; track f.column) {
          @let confirmed = confirmation(f.column);
          <li>
            <div class="col"><span class="as-mono name">{{ f.column }}</span>
              @if (confirmed) { <span class="tag">Kept: needed</span> } @else { <span class="tag open">Needs your answer</span> }</div>
            <p class="reason"><strong>Why flagged:</strong> {{ f.reason }}</p>
            @if (confirmed) {
              <p class="reason"><strong>Your reason:</strong> {{ confirmed }}</p>
            } @else if (open() === f.column) {
              <mat-form-field appearance="outline" class="wide" subscriptSizing="dynamic">
                <mat-label>Why the review needs "{{ f.column }}"</mat-label>
                <textarea matInput rows="2" [(ngModel)]="reason" [attr.aria-describedby]="'idr-' + $index"></textarea>
                <mat-hint [id]="'idr-' + $index">At least {{ min }} characters; the reviewer sees this.</mat-hint>
              </mat-form-field>
              <div class="btns">
                <button mat-flat-button type="button" [disabled]="reason.trim().length < min || busy()" (click)="sendReason(f.column)">Keep the column with this reason</button>
                <button mat-button type="button" (click)="open.set(null)">Cancel</button>
              </div>
            } @else {
              <div class="btns">
                <button mat-stroked-button type="button" [disabled]="busy()" (click)="replace.emit()"><mat-icon>upload_file</mat-icon>Upload a file without it</button>
                <button mat-button type="button" [disabled]="busy()" (click)="openReason(f.column)">This column is needed…</button>
              </div>
            }
          </li>
        }
      </ul>
      @if (error()) { <p class="err" role="alert">{{ error() }}</p> }
    </section>
  `,
  styles: `
    .panel { border: 2px solid #b3261e; background: #fdf3f2; border-radius: 10px; padding: 12px 16px; }
    .panel.ok { border-color: #24531c; background: #eef6ec; }
    h3 { display: flex; gap: 8px; align-items: center; margin: 0 0 4px; font: var(--mat-sys-title-small); }
    .why { margin: 0 0 8px; font-size: 14px; }
    ul { list-style: none; margin: 0; padding: 0; display: flex; flex-direction: column; gap: 10px; }
    li { background: #fff; border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; padding: 8px 12px; }
    .col { display: flex; gap: 10px; align-items: center; }
    .name { font-weight: 500; }
    .tag { font-size: 12px; padding: 1px 8px; border-radius: 999px; background: #dff0dc; color: #24531c; }
    .tag.open { background: #fbecd0; color: #6b4507; }
    .reason { margin: 4px 0; font-size: 14px; }
    .btns { display: flex; gap: 8px; flex-wrap: wrap; margin-top: 4px; }
    .wide { width: 100%; margin-top: 6px; }
    .err { color: var(--mat-sys-error); margin: 8px 0 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IdentifierBlock {
  /** The dataset with its findings. */
  readonly dataset = input.required<DatasetPreview>();
  /** True while a call is running. */
  readonly busy = input(false);
  /** Message of a failed confirmation. */
  readonly error = input('');
  /** The person confirmed a column as needed (with at least the minimum reason). */
  readonly confirm = output<{ column: string; reason: string }>();
  /** The person wants to upload a file without the flagged columns. */
  readonly replace = output<void>();

  protected readonly min = MIN_IDENTIFIER_REASON;
  protected readonly open = signal<string | null>(null);
  protected reason = '';
  private readonly confirmations = computed(() => new Map(this.dataset().identifierConfirmations.map((c) => [c.column, c.reason])));

  /** The confirmed reason for a column, or ''. */
  protected confirmation(column: string): string {
    return this.confirmations().get(column) ?? '';
  }

  /** Opens the reason field for one column. */
  protected openReason(column: string): void {
    this.reason = '';
    this.open.set(column);
  }

  /** Sends the reason. */
  protected sendReason(column: string): void {
    const reason = this.reason.trim();
    if (reason.length < MIN_IDENTIFIER_REASON) return;
    this.confirm.emit({ column, reason });
    this.open.set(null);
  }
}
