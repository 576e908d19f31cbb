import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { ColumnProfile, DatasetPreview } from '../../../shared/api/workflow';

const KIND_LABELS: Record<ColumnProfile['kind'], string> = { numeric: 'Numbers', categorical: 'Categories', 'identifier-like': 'Identifier-like', empty: 'Empty' };

/** What the server read from an upload: the columns with their kinds and missing counts, then the first rows. */
@Component({
  selector: 'as-dataset-preview-table',
  template: `
    @let d = dataset();
    <div class="scroll" tabindex="0" role="region" [attr.aria-label]="'Columns of ' + d.filename">
      <table class="cols">
        <caption>Columns as read ({{ d.columns.length }})</caption>
        <thead><tr><th scope="col">Column</th><th scope="col">Read as</th><th scope="col" class="num">Missing</th><th scope="col" class="num">Distinct</th><th scope="col">Values</th></tr></thead>
        <tbody>
          @for (c of d.columns; track c.name) {
            <tr>
              <th scope="row" class="as-mono">{{ c.name }}</th>
              <td><span class="kind" [attr.data-kind]="c.kind">{{ kindLabel(c) }}</span></td>
              <td class="num as-mono" [class.warn]="c.missing > 0">{{ c.missing }}</td>
              <td class="num as-mono">{{ c.distinct }}</td>
              <td class="ex">@if (c.min !== undefined && c.max !== undefined) { <span class="as-mono">{{ c.min }} to {{ c.max }}</span> } @else { {{ c.examples.join(', ') }}@if (c.distinct > c.examples.length) {, …} }</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
    <div class="scroll" tabindex="0" role="region" [attr.aria-label]="'First rows of ' + d.filename">
      <table class="rows">
        <caption>First {{ d.previewRows.length }} of {{ d.rows }} rows</caption>
        <thead><tr>@for (c of d.columns; track c.name) { <th scope="col" class="as-mono">{{ c.name }}</th> }</tr></thead>
        <tbody>
          @for (row of d.previewRows; track $index) {
            <tr>@for (cell of row; track $index) { <td class="as-mono" [class.na]="cell === '' || cell === 'NA'">{{ cell === '' ? '—' : cell }}</td> }</tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styles: `
    :host { display: flex; flex-direction: column; gap: 14px; }
    .scroll { overflow: auto; max-height: 360px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; }
    table { border-collapse: collapse; font-size: 13px; width: 100%; }
    caption { text-align: left; font-weight: 600; padding: 8px 10px; background: var(--mat-sys-surface-container-low); }
    th, td { padding: 4px 10px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: left; white-space: nowrap; }
    thead th { position: sticky; top: 0; background: var(--mat-sys-surface-container); font-size: 12px; }
    .num { text-align: right; }
    .warn { color: #6b4507; font-weight: 600; }
    .na { color: var(--mat-sys-on-surface-variant); }
    .ex { white-space: normal; color: var(--mat-sys-on-surface-variant); }
    .kind { font-size: 12px; padding: 1px 8px; border-radius: 999px; background: var(--mat-sys-surface-container-high); }
    .kind[data-kind='identifier-like'] { background: #fbecd0; color: #6b4507; }
    .kind[data-kind='numeric'] { background: #d9f0ef; color: #0d4f4c; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DatasetPreviewTable {
  /** The uploaded dataset. */
  readonly dataset = input.required<DatasetPreview>();

  protected kindLabel(c: ColumnProfile): string {
    return KIND_LABELS[c.kind] ?? c.kind;
  }
}
