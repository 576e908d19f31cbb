import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { Router } from '@angular/router';
import type { NotificationItem, NotificationPage } from '../../../shared/api/types';
import { NotificationService } from './notification-service';

/** Icon per notification kind, so the list reads by shape as well as words. */
const KIND_ICONS: Record<string, string> = {
  'request.filed': 'mark_email_unread',
  'request.assigned': 'person_pin',
  'assignment.declined': 'assignment_return',
  'request.revision-requested': 'undo',
  'request.resubmitted': 'redo',
  'request.decided': 'task_alt',
  'request.due-soon': 'schedule',
  'letter.ready': 'verified',
  'letter.countersign-needed': 'draw',
  'comment.added': 'forum',
};

/** The top-bar bell: unread count, and a menu of recent notifications that opens their links and marks them read. */
@Component({
  selector: 'as-notification-bell',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    <button mat-icon-button type="button" class="bell" [matMenuTriggerFor]="panel" (menuOpened)="opened()"
            [attr.aria-label]="label()">
      <mat-icon aria-hidden="true">{{ unread() > 0 ? 'notifications_active' : 'notifications' }}</mat-icon>
      @if (unread() > 0) { <span class="count" aria-hidden="true">{{ unread() > 99 ? '99+' : unread() }}</span> }
    </button>
    <mat-menu #panel="matMenu" xPosition="before" class="as-notification-menu">
      <div class="menu-head" role="presentation" (click)="$event.stopPropagation()">
        <strong>Notifications</strong>
        <span>{{ unread() === 0 ? 'All read' : unread() + ' unread' }}</span>
      </div>
      @if (failed() && !page()) {
        <p class="menu-note" role="presentation">Notifications could not be loaded. They will be tried again shortly.</p>
      }
      @for (n of items(); track n.id) {
        <button mat-menu-item type="button" class="item" [class.unread]="!n.readAt" (click)="open(n)">
          <mat-icon aria-hidden="true">{{ icon(n.kind) }}</mat-icon>
          <span class="text">
            <span class="title">@if (!n.readAt) { <span class="as-visually-hidden">Unread: </span> }{{ n.title }}</span>
            <span class="body">{{ n.body }}</span>
            <span class="when">{{ n.createdAt | date: 'd MMM, HH:mm' }}</span>
          </span>
        </button>
      } @empty {
        @if (page()) { <p class="menu-note" role="presentation">No notifications yet.</p> }
      }
    </mat-menu>
  `,
  styles: `
    :host { display: inline-flex; }
    .bell { position: relative; color: inherit; overflow: visible; }
    .count { position: absolute; top: 2px; right: -2px; z-index: 1; min-width: 18px; height: 18px; padding: 0 4px; box-sizing: border-box;
      border-radius: 9px; background: var(--as-ochre); color: #1b1406; font-size: 11px; font-weight: 700; line-height: 18px;
      text-align: center; border: 1px solid #14262a; }
    .menu-head { display: flex; justify-content: space-between; align-items: baseline; gap: 16px; padding: 10px 16px 8px;
      cursor: default; border-bottom: 1px solid var(--mat-sys-outline-variant);
      span { font-size: 13px; color: var(--mat-sys-on-surface-variant); } }
    .menu-note { padding: 12px 16px; margin: 0; color: var(--mat-sys-on-surface-variant); font-size: 14px; }
    .item { height: auto; min-height: 56px; padding-top: 8px; padding-bottom: 8px; align-items: flex-start; }
    .item mat-icon { margin-top: 2px; }
    .text { display: flex; flex-direction: column; gap: 1px; white-space: normal; line-height: 1.35; }
    .title { font-size: 14px; font-weight: 500; }
    .item.unread .title { font-weight: 700; }
    .item.unread { box-shadow: inset 3px 0 0 var(--as-ochre); }
    .body { font-size: 13px; color: var(--mat-sys-on-surface-variant); }
    .when { font-size: 12px; color: var(--mat-sys-on-surface-variant); font-family: var(--as-mono); }
    /* The menu panel lives in an overlay outside this component; widen it for two-line entries. */
    ::ng-deep .as-notification-menu.mat-mdc-menu-panel { max-width: min(400px, 94vw); min-width: 320px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationBell {
  private readonly service = inject(NotificationService);
  private readonly router = inject(Router);

  protected readonly page = signal<NotificationPage | null>(null);
  protected readonly failed = signal(false);
  protected readonly unread = computed(() => this.page()?.unread ?? 0);
  protected readonly items = computed(() => this.page()?.items ?? []);
  protected readonly label = computed(() => `Notifications, ${this.unread()} unread`);

  constructor() {
    this.service
      .poll()
      .pipe(takeUntilDestroyed())
      .subscribe((page) => {
        this.failed.set(page === null);
        if (page) this.page.set(page);
      });
  }

  /** Fetches the newest list when the panel opens. */
  protected opened(): void {
    this.service.refresh();
  }

  /** Marks a notification read and follows its link. */
  protected open(n: NotificationItem): void {
    if (!n.readAt) {
      // Show it read at once; the next poll brings the server's count.
      this.page.update((p) =>
        p ? { ...p, unread: Math.max(0, p.unread - 1), items: p.items.map((i) => (i.id === n.id ? { ...i, readAt: new Date().toISOString() } : i)) } : p,
      );
      this.service.markRead(n.id).subscribe({ next: () => this.service.refresh(), error: () => this.service.refresh() });
    }
    if (n.link) void this.router.navigateByUrl(n.link);
  }

  protected icon(kind: string): string {
    return KIND_ICONS[kind] ?? 'notifications';
  }
}
