import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { RequestScope } from './request-service';
import { RequestTable } from './request-table';
import { SCOPE_TEXTS } from './scope-texts';

/** One of the three request lists (my requests, assigned to me, intake queue), chosen by route data. */
@Component({
  selector: 'as-request-queue-page',
  imports: [RequestTable, MatButtonModule, MatIconModule, RouterLink],
  template: `
    <div class="heading">
      <div>
        <h1 class="as-page-title" tabindex="-1">{{ texts().heading }}</h1>
        <p class="as-page-lede">{{ texts().lede }}</p>
      </div>
      @if (scope() === 'mine') {
        <a mat-flat-button routerLink="/requests/new"><mat-icon aria-hidden="true">add</mat-icon>New request</a>
      }
    </div>
    <as-request-table [scope]="scope()" />
  `,
  styles: `
    .heading { display: flex; align-items: flex-start; justify-content: space-between; gap: 16px; flex-wrap: wrap; }
    .heading a { margin-top: 4px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestQueuePage {
  /** Route data: which list. */
  readonly scope = input.required<RequestScope>();
  protected readonly texts = computed(() => SCOPE_TEXTS[this.scope()]);
}
