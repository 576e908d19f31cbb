import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { ReviewerLoad } from '../../../shared/api/workflow';

// Geometry of the drawing, in viewBox units.
const LABEL_W = 180;
const PLOT_W = 440;
const RIGHT_PAD = 70;
const ROW_H = 40;
const TOP = 34;
const BOTTOM = 30;

/** A "nice" upper bound for the axis, so ticks fall on round numbers. */
export function niceMax(value: number): number {
  if (value <= 5) return 5;
  const step = value <= 20 ? 5 : value <= 60 ? 10 : 20;
  return Math.ceil(value / step) * step;
}

/** Tick values from 0 to max. */
export function ticksTo(max: number): number[] {
  const step = max <= 5 ? 1 : max <= 20 ? 5 : max <= 60 ? 10 : 20;
  const out: number[] = [];
  for (let v = 0; v <= max + 1e-9; v += step) out.push(v);
  return out;
}

/**
 * Turnaround per reviewer: each recent completed review as a dot, the median as a bar, and the office's
 * service level as a dashed line. Named by title/desc for screen readers, with a data table alternative.
 */
@Component({
  selector: 'as-turnaround-chart',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  template: `
    <div class="head">
      <h2 id="turnaround-heading">Turnaround</h2>
      <button mat-stroked-button type="button" (click)="asTable.set(!asTable())" [attr.aria-pressed]="asTable()">
        <mat-icon aria-hidden="true">{{ asTable() ? 'bar_chart' : 'table_rows' }}</mat-icon>
        {{ asTable() ? 'Show as chart' : 'Show as table' }}
      </button>
    </div>
    <p class="lede">Days from assignment to decision over the last 180 days. Bars show each reviewer's median; dots are
      single completed reviews; the dashed line is the office's service level of {{ serviceLevelDays() }} days.</p>
    @if (!hasData()) {
      <p class="empty" role="status">No reviews were completed in the last 180 days, so there is no turnaround to show yet.</p>
    } @else if (asTable()) {
      <table class="data">
        <caption class="as-visually-hidden">Turnaround per reviewer, last 180 days</caption>
        <thead><tr><th scope="col">Reviewer</th><th scope="col">Median days</th><th scope="col">Completed</th><th scope="col">Recent reviews (days)</th></tr></thead>
        <tbody>
          @for (r of rows(); track r.id) {
            <tr>
              <th scope="row">{{ r.name }}</th>
              <td class="num">{{ r.median ?? '—' }}</td>
              <td class="num">{{ r.completed.length }}</td>
              <td>
                @for (c of r.completed; track c.reference + c.decidedAt; let last = $last) {
                  <span class="as-mono">{{ c.reference }}</span>: {{ c.days }} ({{ c.decidedAt | date: 'd MMM' }}){{ last ? '' : '; ' }}
                } @empty { none }
              </td>
            </tr>
          }
        </tbody>
      </table>
    } @else {
      <svg [attr.viewBox]="'0 0 ' + width + ' ' + height()" role="img" aria-labelledby="tc-title tc-desc" class="chart">
        <title id="tc-title">Turnaround per reviewer, last 180 days</title>
        <desc id="tc-desc">{{ description() }}</desc>
        <g class="grid" aria-hidden="true">
          @for (t of ticks(); track t) {
            <line [attr.x1]="x(t)" [attr.x2]="x(t)" [attr.y1]="top - 6" [attr.y2]="height() - bottom" />
            <text [attr.x]="x(t)" [attr.y]="top - 12" text-anchor="middle">{{ t }}</text>
          }
          <text [attr.x]="labelW + plotW / 2" [attr.y]="height() - 8" text-anchor="middle" class="axis-title">days from assignment to decision</text>
        </g>
        @for (r of rows(); track r.id; let i = $index) {
          <g aria-hidden="true">
            <text [attr.x]="labelW - 12" [attr.y]="rowY(i) + 5" text-anchor="end" class="name">{{ r.short }}</text>
            <line class="lane" [attr.x1]="x(0)" [attr.x2]="x(maxDays())" [attr.y1]="rowY(i)" [attr.y2]="rowY(i)" />
            @if (r.median !== null) {
              <rect class="median" [attr.x]="x(0)" [attr.y]="rowY(i) - 9" [attr.width]="x(r.median) - x(0)" height="18" rx="3" />
              <text class="median-label" [attr.x]="x(maxDays()) + 8" [attr.y]="rowY(i) + 5">{{ r.median }} d</text>
            } @else {
              <text class="median-label" [attr.x]="x(maxDays()) + 8" [attr.y]="rowY(i) + 5">none</text>
            }
            @for (c of r.completed; track c.reference + c.decidedAt) {
              <circle class="dot" [attr.cx]="x(c.days)" [attr.cy]="rowY(i)" r="4.5" />
            }
          </g>
        }
        <g aria-hidden="true">
          <line class="sla" [attr.x1]="x(serviceLevelDays())" [attr.x2]="x(serviceLevelDays())" [attr.y1]="top - 4" [attr.y2]="height() - bottom" />
        </g>
      </svg>
      <p class="legend" aria-hidden="true">
        <span><svg width="22" height="12"><rect x="1" y="1" width="20" height="10" rx="2" class="median" /></svg>median</span>
        <span><svg width="12" height="12"><circle cx="6" cy="6" r="4.5" class="dot" /></svg>one completed review</span>
        <span><svg width="22" height="12"><line x1="1" x2="21" y1="6" y2="6" class="sla" /></svg>service level</span>
      </p>
    }
  `,
  styles: `
    :host { display: block; }
    .head { display: flex; align-items: center; justify-content: space-between; gap: 12px; flex-wrap: wrap; }
    h2 { font: var(--mat-sys-title-medium); margin: 0; color: var(--as-ink); }
    .lede, .empty { color: var(--mat-sys-on-surface-variant); margin: 6px 0 12px; max-width: 75ch; }
    .chart { width: 100%; max-width: 760px; height: auto; display: block; font-family: 'IBM Plex Sans', sans-serif; }
    .grid line { stroke: #d8dcd9; stroke-width: 1; }
    .grid text { font-size: 11px; fill: #4b5457; }
    .axis-title { font-size: 12px; }
    .name { font-size: 13px; fill: #14262a; font-weight: 500; }
    .lane { stroke: #e6e9e7; stroke-width: 1; }
    .median { fill: #b9d9d8; stroke: #1d5a63; stroke-width: 1; }
    .median-label { font-size: 12px; fill: #14262a; font-weight: 600; }
    .dot { fill: #14262a; fill-opacity: 0.75; stroke: #fff; stroke-width: 1; }
    .sla { stroke: #a8741a; stroke-width: 2; stroke-dasharray: 5 4; }
    .legend { display: flex; gap: 18px; flex-wrap: wrap; font-size: 13px; color: var(--mat-sys-on-surface-variant); margin: 6px 0 0;
      span { display: inline-flex; gap: 6px; align-items: center; } }
    .data { border-collapse: collapse; width: 100%; font-size: 14px;
      th, td { text-align: left; padding: 6px 10px; border-bottom: 1px solid var(--mat-sys-outline-variant); vertical-align: top; }
      thead th { font-size: 12px; text-transform: uppercase; letter-spacing: 0.05em; color: var(--mat-sys-on-surface-variant); }
      .num { text-align: right; font-variant-numeric: tabular-nums; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TurnaroundChart {
  /** Reviewers with their completed reviews and medians. */
  readonly reviewers = input.required<ReviewerLoad[]>();
  /** The office's service level, drawn as a reference line. */
  readonly serviceLevelDays = input.required<number>();

  protected readonly asTable = signal(false);
  protected readonly width = LABEL_W + PLOT_W + RIGHT_PAD;
  protected readonly labelW = LABEL_W;
  protected readonly plotW = PLOT_W;
  protected readonly top = TOP;
  protected readonly bottom = BOTTOM;

  protected readonly rows = computed(() =>
    this.reviewers().map((r) => ({
      id: r.reviewer.id,
      name: r.reviewer.name,
      short: r.reviewer.name.length > 24 ? `${r.reviewer.name.slice(0, 23)}…` : r.reviewer.name,
      median: r.medianTurnaroundDays,
      completed: r.completed,
    })),
  );
  protected readonly hasData = computed(() => this.rows().some((r) => r.completed.length > 0 || r.median !== null));
  protected readonly maxDays = computed(() =>
    niceMax(Math.max(this.serviceLevelDays(), ...this.rows().flatMap((r) => [r.median ?? 0, ...r.completed.map((c) => c.days)]))),
  );
  protected readonly ticks = computed(() => ticksTo(this.maxDays()));
  protected readonly height = computed(() => TOP + this.rows().length * ROW_H + BOTTOM);
  protected readonly description = computed(() =>
    this.rows()
      .map((r) =>
        r.median === null
          ? `${r.name}: no completed reviews.`
          : `${r.name}: median ${r.median} days over ${r.completed.length} completed ${r.completed.length === 1 ? 'review' : 'reviews'}, ${
              r.median > this.serviceLevelDays() ? 'above' : 'within'
            } the ${this.serviceLevelDays()}-day service level.`,
      )
      .join(' '),
  );

  /** Horizontal position of a number of days. */
  protected x(days: number): number {
    return LABEL_W + (Math.max(0, days) / this.maxDays()) * PLOT_W;
  }

  /** Vertical centre of row i. */
  protected rowY(i: number): number {
    return TOP + ROW_H / 2 + i * ROW_H;
  }
}
