import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { EmptyState } from '../page-state/empty-state';

/** Shown for unknown addresses, and for pages the person's roles do not open. */
@Component({
  selector: 'as-not-found-page',
  imports: [EmptyState, MatButtonModule, RouterLink],
  template: `
    <h1 class="as-page-title" tabindex="-1">{{ reason() === 'roles' ? 'Not available to your roles' : 'Page not found' }}</h1>
    <as-empty-state [icon]="reason() === 'roles' ? 'lock' : 'explore_off'"
      [heading]="reason() === 'roles' ? 'This page needs a role you do not hold.' : 'There is no page at this address.'"
      hint="Use the navigation to reach your own work, or ask the office administrator about your roles.">
      <a mat-flat-button routerLink="/">Go to my start page</a>
    </as-empty-state>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {
  /** Route data: "roles" when a role guard sent the person here. */
  readonly reason = input<string | undefined>();
}
