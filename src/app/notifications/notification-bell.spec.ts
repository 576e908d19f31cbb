import { DOCUMENT } from '@angular/common';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Router, provideRouter } from '@angular/router';
import type { NotificationItem, NotificationPage } from '../../../shared/api/types';
import { NotificationBell } from './notification-bell';
import { NOTIFICATION_POLL_MS } from './notification-service';

const item = (id: string, read: boolean): NotificationItem => ({
  id, kind: 'request.assigned', title: `HV-2026-00${id} was assigned to you`, body: 'Due in 15 days.', link: `/requests/r${id}`,
  requestId: `r${id}`, createdAt: '2026-12-01T09:00:00Z', readAt: read ? '2026-12-01T10:00:00Z' : null,
});
const page = (unread: number, items: NotificationItem[]): NotificationPage => ({ items, total: items.length, page: 0, pageSize: 10, unread });

describe('NotificationBell', () => {
  let fixture: ComponentFixture<NotificationBell>;
  let http: HttpTestingController;
  let el: HTMLElement;
  let visibility: DocumentVisibilityState;

  beforeEach(() => {
    vi.useFakeTimers();
    visibility = 'visible';
    TestBed.configureTestingModule({
      imports: [NotificationBell],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    const doc = TestBed.inject(DOCUMENT);
    Object.defineProperty(doc, 'visibilityState', { configurable: true, get: () => visibility });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(NotificationBell);
    fixture.detectChanges();
    el = fixture.nativeElement;
    // The first poll is scheduled at 0 ms.
    vi.advanceTimersByTime(0);
  });
  afterEach(() => {
    try {
      http.verify();
    } finally {
      fixture.destroy();
      delete (TestBed.inject(DOCUMENT) as unknown as Record<string, unknown>)['visibilityState'];
      vi.useRealTimers();
    }
  });

  const polls = () => http.match((r) => r.url === '/api/notifications');
  const bell = () => el.querySelector<HTMLButtonElement>('button.bell')!;
  function setVisibility(v: DocumentVisibilityState): void {
    visibility = v;
    TestBed.inject(DOCUMENT).dispatchEvent(new Event('visibilitychange'));
  }

  it('asks at once and shows the unread count in the accessible name and the badge', () => {
    const [first] = polls();
    expect(first.request.params.get('pageSize')).toBe('10');
    first.flush(page(2, [item('1', false), item('2', false), item('3', true)]));
    fixture.detectChanges();
    expect(bell().getAttribute('aria-label')).toBe('Notifications, 2 unread');
    expect(el.querySelector('.count')!.textContent!.trim()).toBe('2');
  });

  it('polls every 60 seconds', () => {
    polls()[0].flush(page(0, []));
    fixture.detectChanges();
    expect(bell().getAttribute('aria-label')).toBe('Notifications, 0 unread');
    expect(el.querySelector('.count')).toBeNull();
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS - 1000);
    expect(polls().length).toBe(0);
    vi.advanceTimersByTime(1000);
    const next = polls();
    expect(next.length).toBe(1);
    next[0].flush(page(1, [item('4', false)]));
    fixture.detectChanges();
    expect(bell().getAttribute('aria-label')).toBe('Notifications, 1 unread');
  });

  it('stops polling while the tab is hidden and asks again when it is shown', () => {
    polls()[0].flush(page(0, []));
    setVisibility('hidden');
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS * 3);
    expect(polls().length).toBe(0);
    setVisibility('visible');
    vi.advanceTimersByTime(0);
    const back = polls();
    expect(back.length).toBe(1);
    back[0].flush(page(3, []));
    fixture.detectChanges();
    expect(bell().getAttribute('aria-label')).toBe('Notifications, 3 unread');
  });

  it('keeps the last count when a poll fails and tries again next minute', () => {
    polls()[0].flush(page(2, [item('1', false)]));
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS);
    polls()[0].flush(null, { status: 503, statusText: 'Unavailable' });
    fixture.detectChanges();
    expect(bell().getAttribute('aria-label')).toBe('Notifications, 2 unread');
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS);
    expect(polls().length).toBe(1);
  });

  it('marks an unread notification read, follows its link and refreshes the count', async () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    polls()[0].flush(page(1, [item('1', false)]));
    fixture.detectChanges();
    bell().click();
    fixture.detectChanges();
    http.expectOne((r) => r.method === 'GET' && r.url === '/api/notifications').flush(page(1, [item('1', false)]));
    fixture.detectChanges();
    const entry = document.querySelector<HTMLButtonElement>('.as-notification-menu button.item')!;
    expect(entry.textContent).toContain('Unread: HV-2026-001 was assigned to you');
    entry.click();
    fixture.detectChanges();
    expect(bell().getAttribute('aria-label')).toBe('Notifications, 0 unread');
    http.expectOne((r) => r.method === 'POST' && r.url === '/api/notifications/1/read').flush(null, { status: 204, statusText: 'No Content' });
    http.expectOne((r) => r.method === 'GET' && r.url === '/api/notifications').flush(page(0, [item('1', true)]));
    expect(navigate).toHaveBeenCalledWith('/requests/r1');
  });
});
