import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { REQUEST_STATE_LABELS, RequestState } from '../../../shared/api/types';

/** Icon for each state, so a state reads from shape and words as well as colour. */
export const STATE_ICONS: Record<RequestState, string> = {
  draft: 'edit_note',
  filed: 'mark_email_unread',
  assigned: 'person_pin',
  'in-review': 'manage_search',
  'revision-requested': 'undo',
  decided: 'task_alt',
  withdrawn: 'do_not_disturb_on',
};

/** A request state as a labelled chip: our colour pair, an icon and the word. */
@Component({
  selector: 'as-state-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ icon() }}</mat-icon><span>{{ label() }}</span>`,
  styles: `
    :host { display: inline-flex; align-items: center; gap: 4px; padding: 2px 10px 2px 6px; border-radius: 999px;
      font-size: 13px; font-weight: 500; line-height: 20px; white-space: nowrap;
      background: var(--chip-bg); color: var(--chip-fg); border: 1px solid color-mix(in srgb, var(--chip-fg) 25%, transparent); }
    mat-icon { font-size: 16px; width: 16px; height: 16px; }
  `,
  host: {
    '[style.--chip-bg]': "'var(--as-state-' + state() + '-bg)'",
    '[style.--chip-fg]': "'var(--as-state-' + state() + '-fg)'",
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StateChip {
  /** The state to show. */
  readonly state = input.required<RequestState>();
  protected readonly label = computed(() => REQUEST_STATE_LABELS[this.state()] ?? this.state());
  protected readonly icon = computed(() => STATE_ICONS[this.state()] ?? 'help');
}
