import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CellDescriptives, RerunResult, SphericityCorrection, TestRow } from '../../../shared/stats/contract';
import { GG_PREFERRED_BELOW } from '../../../shared/review/checklist-findings';
import { QqPlot } from './qq-plot';
import {
  METHOD_LABELS, RANK_METHOD_LABELS, RECONCILE_LABELS, bounded, df, dfCell, effectCell, estimateCell, headlines, num, pCell, termLabel, testName,
} from './result-text';

let nextId = 0;

/**
 * One rerun result in Assayer's own layout: the headline sentences first, then the
 * tables a reviewer checks (groups, tests, corrections, assumptions, alternatives,
 * comparisons, coefficients, power, reported-versus-recomputed, engine notes).
 * Reusable wherever a RerunResult is shown.
 */
@Component({
  selector: 'as-rerun-result',
  imports: [MatIconModule, QqPlot],
  templateUrl: './rerun-result-view.html',
  styleUrl: './rerun-result-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RerunResultView {
  /** The engine's result. */
  readonly result = input.required<RerunResult>();
  /** Heading level of the section headings (the host page decides the outline). */
  readonly headingLevel = input<2 | 3 | 4>(3);

  protected readonly uid = `as-rr-${nextId++}`;
  protected readonly ggBelow = GG_PREFERRED_BELOW;
  protected readonly methodLabels = METHOD_LABELS;
  protected readonly rankLabels = RANK_METHOD_LABELS;
  protected readonly reconcileLabels = RECONCILE_LABELS;
  protected readonly num = num;
  protected readonly bounded = bounded;
  protected readonly df = df;
  protected readonly dfCell = dfCell;
  protected readonly pCell = pCell;
  protected readonly termLabel = termLabel;
  protected readonly testName = testName;
  protected readonly effectCell = effectCell;
  protected readonly estimateCell = estimateCell;

  protected readonly headlines = computed(() => headlines(this.result()));
  protected readonly factors = computed(() => {
    const first = this.result().descriptives[0];
    return first ? Object.keys(first.levels) : [];
  });
  protected readonly within = computed(() => this.result().tests.filter((t) => t.sphericity || t.corrections));
  protected readonly hasEstimates = computed(() => this.result().tests.some((t) => t.estimate !== undefined));
  protected readonly anyRawP = computed(() => (this.result().comparisons ?? []).some((c) => c.p !== null));
  protected readonly anyVif = computed(() => (this.result().coefficients ?? []).some((c) => c.vif !== undefined));
  protected readonly normalityNote = computed(() => {
    const n = this.result().assumptions?.normality;
    return n ? `Shapiro–Wilk W = ${bounded(n.W, 3)}, p ${pCell(n.p).startsWith('<') || pCell(n.p).startsWith('>') ? '' : '= '}${pCell(n.p)}.` : '';
  });

  /** Level of one cell for a factor column. */
  protected levelOf(cell: CellDescriptives, factor: string): string {
    return cell.levels[factor] ?? '';
  }

  /** The corrections present on a within-subject test, labelled, in the usual order. */
  protected corrections(t: TestRow): { key: 'gg' | 'hf' | 'lb'; label: string; value: SphericityCorrection }[] {
    const c = t.corrections;
    if (!c) return [];
    return [
      { key: 'gg' as const, label: 'Greenhouse–Geisser', value: c.gg },
      { key: 'hf' as const, label: 'Huynh–Feldt', value: c.hf },
      { key: 'lb' as const, label: 'Lower bound', value: c.lb },
    ].filter((x) => x.value !== undefined);
  }

  /** Which row applies, by the rule the checklist uses (common practice). */
  protected applied(t: TestRow): 'none' | 'gg' | 'hf' {
    if (!t.sphericity || !t.corrections || t.sphericity.p >= this.result().alpha) return 'none';
    return t.corrections.gg.epsilon < GG_PREFERRED_BELOW ? 'gg' : 'hf';
  }

  /** "p = .004" / "p < .001" with the operator, for running text. */
  protected pText(p: number | undefined): string {
    const c = pCell(p);
    return c.startsWith('<') || c.startsWith('>') ? `p ${c}` : `p = ${c}`;
  }
}
