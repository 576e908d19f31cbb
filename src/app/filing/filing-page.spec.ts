import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatStepper } from '@angular/material/stepper';
import { By } from '@angular/platform-browser';
import { provideRouter } from '@angular/router';
import type { DatasetPreview } from '../../../shared/api/workflow';
import { FilingPage } from './filing-page';
import { sampleDataset } from './test-data';

const draft = {
  id: 'r1', reference: 'HV-2026-021', title: 'Tutoring drop-in hours', state: 'draft', designKind: 'two-independent',
  department: 'Student Success', submitter: { id: 'u1', name: 'Priya Okonkwo-Hale', email: 'submitter@demo.test' }, reviewer: null,
  createdAt: '2026-11-30T09:00:00Z', filedAt: null, dueAt: null, deadline: '2027-01-15', updatedAt: '2026-11-30T10:00:00Z',
  purpose: 'Do drop-in hours help credits completed?', decisionInformed: 'Whether to keep drop-in hours.', audience: 'Dean of students', samplingNotes: 'All first-year students, one row each.',
  plan: { designKind: 'two-independent', outcome: 'credits', between: [{ column: 'format', levels: ['drop-in', 'scheduled'] }], within: [], subject: null, predictors: [], alpha: 0.05, comparisons: [], submitterCorrection: 'none' },
  datasets: [], version: 3, can: { edit: true, assign: false, review: false, decide: false, withdraw: true },
};

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// The page renders the whole Material stepper; on a busy machine the first render takes seconds.
vi.setConfig({ testTimeout: 30_000 });

describe('FilingPage', () => {
  let fixture: ComponentFixture<FilingPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  function open(datasets: DatasetPreview[]): void {
    TestBed.configureTestingModule({ imports: [FilingPage], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FilingPage);
    fixture.componentRef.setInput('id', 'r1');
    fixture.detectChanges();
    http.expectOne('/api/departments').flush([{ id: 'dep1', code: 'SS', name: 'Student Success' }]);
    http.expectOne('/api/office/settings').flush({ defaultAlpha: 0.05 });
    http.expectOne('/api/requests/r1').flush(draft);
    http.expectOne('/api/requests/r1/datasets').flush(datasets);
    fixture.detectChanges();
    el = fixture.nativeElement;
  }
  afterEach(() => http.verify());

  const submitButton = () => Array.from(el.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Submit for review'))!;

  it('fills the steps from the saved draft', () => {
    open([sampleDataset()]);
    expect(el.querySelector<HTMLInputElement>('input[formcontrolname="title"]')!.value).toBe('Tutoring drop-in hours');
    expect(el.querySelector<HTMLInputElement>('input[formcontrolname="levels"]')!.value).toBe('drop-in, scheduled');
    expect(submitButton().disabled).toBe(false);
  });

  it('disables Submit while the data has unanswered identifier columns, and says why', () => {
    open([sampleDataset({ blocked: true, identifierFindings: [{ column: 'email', kind: 'email', matchShare: 1, reason: 'e-mail addresses' }] })]);
    const button = submitButton();
    expect(button.disabled).toBe(true);
    const why = el.querySelector(`#${button.getAttribute('aria-describedby')}`)!;
    expect(why.textContent).toContain('look like personal identifiers');
  });

  it('puts the server\'s problems next to their fields, opens the first step with one and focuses it', async () => {
    open([sampleDataset()]);
    submitButton().click();
    await sleep(0);
    const req = http.expectOne('/api/requests/r1/submit');
    expect(req.request.body).toEqual({ version: 3 });
    req.flush({ error: { status: 422, code: 'validation', message: 'The plan does not fit the data.', fields: {
      'plan.outcome': 'Column "credits" has 3 missing values and text in row 40.', dataset: 'The file has one group only after removing missing rows.',
    } } }, { status: 422, statusText: 'Unprocessable Entity' });
    await sleep(0);
    fixture.detectChanges();
    const stepper = fixture.debugElement.query(By.directive(MatStepper)).componentInstance as MatStepper;
    expect(stepper.selectedIndex).toBe(1);
    const outcome = el.querySelector('[data-field="plan.outcome"]')!;
    expect(outcome.textContent).toContain('has 3 missing values and text in row 40');
    expect(el.querySelector('[data-field="dataset"]')!.textContent).toContain('one group only');
    expect(el.querySelector('.result[role="alert"]')!.textContent).toContain('The plan does not fit the data.');
    await sleep(400);
    expect(outcome.contains(document.activeElement)).toBe(true);
  });

  it('checks locally first: a plan missing its grouping column goes back to Design without calling the server', async () => {
    open([sampleDataset()]);
    fixture.componentInstance['form'].controls.design.controls.between.clear();
    fixture.detectChanges();
    submitButton().click();
    await sleep(0);
    // The change is saved first (the autosave flush), then no submit call follows.
    const save = http.expectOne('/api/requests/r1');
    expect(save.request.method).toBe('PATCH');
    save.flush({ ...draft, version: 4 });
    await sleep(0);
    fixture.detectChanges();
    http.expectNone('/api/requests/r1/submit');
    expect(el.querySelector('[data-field="plan.between"]')!.textContent).toContain('exactly one grouping column');
  });

  it('autosaves typing after a pause with the version, and on 409 keeps the text and offers a reload', async () => {
    open([sampleDataset()]);
    const title = el.querySelector<HTMLInputElement>('input[formcontrolname="title"]')!;
    title.value = 'Tutoring drop-in hours, autumn term';
    title.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    expect(el.querySelector('as-save-status')!.textContent).toContain('Unsaved changes');
    http.expectNone('/api/requests/r1');
    await sleep(1300);
    const req = http.expectOne('/api/requests/r1');
    expect(req.request.body).toEqual({ title: 'Tutoring drop-in hours, autumn term', version: 3 });
    req.flush({ error: { status: 409, code: 'conflict', message: 'Someone else changed this request.' } }, { status: 409, statusText: 'Conflict' });
    await sleep(0);
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')!.textContent).toContain('saved somewhere else');
    expect(title.value).toBe('Tutoring drop-in hours, autumn term');
    expect(submitButton().disabled).toBe(true);
    Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Load the saved version'))!.click();
    http.expectOne('/api/requests/r1').flush({ ...draft, title: 'Drop-in tutoring', version: 5 });
    fixture.detectChanges();
    expect(el.querySelector('.kept textarea')!.textContent).toContain('Tutoring drop-in hours, autumn term');
    expect(el.querySelector<HTMLInputElement>('input[formcontrolname="title"]')!.value).toBe('Drop-in tutoring');
  });
});
