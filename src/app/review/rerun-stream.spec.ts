import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import type { RerunDetail, RerunEvent } from '../../../shared/api/workflow';
import { EVENT_SOURCE_FACTORY, EventSourceLike, POLL_INTERVAL_MS, RerunStream } from './rerun-stream';

/** A stand-in EventSource the spec drives by hand. */
class FakeSource implements EventSourceLike {
  readonly listeners = new Map<string, ((e: MessageEvent) => void)[]>();
  onerror: ((e: Event) => void) | null = null;
  closed = false;
  constructor(readonly url: string) {}
  addEventListener(type: string, l: (e: MessageEvent) => void): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), l]);
  }
  close(): void { this.closed = true; }
  send(type: string, ev: RerunEvent): void {
    for (const l of this.listeners.get(type) ?? []) l(new MessageEvent(type, { data: JSON.stringify(ev) }));
  }
}

function detail(status: RerunDetail['status'], progress: number, stage: string | null): RerunDetail {
  return {
    id: 'rr1', label: 'as filed', status, engineVersion: '1.0.0', dataSha256: null, datasetId: null, revisionNo: 1, startedBy: null,
    startedAt: null, finishedAt: null, timings: null, error: null, requestId: 'r1', planSnapshot: { design: 'anova', outcome: 'y' },
    result: null, progress, stage,
  };
}

describe('RerunStream', () => {
  let sources: FakeSource[];
  let factory: (url: string) => EventSourceLike | null;
  let http: HttpTestingController;

  function setup(): RerunStream {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: EVENT_SOURCE_FACTORY, useValue: (u: string) => factory(u) }],
    });
    http = TestBed.inject(HttpTestingController);
    return TestBed.inject(RerunStream);
  }

  beforeEach(() => {
    sources = [];
    factory = (u) => { const s = new FakeSource(u); sources.push(s); return s; };
  });
  afterEach(() => { http.verify(); vi.useRealTimers(); });

  it('relays progress events and completes on "done", closing the stream', () => {
    const stream = setup();
    const seen: RerunEvent[] = [];
    let completed = false;
    stream.watch('rr1').subscribe({ next: (e) => seen.push(e), complete: () => (completed = true) });
    expect(sources[0].url).toBe('/api/reruns/rr1/events');
    sources[0].send('progress', { status: 'running', progress: 0.4, stage: 'comparisons' });
    sources[0].send('done', { status: 'done', progress: 1, stage: null });
    expect(seen.map((e) => [e.status, e.progress])).toEqual([['running', 0.4], ['done', 1]]);
    expect(completed).toBe(true);
    expect(sources[0].closed).toBe(true);
  });

  it('reports "failed" with its reason and completes', () => {
    const stream = setup();
    const seen: RerunEvent[] = [];
    stream.watch('rr1').subscribe((e) => seen.push(e));
    sources[0].send('failed', { status: 'running', progress: 0.2, stage: 'reading', error: 'column score is missing' });
    expect(seen[0].status).toBe('failed');
    expect(seen[0].error).toBe('column score is missing');
  });

  it('falls back to polling GET /api/reruns/:id every second when the stream errors', () => {
    vi.useFakeTimers();
    const stream = setup();
    const seen: RerunEvent[] = [];
    let completed = false;
    stream.watch('rr1').subscribe({ next: (e) => seen.push(e), complete: () => (completed = true) });
    sources[0].onerror!(new Event('error'));
    expect(sources[0].closed).toBe(true);
    vi.advanceTimersByTime(0);
    http.expectOne('/api/reruns/rr1').flush(detail('running', 0.5, 'tests'));
    vi.advanceTimersByTime(POLL_INTERVAL_MS);
    http.expectOne('/api/reruns/rr1').flush(detail('done', 1, null));
    vi.advanceTimersByTime(POLL_INTERVAL_MS * 3);
    http.expectNone('/api/reruns/rr1');
    expect(seen.map((e) => e.stage)).toEqual(['tests', null]);
    expect(completed).toBe(true);
  });

  it('polls from the start where EventSource does not exist', () => {
    vi.useFakeTimers();
    factory = () => null;
    const stream = setup();
    const seen: RerunEvent[] = [];
    stream.watch('rr1').subscribe((e) => seen.push(e));
    vi.advanceTimersByTime(0);
    http.expectOne('/api/reruns/rr1').flush(detail('failed', 0.1, 'reading'));
    expect(seen[0].status).toBe('failed');
  });

  it('closes the stream when the subscriber leaves', () => {
    const stream = setup();
    const sub = stream.watch('rr1').subscribe();
    sub.unsubscribe();
    expect(sources[0].closed).toBe(true);
  });
});
