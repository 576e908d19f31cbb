import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** A failed load, said plainly, with a button to try again. */
@Component({
  selector: 'as-load-error',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="box" role="alert">
      <mat-icon aria-hidden="true">cloud_off</mat-icon>
      <div class="text">
        <p class="title">{{ heading() }}</p>
        <p class="message">{{ message() }}</p>
      </div>
      <button mat-stroked-button type="button" (click)="retry.emit()">
        <mat-icon aria-hidden="true">refresh</mat-icon>Try again
      </button>
    </div>
  `,
  styles: `
    .box { display: flex; gap: 16px; align-items: center; padding: 16px 20px; border-radius: 12px;
      background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); flex-wrap: wrap; }
    .text { flex: 1 1 240px; }
    p { margin: 0; }
    .title { font-weight: 600; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadError {
  /** First line, e.g. "Could not load your requests". */
  readonly heading = input('Could not load this page');
  /** The reason, from the API or a fallback. */
  readonly message = input.required<string>();
  /** Emitted when the person asks to try again. */
  readonly retry = output<void>();
}
