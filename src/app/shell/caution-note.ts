import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The standing caution: Assayer covers statistical method only. */
@Component({
  selector: 'as-caution-note',
  imports: [MatIconModule],
  template: `
    <p class="note">
      <mat-icon aria-hidden="true">info</mat-icon>
      <span>Assayer reviews statistical method only — not ethics approval, legal, clinical or policy advice;
        your institution's board and local rules prevail.</span>
    </p>
  `,
  styles: `
    .note { display: flex; gap: 8px; align-items: flex-start; margin: 0; font-size: 13px; line-height: 1.45;
      color: var(--mat-sys-on-surface-variant); border-top: 1px solid var(--mat-sys-outline-variant); padding-top: 12px; }
    mat-icon { font-size: 18px; width: 18px; height: 18px; color: var(--as-ochre); flex: none; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CautionNote {}
