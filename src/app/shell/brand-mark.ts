import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Assayer's mark: a touchstone bar with a proof streak and a tick, drawn in our colours. */
@Component({
  selector: 'as-brand-mark',
  template: `
    <svg width="30" height="30" viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect x="2" y="2" width="28" height="28" rx="7" fill="#eef5f5" />
      <rect x="7" y="19" width="18" height="4" rx="2" fill="#a8741a" />
      <path d="M9 12.5l4 4 9-9" fill="none" stroke="#14262a" stroke-width="3" stroke-linecap="round" stroke-linejoin="round" />
    </svg>
  `,
  styles: ':host { display: inline-flex; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BrandMark {}
