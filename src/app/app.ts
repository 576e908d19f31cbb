import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { RouterOutlet } from '@angular/router';

/** Root component: only the router outlet; the shell and sign-in page are routes. */
@Component({
  selector: 'app-root',
  imports: [RouterOutlet],
  template: '<router-outlet />',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {
  constructor() {
    // Icons come from the self-hosted Material Symbols font, outlined style.
    inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
  }
}
