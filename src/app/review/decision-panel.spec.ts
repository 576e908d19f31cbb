import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { Criterion, RequestDetail } from '../../../shared/api/types';
import { AuthService } from '../auth/auth-service';
import { DecisionPanel } from './decision-panel';

const request: RequestDetail = {
  id: 'r1', reference: 'HV-2026-004', title: 'Student belonging survey', state: 'in-review', designKind: 'repeated-measures',
  department: 'Student Success', submitter: { id: 'u1', name: 'Priya Okonkwo-Hale', email: 'submitter@demo.test' },
  reviewer: { id: 'u2', name: 'Tomas Lindqvist', email: 'reviewer@demo.test' },
  createdAt: '2026-09-01T10:00:00Z', filedAt: '2026-10-02T09:30:00Z', dueAt: null, deadline: null, updatedAt: '2026-11-25T14:12:00Z',
  purpose: '', decisionInformed: '', audience: '', samplingNotes: '', plan: null, datasets: [], version: 7, reported: [], departmentId: null, revisionNo: 1,
  can: { edit: false, assign: false, review: true, decide: true, withdraw: false },
};

describe('DecisionPanel', () => {
  let fixture: ComponentFixture<DecisionPanel>;
  let http: HttpTestingController;
  let el: HTMLElement;
  let missing: Criterion[][];

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [DecisionPanel], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthService).me.set({ id: 'u2', email: 'reviewer@demo.test', name: 'Tomas Lindqvist', roles: ['reviewer'] });
    fixture = TestBed.createComponent(DecisionPanel);
    fixture.componentRef.setInput('request', request);
    missing = [];
    fixture.componentInstance.missingChange.subscribe((m) => missing.push(m));
    fixture.detectChanges();
    el = fixture.nativeElement;
    http.expectOne('/api/requests/r1/decision').flush({ error: { status: 404, code: 'not-found', message: 'No decision yet.' } }, { status: 404, statusText: 'Not Found' });
    http.expectOne('/api/requests/r1/letters').flush([]);
    fixture.detectChanges();
  });
  afterEach(() => http.verify());

  function fill(decision: string, rationale: string): void {
    const r = Array.from(el.querySelectorAll('mat-radio-button')).find((b) => b.textContent?.trim() === decision)!;
    (r.querySelector('input') as HTMLInputElement).click();
    fixture.detectChanges();
    const why = el.querySelector('#dec-why') as HTMLTextAreaElement;
    why.value = rationale;
    why.dispatchEvent(new Event('input'));
    fixture.detectChanges();
  }

  const submit = () => { (el.querySelector('form.decide button[type="submit"]') as HTMLButtonElement).click(); fixture.detectChanges(); };

  it('maps a 422 to the criteria still missing a verdict, listed in words and passed to the checklist', () => {
    fill('Endorse', 'The analysis holds up.');
    submit();
    const req = http.expectOne('/api/requests/r1/decision');
    expect(req.request.body).toEqual({ decision: 'endorse', conditions: [], rationale: 'The analysis holds up.', version: 7 });
    req.flush(
      { error: { status: 422, code: 'validation', message: 'Give a verdict on every criterion first: sphericity, outliers.',
        fields: { 'checklist.sphericity': 'No verdict yet.', 'checklist.outliers': 'No verdict yet.' } } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    fixture.detectChanges();
    const alert = el.querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('2 criteria need a verdict first');
    expect(Array.from(alert.querySelectorAll('li')).map((li) => li.textContent)).toEqual(['Sphericity', 'Outliers']);
    expect(missing.at(-1)).toEqual(['sphericity', 'outliers']);
  });

  it('reads a `missing` array too', () => {
    fill('Not endorsed', 'Too small.');
    submit();
    http.expectOne('/api/requests/r1/decision').flush(
      { error: { status: 422, code: 'incomplete', message: 'The checklist is incomplete.', missing: ['reported-agreement'] } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    expect(missing.at(-1)).toEqual(['reported-agreement']);
  });

  it('asks for conditions before sending an endorsement with conditions', () => {
    fill('Endorse with conditions', 'Fine with changes.');
    submit();
    http.expectNone('/api/requests/r1/decision');
    expect(el.querySelector('.field-error')?.textContent).toContain('List at least one condition');
  });

  it('after a decision offers the signing step', () => {
    fill('Endorse', 'Sound.');
    submit();
    http.expectOne('/api/requests/r1/decision').flush({ decision: 'endorse', conditions: [], rationale: 'Sound.', decidedBy: request.reviewer, decidedAt: '2026-12-01T10:00:00Z', rerunId: 'rr1' });
    fixture.detectChanges();
    expect(el.textContent).toContain('Decision recorded: Endorse');
    expect(Array.from(el.querySelectorAll('button')).some((b) => b.textContent?.includes('Sign the letter'))).toBe(true);
  });
});
