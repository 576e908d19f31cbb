import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Router, provideRouter } from '@angular/router';
import type { RequestDetail } from '../../../shared/api/types';
import type { AssignmentCandidate, OfficeSettings } from '../../../shared/api/workflow';
import { addDaysIso, todayIso } from './calendar-days';
import { AssignPage } from './assign-page';

const request: RequestDetail = {
  id: 'req-7', reference: 'HV-2026-007', title: 'Peer tutoring and first-term credits', state: 'filed', designKind: 'two-independent',
  department: 'Student Success and Advising', submitter: { id: 'u-sub', name: 'Dana Whitcombe', email: 'submitter@demo.test' },
  reviewer: null, createdAt: '2026-11-20T09:00:00Z', filedAt: '2026-11-24T09:00:00Z', dueAt: null, deadline: '2026-12-20',
  updatedAt: '2026-11-24T09:00:00Z', purpose: '', decisionInformed: '', audience: '', samplingNotes: '', plan: null, datasets: [],
  reported: [], departmentId: 'd-ssa', revisionNo: 1,
  version: 4, can: { edit: false, assign: true, review: false, decide: false, withdraw: false },
};
const person = (id: string, name: string) => ({ id, name, email: `${id}@demo.test` });
const candidates: AssignmentCandidate[] = [
  { reviewer: person('r-busy', 'Imani Castellanos'), openCount: 5, expertiseMatch: false, expertise: ['paired'], conflict: null, suggested: false },
  { reviewer: person('r-best', 'Tomasz Reyes-Hallam'), openCount: 1, expertiseMatch: true, expertise: ['two-independent'], conflict: null, suggested: true },
  { reviewer: person('r-ssa', 'Marta Ilves'), openCount: 0, expertiseMatch: true, expertise: [],
    conflict: 'works in the submitter’s department (Student Success and Advising)', suggested: false },
];
const settings = { serviceLevelDays: 15, dueSoonDays: 3 } as OfficeSettings;

describe('AssignPage', () => {
  let fixture: ComponentFixture<AssignPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [AssignPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AssignPage);
    fixture.componentRef.setInput('id', 'req-7');
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  function loadAll(): void {
    http.expectOne('/api/requests/req-7').flush(request);
    http.expectOne('/api/requests/req-7/assignment/candidates').flush(candidates);
    http.expectOne('/api/office/settings').flush(settings);
    fixture.detectChanges();
  }
  const radio = (name: string) =>
    Array.from(el.querySelectorAll<HTMLElement>('.candidate')).find((c) => c.textContent?.includes(name))!;
  const submit = () => el.querySelector<HTMLButtonElement>('button[type=submit]')!;

  it('shows a conflicted reviewer disabled, with the reason in words', () => {
    loadAll();
    const blocked = radio('Marta Ilves');
    expect(blocked.querySelector<HTMLInputElement>('input[type=radio]')!.disabled).toBe(true);
    expect(blocked.textContent).toContain('Cannot be assigned: works in the submitter’s department (Student Success and Advising)');
    expect(radio('Imani Castellanos').querySelector<HTMLInputElement>('input[type=radio]')!.disabled).toBe(false);
  });

  it('preselects the suggested reviewer, labels the badge and defaults the due date to today plus the service level', () => {
    loadAll();
    const best = radio('Tomasz Reyes-Hallam');
    expect(best.querySelector<HTMLInputElement>('input[type=radio]')!.checked).toBe(true);
    expect(best.textContent).toContain('Suggested');
    expect(best.textContent).toContain('1 open request');
    expect(best.textContent).toContain('Expertise matches this design');
    expect(radio('Imani Castellanos').textContent).not.toContain('Suggested');
    expect(el.querySelector<HTMLInputElement>('input[type=date]')!.value).toBe(addDaysIso(todayIso(), 15));
    expect(submit().textContent).toContain('Assign to Tomasz Reyes-Hallam');
  });

  it('sends reviewer, due date, note and version, then returns to the queue with a confirmation', () => {
    loadAll();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    submit().click();
    const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/requests/req-7/assignment');
    expect(put.request.body).toEqual({ reviewerId: 'r-best', dueAt: addDaysIso(todayIso(), 15), note: undefined, version: 4 });
    put.flush({});
    expect(navigate).toHaveBeenCalledWith(['/requests/intake'], {
      state: { assigned: { reference: 'HV-2026-007', reviewer: 'Tomasz Reyes-Hallam', dueAt: addDaysIso(todayIso(), 15), reassigned: false } },
    });
  });

  it('shows the server’s conflict-of-interest message next to the choice and stays on the page', () => {
    loadAll();
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate');
    submit().click();
    http.expectOne('/api/requests/req-7/assignment').flush(
      { error: { status: 409, code: 'conflict-of-interest', message: 'Tomasz Reyes-Hallam declared a conflict with this submitter.' } },
      { status: 409, statusText: 'Conflict' },
    );
    fixture.detectChanges();
    const fieldset = el.querySelector('fieldset.candidates')!;
    const alert = fieldset.querySelector('#conflict-msg')!;
    expect(alert.getAttribute('role')).toBe('alert');
    expect(alert.textContent).toContain('Tomasz Reyes-Hallam declared a conflict with this submitter.');
    expect(fieldset.getAttribute('aria-describedby')).toBe('conflict-msg');
    // Beside the chosen reviewer, not at the foot of the form.
    expect(alert.closest('.candidate')!.textContent).toContain('Tomasz Reyes-Hallam');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('explains a stale version and offers to reload', () => {
    loadAll();
    submit().click();
    http.expectOne('/api/requests/req-7/assignment').flush(
      { error: { status: 409, code: 'conflict', message: 'The request was changed by someone else.' } },
      { status: 409, statusText: 'Conflict' },
    );
    fixture.detectChanges();
    const problem = el.querySelector('.save-problem')!;
    expect(problem.textContent).toContain('changed since you opened it');
    expect(el.querySelector('#conflict-msg')).toBeNull();
    const reload = Array.from(problem.querySelectorAll('button')).find((b) => b.textContent?.includes('Reload'))!;
    reload.click();
    loadAll();
    expect(el.querySelector('.save-problem')).toBeNull();
  });

  it('reassigns an assigned request and returns to the workload board', () => {
    http.expectOne('/api/requests/req-7').flush({ ...request, state: 'assigned', reviewer: person('r-busy', 'Imani Castellanos') });
    http.expectOne('/api/requests/req-7/assignment/candidates').flush(candidates);
    http.expectOne('/api/office/settings').flush(settings);
    fixture.detectChanges();
    expect(el.querySelector('h1')!.textContent).toContain('Reassign the review');
    expect(radio('Imani Castellanos').textContent).toContain('Currently assigned');
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    submit().click();
    http.expectOne('/api/requests/req-7/assignment').flush({});
    expect(navigate).toHaveBeenCalledWith(['/workload'], expect.objectContaining({ state: { assigned: expect.objectContaining({ reassigned: true }) } }));
  });

  it('leaves the due date empty when the settings cannot be read, so the server applies the service level', () => {
    http.expectOne('/api/requests/req-7').flush(request);
    http.expectOne('/api/requests/req-7/assignment/candidates').flush(candidates);
    http.expectOne('/api/office/settings').flush(null, { status: 500, statusText: 'Error' });
    fixture.detectChanges();
    expect(el.querySelector<HTMLInputElement>('input[type=date]')!.value).toBe('');
    expect(el.textContent).toContain('Leave empty to apply the office');
  });

  it('shows a load error with a retry when the request cannot be read', () => {
    http.expectOne('/api/requests/req-7').flush({ error: { status: 404, code: 'not-found', message: 'Request not found.' } }, { status: 404, statusText: 'Not Found' });
    // The failed read cancels the other two calls.
    expect(http.expectOne('/api/requests/req-7/assignment/candidates').cancelled).toBe(true);
    expect(http.expectOne('/api/office/settings').cancelled).toBe(true);
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('Request not found.');
  });
});
