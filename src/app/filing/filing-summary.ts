import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import type { DepartmentRef } from '../../../shared/api/types';
import type { DatasetPreview } from '../../../shared/api/workflow';
import { DESIGN_KIND_LABELS } from '../../../shared/review/plan-mapping';
import type { DraftFields } from './filing-draft';
import { METHOD_SHORT } from './plan-texts';

/** The whole request on one page before it is submitted, with a way back to each step. */
@Component({
  selector: 'as-filing-summary',
  imports: [MatButtonModule],
  template: `
    @let f = fields();
    <div class="grid">
      <section aria-labelledby="sum-p"><h3 id="sum-p">Purpose <button mat-button type="button" (click)="edit.emit(0)">Edit</button></h3>
        <dl>
          <dt>Title</dt><dd>{{ f.title || '—' }}</dd>
          <dt>Purpose</dt><dd>{{ f.purpose || '—' }}</dd>
          <dt>Decision informed</dt><dd>{{ f.decisionInformed || '—' }}</dd>
          <dt>Audience</dt><dd>{{ f.audience || '—' }}</dd>
          <dt>Deadline</dt><dd class="as-mono">{{ f.deadline || '—' }}</dd>
          <dt>Department</dt><dd>{{ department() }}</dd>
        </dl>
      </section>
      <section aria-labelledby="sum-d"><h3 id="sum-d">Design <button mat-button type="button" (click)="edit.emit(1)">Edit</button></h3>
        <dl>
          <dt>Kind</dt><dd>{{ f.plan.designKind ? kindLabels[f.plan.designKind] : '—' }}</dd>
          <dt>Outcome</dt><dd class="as-mono">{{ f.plan.outcome || '—' }}</dd>
          @if (f.plan.between.length) { <dt>Between factors</dt><dd class="as-mono">{{ factors(f.plan.between) }}</dd> }
          @if (f.plan.within.length) { <dt>Within factors</dt><dd class="as-mono">{{ factors(f.plan.within) }}</dd> }
          @if (f.plan.subject) { <dt>Subject</dt><dd class="as-mono">{{ f.plan.subject }}</dd> }
          @if (f.plan.predictors.length) { <dt>Predictors</dt><dd class="as-mono">{{ f.plan.predictors.join(', ') }}</dd> }
          <dt>Alpha</dt><dd class="as-mono">{{ f.plan.alpha }}</dd>
          @if (f.plan.comparisons.length) { <dt>Comparisons</dt><dd>{{ comparisons() }}</dd> }
          @if (f.plan.comparisons.length || f.plan.submitterCorrection) { <dt>Correction used</dt><dd>{{ f.plan.submitterCorrection ? methods[f.plan.submitterCorrection] : '—' }}</dd> }
          <dt>Sampling</dt><dd class="pre">{{ f.samplingNotes || '—' }}</dd>
        </dl>
      </section>
      <section aria-labelledby="sum-data"><h3 id="sum-data">Data <button mat-button type="button" (click)="edit.emit(2)">Edit</button></h3>
        @if (dataset(); as d) {
          <dl><dt>File</dt><dd class="as-mono">{{ d.filename }}</dd><dt>Size</dt><dd>{{ d.rows }} rows, {{ d.columns.length }} columns</dd>
            <dt>Identifier check</dt><dd>{{ d.blocked ? 'Blocked: answer the flagged columns' : d.identifierFindings.length ? 'Flagged columns answered' : 'No identifier columns found' }}</dd></dl>
        } @else { <p class="none">No data file yet.</p> }
      </section>
      <section aria-labelledby="sum-r"><h3 id="sum-r">Reported results <button mat-button type="button" (click)="edit.emit(3)">Edit</button></h3>
        @if (f.reported.length) {
          <ol class="as-mono">@for (r of f.reported; track $index) { <li>{{ r.text }}@if (r.term) { <span class="term"> [{{ r.term }}]</span> }</li> }</ol>
        } @else { <p class="none">None entered. The reviewer can still rerun the analysis, but cannot check what you intend to publish.</p> }
      </section>
    </div>
  `,
  styles: `
    .grid { display: grid; grid-template-columns: repeat(auto-fit, minmax(420px, 1fr)); gap: 16px; }
    section { border: 1px solid var(--mat-sys-outline-variant); border-radius: 10px; padding: 8px 14px 12px; }
    h3 { display: flex; justify-content: space-between; align-items: center; font: var(--mat-sys-title-small); margin: 0; }
    dl { display: grid; grid-template-columns: 120px 1fr; gap: 4px 10px; margin: 4px 0 0; font-size: 14px; }
    dt { color: var(--mat-sys-on-surface-variant); font-size: 13px; }
    dd { margin: 0; overflow-wrap: anywhere; }
    .pre { white-space: pre-line; }
    ol { margin: 4px 0 0; padding-left: 20px; font-size: 13px; line-height: 1.7; }
    .term { color: var(--mat-sys-on-surface-variant); }
    .none { color: var(--mat-sys-on-surface-variant); font-style: italic; margin: 4px 0 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FilingSummary {
  /** The form's fields. */
  readonly fields = input.required<DraftFields>();
  /** The current dataset. */
  readonly dataset = input<DatasetPreview | null>(null);
  /** Departments, to name the chosen one. */
  readonly departments = input<DepartmentRef[]>([]);
  /** The person wants to go back to a step. */
  readonly edit = output<number>();

  protected readonly kindLabels = DESIGN_KIND_LABELS;
  protected readonly methods = METHOD_SHORT;
  protected readonly department = computed(() => this.departments().find((d) => d.id === this.fields().departmentId)?.name ?? '—');
  protected readonly comparisons = computed(() => this.fields().plan.comparisons.map((c) => `${c.factor} (${METHOD_SHORT[c.method]})`).join('; '));

  protected factors(list: { column: string; levels: string[] }[]): string {
    return list.map((f) => (f.levels.length ? `${f.column}: ${f.levels.join(', ')}` : f.column)).join('; ');
  }
}
