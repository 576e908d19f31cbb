import { DOCUMENT } from '@angular/common';
import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { EMPTY, Observable, Subject, catchError, distinctUntilChanged, fromEvent, map, merge, of, startWith, switchMap, timer } from 'rxjs';
import type { NotificationPage } from '../../../shared/api/types';
import { toQueryParams } from '../api-client/query-params';

/** How often the bell asks for new notifications while the tab is visible. */
export const NOTIFICATION_POLL_MS = 60_000;

/** Reads and marks the signed-in person's in-app notifications; polls while the tab is visible. */
@Injectable({ providedIn: 'root' })
export class NotificationService {
  private readonly http = inject(HttpClient);
  private readonly document = inject(DOCUMENT);
  private readonly refreshes = new Subject<void>();

  /** GET /api/notifications?page=&pageSize=&unread= */
  list(pageSize = 10, unreadOnly = false): Observable<NotificationPage> {
    const params = toQueryParams({ page: 0, pageSize, unread: unreadOnly ? 'true' : '' });
    return this.http.get<NotificationPage>('/api/notifications', { params });
  }

  /** POST /api/notifications/:id/read */
  markRead(id: string): Observable<unknown> {
    return this.http.post(`/api/notifications/${encodeURIComponent(id)}/read`, {});
  }

  /** Asks {@link poll} to fetch now (after marking read, or when the panel opens). */
  refresh(): void {
    this.refreshes.next();
  }

  /**
   * The latest notifications page: now, then every minute while the tab is visible, and on {@link refresh}.
   * A hidden tab stops polling; becoming visible again fetches at once. Failed polls emit null and polling goes on.
   */
  poll(pageSize = 10): Observable<NotificationPage | null> {
    const visible$ = fromEvent(this.document, 'visibilitychange').pipe(
      startWith(null),
      map(() => this.document.visibilityState !== 'hidden'),
      distinctUntilChanged(),
    );
    const ticks$ = visible$.pipe(switchMap((visible) => (visible ? timer(0, NOTIFICATION_POLL_MS) : EMPTY)));
    return merge(ticks$, this.refreshes).pipe(
      switchMap(() => this.list(pageSize).pipe(catchError(() => of(null)))),
    );
  }
}
