import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** A friendly "nothing here" block with an icon, a heading and a hint. */
@Component({
  selector: 'as-empty-state',
  imports: [MatIconModule],
  template: `
    <div class="box" role="status">
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <p class="title">{{ heading() }}</p>
      @if (hint()) { <p class="hint">{{ hint() }}</p> }
      <ng-content />
    </div>
  `,
  styles: `
    .box { display: grid; justify-items: center; text-align: center; gap: 4px; padding: 40px 16px;
      color: var(--mat-sys-on-surface-variant); }
    mat-icon { font-size: 40px; width: 40px; height: 40px; color: var(--as-ochre); }
    p { margin: 0; max-width: 52ch; }
    .title { font: var(--mat-sys-title-medium); color: var(--mat-sys-on-surface); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmptyState {
  /** Material Symbols name. */
  readonly icon = input('inbox');
  /** Main line. */
  readonly heading = input.required<string>();
  /** Optional second line. */
  readonly hint = input<string>('');
}
