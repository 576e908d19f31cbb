import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { RequestDetail } from '../../../shared/api/types';
import { RequestDetailPage } from './request-detail-page';

const detail: RequestDetail = {
  id: 'r1', reference: 'HV-2026-014', title: 'Three-format advising pilot', state: 'in-review', designKind: 'between-anova',
  department: 'Student Success', submitter: { id: 'u1', name: 'Priya Okonkwo-Hale', email: 'submitter@demo.test' },
  reviewer: { id: 'u2', name: 'Tomas Lindqvist', email: 'reviewer@demo.test' },
  createdAt: '2026-09-01T10:00:00Z', filedAt: '2026-10-02T09:30:00Z', dueAt: '2026-11-20T17:00:00Z', deadline: null, updatedAt: '2026-11-25T14:12:00Z',
  purpose: 'Choose an advising format.', decisionInformed: 'College-wide adoption.', audience: 'Academic Council', samplingNotes: 'One row per student.',
  plan: { design: 'anova', outcome: 'credits_completed', between: ['advising_format'], comparisons: [{ factor: 'advising_format', method: 'tukey' }] },
  datasets: [{ id: 'd1', filename: 'advising.csv', sha256: 'ab'.repeat(32), rows: 144, columns: ['a', 'b'], uploadedAt: '2026-10-02T09:12:00Z' }],
  version: 3, can: { edit: false, assign: false, review: true, decide: false, withdraw: false },
};

describe('RequestDetailPage', () => {
  let fixture: ComponentFixture<RequestDetailPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [RequestDetailPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RequestDetailPage);
    fixture.componentRef.setInput('id', 'r1');
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  it('shows the request with its state in words, its plan and file', () => {
    http.expectOne('/api/requests/r1').flush(detail);
    fixture.detectChanges();
    expect(el.querySelector('h1')?.textContent).toContain('Three-format advising pilot');
    expect(el.textContent).toContain('In review');
    expect(el.textContent).toContain('credits_completed');
    expect(el.textContent).toContain('advising_format (Tukey HSD)');
    expect(el.textContent).toContain('advising.csv');
  });

  it('greys out what the viewer cannot do and says why', () => {
    http.expectOne('/api/requests/r1').flush(detail);
    fixture.detectChanges();
    const items = Array.from(el.querySelectorAll('.actions li'));
    const review = items.find((li) => li.textContent?.includes('Review: rerun and checklist'))!;
    const assign = items.find((li) => li.textContent?.includes('Assign a reviewer'))!;
    expect(review.classList.contains('off')).toBe(false);
    expect(review.textContent).toContain('Available to you');
    expect(assign.classList.contains('off')).toBe(true);
    expect(assign.textContent).toContain('The office head assigns');
  });

  it('shows a failed load with a retry', () => {
    http.expectOne('/api/requests/r1').flush({ error: { status: 404, code: 'not-found', message: 'No request HV-2026-999.' } }, { status: 404, statusText: 'Not Found' });
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('No request HV-2026-999.');
    Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Try again'))!.click();
    fixture.detectChanges();
    http.expectOne('/api/requests/r1').flush(detail);
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')).toBeNull();
  });
});
