import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { COMPARISON_METHODS, type AnalysisPlan, type ComparisonMethod } from '../../../shared/stats/contract';
import type { RerunBody } from '../../../shared/api/workflow';
import { METHOD_LABELS } from '../results/result-text';

/**
 * A small form for a plan variant: sums-of-squares type, alpha and the comparison
 * procedure per factor, with a label; only changed fields go into the override.
 */
@Component({
  selector: 'as-variant-form',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <form novalidate (submit)="$event.preventDefault(); send()" class="variant" aria-labelledby="variant-h">
      <h3 id="variant-h">New variant of the plan</h3>
      <p class="lede">Runs the filed data again with these changes; the filed plan and earlier reruns stay as they are.</p>
      <div class="row">
        <mat-form-field appearance="outline" class="label">
          <mat-label>Label</mat-label>
          <input matInput required maxlength="80" [value]="label()" (input)="label.set($any($event.target).value)" placeholder="e.g. with Games–Howell" />
          @if (tried() && !label().trim()) { <mat-error>Give the variant a label so it can be told apart in the list.</mat-error> }
        </mat-form-field>
        <mat-form-field appearance="outline" class="alpha">
          <mat-label>Alpha</mat-label>
          <input matInput type="number" step="any" min="0.001" max="0.49" inputmode="decimal" [value]="alpha()" (input)="alpha.set(+$any($event.target).value)" />
        </mat-form-field>
        @if (hasBetweenAnova()) {
          <mat-form-field appearance="outline" class="ss">
            <mat-label>Sums of squares</mat-label>
            <mat-select [value]="ssType()" (selectionChange)="ssType.set($event.value)">
              <mat-option [value]="3">Type 3</mat-option>
              <mat-option [value]="2">Type 2</mat-option>
            </mat-select>
          </mat-form-field>
        }
      </div>
      @if (factors().length) {
        <fieldset>
          <legend>Pairwise comparisons</legend>
          @for (f of factors(); track f) {
            <mat-form-field appearance="outline">
              <mat-label>{{ f }}</mat-label>
              <mat-select [value]="methodFor(f)" (selectionChange)="setMethod(f, $event.value)">
                <mat-option value="none">No comparisons</mat-option>
                @for (m of methods; track m) { <mat-option [value]="m">{{ methodLabels[m] }}</mat-option> }
              </mat-select>
            </mat-form-field>
          }
        </fieldset>
      }
      @if (tried() && alphaProblem()) { <p class="error" role="alert">{{ alphaProblem() }}</p> }
      <div class="actions">
        <button mat-button type="button" (click)="cancel.emit()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">Run this variant</button>
      </div>
    </form>
  `,
  styles: `
    .variant { border: 1px dashed var(--mat-sys-outline); border-radius: 10px; padding: 12px 14px; margin: 12px 0; }
    h3 { margin: 0; font-size: 15px; color: var(--as-ink); }
    .lede { margin: 2px 0 10px; font-size: 13px; color: var(--mat-sys-on-surface-variant); }
    .row, fieldset { display: flex; flex-wrap: wrap; gap: 0 12px; }
    .label { flex: 1 1 260px; } .alpha { width: 120px; } .ss { width: 170px; }
    fieldset { border: none; padding: 0; margin: 0; }
    legend { font-size: 13px; font-weight: 600; margin-bottom: 6px; color: var(--mat-sys-on-surface-variant); }
    .error { color: var(--mat-sys-error); margin: 0 0 8px; }
    .actions { display: flex; justify-content: flex-end; gap: 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VariantForm {
  /** The plan the variant starts from (the latest rerun's snapshot). */
  readonly base = input.required<AnalysisPlan>();
  /** True while a rerun is being started. */
  readonly busy = input(false);
  /** The variant to run. */
  readonly run = output<RerunBody>();
  /** The reviewer closed the form. */
  readonly cancel = output<void>();

  protected readonly methods = COMPARISON_METHODS;
  protected readonly methodLabels = METHOD_LABELS;
  protected readonly label = signal('');
  protected readonly alpha = signal(0.05);
  protected readonly ssType = signal<2 | 3>(3);
  protected readonly chosen = signal<Record<string, ComparisonMethod | 'none'>>({});
  protected readonly tried = signal(false);
  protected readonly factors = computed(() => [...(this.base().between ?? []), ...(this.base().within ?? [])]);
  protected readonly hasBetweenAnova = computed(() => this.base().design === 'anova' && (this.base().between ?? []).length > 0);
  protected readonly alphaProblem = computed(() =>
    this.alpha() > 0 && this.alpha() < 0.5 ? '' : 'Alpha must be between 0 and 0.5 (usually 0.05).');

  constructor() {
    effect(() => {
      const b = this.base();
      this.alpha.set(b.alpha ?? 0.05);
      this.ssType.set(b.ssType ?? 3);
      const m: Record<string, ComparisonMethod | 'none'> = {};
      for (const c of b.comparisons ?? []) m[c.factor] = c.method;
      this.chosen.set(m);
    });
  }

  /** Current procedure for a factor. */
  protected methodFor(f: string): ComparisonMethod | 'none' {
    return this.chosen()[f] ?? 'none';
  }

  /** Picks a procedure for a factor. */
  protected setMethod(f: string, m: ComparisonMethod | 'none'): void {
    this.chosen.update((c) => ({ ...c, [f]: m }));
  }

  /** Builds the override from what differs from the base and emits it. */
  protected send(): void {
    this.tried.set(true);
    if (!this.label().trim() || this.alphaProblem()) return;
    const b = this.base();
    const override: RerunBody['planOverride'] = {};
    if (this.alpha() !== (b.alpha ?? 0.05)) override.alpha = this.alpha();
    if (this.hasBetweenAnova() && this.ssType() !== (b.ssType ?? 3)) override.ssType = this.ssType();
    const comparisons = this.factors().filter((f) => this.methodFor(f) !== 'none').map((f) => ({ factor: f, method: this.methodFor(f) as ComparisonMethod }));
    if (JSON.stringify(comparisons) !== JSON.stringify(b.comparisons ?? [])) override.comparisons = comparisons;
    this.run.emit({ label: this.label().trim(), planOverride: override });
  }
}
