import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { QqPoint, qqGeometry } from './qq-geometry';

let nextId = 0;

/** A normal Q-Q plot of residuals as an accessible SVG (title, description, reference line). */
@Component({
  selector: 'as-qq-plot',
  template: `
    <svg [attr.viewBox]="'0 0 ' + g().width + ' ' + g().height" role="img" [attr.aria-labelledby]="uid + '-t ' + uid + '-d'"
         class="qq" preserveAspectRatio="xMidYMid meet">
      <title [id]="uid + '-t'">Normal Q-Q plot of residuals</title>
      <desc [id]="uid + '-d'">{{ description() }}</desc>
      <g class="grid" aria-hidden="true">
        @for (t of g().xTicks; track t.at) {
          <line [attr.x1]="t.at" [attr.x2]="t.at" [attr.y1]="g().plot.top" [attr.y2]="g().plot.bottom" />
          <text [attr.x]="t.at" [attr.y]="g().plot.bottom + 16" text-anchor="middle">{{ t.label }}</text>
        }
        @for (t of g().yTicks; track t.at) {
          <line [attr.x1]="g().plot.left" [attr.x2]="g().plot.right" [attr.y1]="t.at" [attr.y2]="t.at" />
          <text [attr.x]="g().plot.left - 6" [attr.y]="t.at + 4" text-anchor="end">{{ t.label }}</text>
        }
        <rect class="frame" [attr.x]="g().plot.left" [attr.y]="g().plot.top" [attr.width]="g().plot.right - g().plot.left"
              [attr.height]="g().plot.bottom - g().plot.top" />
        <text class="axis" [attr.x]="(g().plot.left + g().plot.right) / 2" [attr.y]="g().height - 6" text-anchor="middle">Normal quantile</text>
        <text class="axis" [attr.transform]="'translate(12 ' + (g().plot.top + g().plot.bottom) / 2 + ') rotate(-90)'" text-anchor="middle">Residual</text>
      </g>
      @if (g().line; as l) {
        <line class="ref" [attr.x1]="l.x1" [attr.y1]="l.y1" [attr.x2]="l.x2" [attr.y2]="l.y2" aria-hidden="true" />
      }
      <g class="dots" aria-hidden="true">
        @for (d of g().dots; track $index) { <circle [attr.cx]="d.cx" [attr.cy]="d.cy" r="3" /> }
      </g>
    </svg>
  `,
  styles: `
    :host { display: block; max-width: 420px; }
    .qq { width: 100%; height: auto; font-family: var(--as-mono); font-size: 10px; }
    .grid line { stroke: #e2e4e1; stroke-width: 1; }
    .grid text { fill: #4f5a5c; }
    .grid .axis { font-family: var(--mat-sys-body-medium-font); font-size: 11px; fill: #2b3a3d; }
    .frame { fill: none; stroke: #9aa4a5; }
    .ref { stroke: #a8741a; stroke-width: 2; stroke-dasharray: 6 4; }
    circle { fill: #1d6b6a; fill-opacity: 0.7; stroke: #0d4f4c; stroke-width: 0.5; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QqPlot {
  /** Residual quantiles against normal quantiles. */
  readonly points = input.required<QqPoint[]>();
  /** One sentence from the normality test, added to the description. */
  readonly note = input('');

  protected readonly uid = `as-qq-${nextId++}`;
  protected readonly g = computed(() => qqGeometry(this.points()));
  protected readonly description = computed(() => {
    const n = this.points().length;
    const gap = this.g().maxGap;
    return `${n} residual quantiles plotted against the quantiles of a normal distribution, with a dashed reference line through the quartiles. ` +
      `The farthest point lies ${Number(gap.toPrecision(3))} residual units from the line.${this.note() ? ' ' + this.note() : ''}`;
  });
}
