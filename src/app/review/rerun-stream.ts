import { HttpClient } from '@angular/common/http';
import { Injectable, InjectionToken, inject } from '@angular/core';
import { Observable, Subscription, timer } from 'rxjs';
import { switchMap } from 'rxjs/operators';
import type { RerunDetail, RerunEvent } from '../../../shared/api/workflow';

/** The minimum of EventSource the stream uses, so specs can hand in a fake. */
export interface EventSourceLike {
  addEventListener(type: string, listener: (e: MessageEvent) => void): void;
  onerror: ((e: Event) => void) | null;
  close(): void;
}

/** Opens a server-sent event stream; replaced in specs. Returns null where EventSource does not exist. */
export const EVENT_SOURCE_FACTORY = new InjectionToken<(url: string) => EventSourceLike | null>('EVENT_SOURCE_FACTORY', {
  providedIn: 'root',
  factory: () => (url: string) =>
    typeof EventSource === 'undefined' ? null : (new EventSource(url, { withCredentials: true }) as unknown as EventSourceLike),
});

/** How often the fallback asks for the rerun's state. */
export const POLL_INTERVAL_MS = 1000;

const FINISHED = new Set(['done', 'failed']);

/**
 * Progress of one rerun as an Observable: server-sent events while the stream holds,
 * polling GET /api/reruns/:id once a second when it cannot be opened or breaks
 * (proxies that buffer, a dropped connection). Completes after "done" or "failed".
 */
@Injectable({ providedIn: 'root' })
export class RerunStream {
  private readonly http = inject(HttpClient);
  private readonly openSource = inject(EVENT_SOURCE_FACTORY);

  /** Emits RerunEvents until the rerun has finished. */
  watch(rerunId: string): Observable<RerunEvent> {
    const id = encodeURIComponent(rerunId);
    return new Observable<RerunEvent>((sub) => {
      let source: EventSourceLike | null = null;
      let polling: Subscription | null = null;
      let finished = false;

      const emit = (ev: RerunEvent): void => {
        if (finished) return;
        sub.next(ev);
        if (FINISHED.has(ev.status)) {
          finished = true;
          source?.close();
          polling?.unsubscribe();
          sub.complete();
        }
      };

      const poll = (): void => {
        source?.close();
        source = null;
        if (polling || finished) return;
        polling = timer(0, POLL_INTERVAL_MS)
          .pipe(switchMap(() => this.http.get<RerunDetail>(`/api/reruns/${id}`)))
          .subscribe({
            next: (d) => emit({ status: d.status, progress: d.progress, stage: d.stage, ...(d.error ? { error: d.error } : {}) }),
            error: (err: unknown) => sub.error(err),
          });
      };

      try {
        source = this.openSource(`/api/reruns/${id}/events`);
      } catch {
        source = null;
      }
      if (!source) {
        poll();
      } else {
        for (const name of ['progress', 'done', 'failed']) {
          source.addEventListener(name, (e: MessageEvent) => {
            try {
              const ev = JSON.parse(String(e.data)) as RerunEvent;
              emit({ ...ev, status: name === 'progress' ? ev.status : (name as RerunEvent['status']) });
            } catch {
              poll();
            }
          });
        }
        source.onerror = () => {
          if (!finished) poll();
        };
      }

      return () => {
        finished = true;
        source?.close();
        polling?.unsubscribe();
      };
    });
  }
}
