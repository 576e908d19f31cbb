import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { RequestDetail } from '../../../shared/api/types';
import type { DecisionView, LetterView } from '../../../shared/api/workflow';
import { RequestDetailPage } from './request-detail-page';

const detail: RequestDetail = {
  id: 'r1', reference: 'HV-2026-014', title: 'Three-format advising pilot', state: 'in-review', designKind: 'between-anova',
  department: 'Student Success', submitter: { id: 'u1', name: 'Priya Okonkwo-Hale', email: 'submitter@demo.test' },
  reviewer: { id: 'u2', name: 'Tomas Lindqvist', email: 'reviewer@demo.test' },
  createdAt: '2026-09-01T10:00:00Z', filedAt: '2026-10-02T09:30:00Z', dueAt: '2026-11-20T17:00:00Z', deadline: null, updatedAt: '2026-11-25T14:12:00Z',
  purpose: 'Choose an advising format.', decisionInformed: 'College-wide adoption.', audience: 'Academic Council', samplingNotes: 'One row per student.',
  plan: { design: 'anova', outcome: 'credits_completed', between: ['advising_format'], comparisons: [{ factor: 'advising_format', method: 'tukey' }] },
  datasets: [{ id: 'd1', filename: 'advising.csv', sha256: 'ab'.repeat(32), rows: 144, columns: ['a', 'b'], uploadedAt: '2026-10-02T09:12:00Z' }],
  version: 3, reported: [], departmentId: 'dep1', revisionNo: 1, can: { edit: false, assign: false, review: true, decide: false, withdraw: false },
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

  /** Answers the panels' own calls (versions, decision, letters, comments) after the request loads. */
  function flushPanels(o: { decision?: DecisionView | null; letters?: LetterView[]; draft?: boolean } = {}): void {
    http.expectOne('/api/requests/r1/versions').flush([{ revisionNo: 1, createdAt: '2026-10-02T09:30:00Z', createdBy: detail.submitter, reason: 'filed', datasetIds: ['d1'], rerunIds: ['x'] }]);
    http.match('/api/requests/r1/comments').forEach((c) => c.flush([]));
    if (o.draft) {
      // A draft has no decision or letters to ask for.
      http.expectNone('/api/requests/r1/decision');
      fixture.detectChanges();
      return;
    }
    const d = http.expectOne('/api/requests/r1/decision');
    if (o.decision) d.flush(o.decision);
    else d.flush({ error: { status: 404, code: 'not-found', message: 'No decision yet.' } }, { status: 404, statusText: 'Not Found' });
    http.expectOne('/api/requests/r1/letters').flush(o.letters ?? []);
    http.match('/api/requests/r1/comments').forEach((c) => c.flush([]));
    fixture.detectChanges();
  }

  it('shows the request with its state in words, its plan and file', () => {
    http.expectOne('/api/requests/r1').flush(detail);
    fixture.detectChanges();
    flushPanels();
    expect(el.querySelector('h1')?.textContent).toContain('Three-format advising pilot');
    expect(el.textContent).toContain('In review');
    expect(el.textContent).toContain('credits_completed');
    expect(el.textContent).toContain('advising_format (Tukey HSD)');
    expect(el.textContent).toContain('advising.csv');
  });

  it('greys out what the viewer cannot do and says why', () => {
    http.expectOne('/api/requests/r1').flush(detail);
    fixture.detectChanges();
    flushPanels();
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
    flushPanels();
    expect(el.querySelector('[role="alert"]')).toBeNull();
  });

  const link = (text: string) => Array.from(el.querySelectorAll('a')).find((a) => a.textContent?.includes(text));

  it('offers the submitter "Continue editing" on a draft, and links to the data file', () => {
    http.expectOne('/api/requests/r1').flush({ ...detail, state: 'draft', can: { ...detail.can, review: false, edit: true, withdraw: true } });
    fixture.detectChanges();
    flushPanels({ draft: true });
    expect(link('Continue editing')!.getAttribute('href')).toBe('/requests/r1/edit');
    expect(link('Open review workspace')).toBeUndefined();
    expect(link('advising.csv')!.getAttribute('href')).toBe('/api/requests/r1/datasets/d1/file');
    expect(el.textContent).toContain('Version 1');
  });

  it('shows "Revise" with the reviewer\'s required changes when a revision is requested', () => {
    http.expectOne('/api/requests/r1').flush({ ...detail, state: 'revision-requested', can: { ...detail.can, review: false, edit: true, withdraw: true } });
    fixture.detectChanges();
    http.expectOne('/api/requests/r1/revision-request').flush({ changes: ['Report Welch\'s F, not the pooled F.', 'Add the sampling frame.'], message: 'Thanks.', requestedBy: detail.reviewer, requestedAt: '2026-11-20T10:00:00Z' });
    flushPanels();
    expect(link('Revise')!.getAttribute('href')).toBe('/requests/r1/edit');
    const items = Array.from(el.querySelectorAll('as-revision-changes li')).map((li) => li.textContent);
    expect(items).toEqual(['Report Welch\'s F, not the pooled F.', 'Add the sampling frame.']);
  });

  it('links the reviewer to the workspace and shows the decision with its letters', () => {
    http.expectOne('/api/requests/r1').flush({ ...detail, state: 'decided' });
    fixture.detectChanges();
    flushPanels({
      decision: { decision: 'endorse-with-conditions', conditions: ['Report the adjusted p-values.'], rationale: 'Sound design.', decidedBy: detail.reviewer, decidedAt: '2026-11-28T10:00:00Z', rerunId: 'x' },
      letters: [{ code: 'HV7Q-2K9M', letterNo: 1, status: 'issued', decision: 'endorse-with-conditions', signedBy: detail.reviewer, signedAt: '2026-11-28T11:00:00Z', countersignedBy: null, supersededBy: null, pdfSha256: 'cd'.repeat(32), downloadUrl: '/api/letters/HV7Q-2K9M/pdf', verifyUrl: 'https://x/verify/HV7Q-2K9M' }],
    });
    expect(link('Open review workspace')!.getAttribute('href')).toBe('/requests/r1/review');
    expect(el.textContent).toContain('Endorsed with conditions');
    expect(el.textContent).toContain('Report the adjusted p-values.');
    expect(el.textContent).toContain('Issued');
    expect(link('Download PDF')!.getAttribute('href')).toBe('/api/letters/HV7Q-2K9M/pdf');
    expect(link('Verify')!.getAttribute('href')).toBe('/verify/HV7Q-2K9M');
  });

  it('says there is no decision yet when the server answers 404', () => {
    http.expectOne('/api/requests/r1').flush(detail);
    fixture.detectChanges();
    flushPanels();
    expect(el.textContent).toContain('No decision yet.');
    expect(el.querySelector('as-outcome-panel [role="alert"]')).toBeNull();
  });
});
