import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Subject } from 'rxjs';
import type { RerunDetail, RerunEvent, RerunSummary } from '../../../shared/api/workflow';
import { ADVISING_PILOT_RESULT } from '../results/testing/sample-results';
import { RerunPanel } from './rerun-panel';
import { RerunStream } from './rerun-stream';

const summary = (over: Partial<RerunSummary> = {}): RerunSummary => ({
  id: 'rr1', label: 'as filed', status: 'queued', engineVersion: '1.0.0', dataSha256: 'ab'.repeat(32), datasetId: 'd1', revisionNo: 1,
  startedBy: null, startedAt: '2026-12-01T10:00:00Z', finishedAt: null, timings: null, error: null, ...over,
});
const detail = (over: Partial<RerunDetail> = {}): RerunDetail => ({
  ...summary({ status: 'done', finishedAt: '2026-12-01T10:00:02Z', timings: { totalMs: 1830 } }), requestId: 'r1',
  planSnapshot: { design: 'anova', outcome: 'credits_completed', between: ['advising_format'], comparisons: [{ factor: 'advising_format', method: 'tukey' }] },
  result: ADVISING_PILOT_RESULT, progress: 1, stage: 'done', ...over,
});

describe('RerunPanel', () => {
  let fixture: ComponentFixture<RerunPanel>;
  let http: HttpTestingController;
  let el: HTMLElement;
  let events: Subject<RerunEvent>;
  let finished: string[];

  beforeEach(() => {
    events = new Subject<RerunEvent>();
    TestBed.configureTestingModule({
      imports: [RerunPanel],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: RerunStream, useValue: { watch: () => events.asObservable() } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RerunPanel);
    fixture.componentRef.setInput('requestId', 'r1');
    finished = [];
    fixture.componentInstance.finished.subscribe((id) => finished.push(id));
    fixture.detectChanges();
    el = fixture.nativeElement;
    http.expectOne('/api/requests/r1/reruns').flush([]);
    fixture.detectChanges();
  });
  afterEach(() => http.verify());

  it('starts a rerun, shows its stage in words in a live region, then opens the result', () => {
    expect(el.textContent).toContain('No reruns yet.');
    (Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Rerun on the server')) as HTMLButtonElement).click();
    const post = http.expectOne('/api/requests/r1/reruns');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ label: 'as filed' });
    post.flush(summary());
    events.next({ status: 'running', progress: 0.37, stage: 'analyse' });
    fixture.detectChanges();
    const live = el.querySelector('[aria-live="polite"]')!;
    expect(live.textContent).toContain('computing the tests and assumption checks');
    expect(live.textContent).toContain('37%');
    expect(el.querySelector('mat-progress-bar')).not.toBeNull();
    expect(el.querySelector('.st')?.textContent).toBe('Running');

    events.next({ status: 'done', progress: 1, stage: 'done' });
    events.complete();
    http.expectOne('/api/requests/r1/reruns').flush([summary({ status: 'done', timings: { totalMs: 1830 } })]);
    http.expectOne('/api/reruns/rr1').flush(detail());
    fixture.detectChanges();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(finished).toEqual(['rr1']);
    expect(el.querySelector('as-rerun-result')?.textContent).toContain('F(2, 86) = 5.86');
    expect(el.textContent).toContain('1.83 s');
  });

  it('says why a rerun failed', () => {
    (Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Rerun on the server')) as HTMLButtonElement).click();
    http.expectOne('/api/requests/r1/reruns').flush(summary());
    events.next({ status: 'failed', progress: 0.1, stage: 'validate', error: 'column credits_completed is missing' });
    http.expectOne('/api/requests/r1/reruns').flush([summary({ status: 'failed', error: 'column credits_completed is missing' })]);
    fixture.detectChanges();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('column credits_completed is missing');
  });

  it('reports a reproduction as identical or lists the differences', () => {
    // Reload the list with a finished rerun.
    fixture.componentInstance.load(true);
    http.expectOne('/api/requests/r1/reruns').flush([summary({ status: 'done' })]);
    http.expectOne('/api/reruns/rr1').flush(detail());
    fixture.detectChanges();
    (Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.trim() === 'Reproduce') as HTMLButtonElement).click();
    http.expectOne('/api/reruns/rr1/reproduce').flush({ originalId: 'rr1', rerun: summary({ id: 'rr2', label: 'reproduction of “as filed”', status: 'done' }), identical: false, differences: ['engine version 1.0.0 → 1.0.1'] });
    fixture.detectChanges();
    const note = el.querySelector('.repro[data-state="different"]')!;
    expect(note.textContent).toContain('Different result');
    expect(note.textContent).toContain('engine version 1.0.0 → 1.0.1');
  });
});
