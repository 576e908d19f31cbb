import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RequestScope } from './request-service';
import { RequestTable } from './request-table';
import { SCOPE_TEXTS } from './scope-texts';

/** One of the three request lists (my requests, assigned to me, intake queue), chosen by route data. */
@Component({
  selector: 'as-request-queue-page',
  imports: [RequestTable],
  template: `
    <h1 class="as-page-title" tabindex="-1">{{ texts().heading }}</h1>
    <p class="as-page-lede">{{ texts().lede }}</p>
    <as-request-table [scope]="scope()" />
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestQueuePage {
  /** Route data: which list. */
  readonly scope = input.required<RequestScope>();
  protected readonly texts = computed(() => SCOPE_TEXTS[this.scope()]);
}
