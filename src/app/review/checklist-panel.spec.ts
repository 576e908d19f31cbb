import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { CRITERIA, type Criterion } from '../../../shared/api/types';
import type { ChecklistEntryView } from '../../../shared/api/workflow';
import { ChecklistPanel } from './checklist-panel';

function entry(criterion: Criterion, over: Partial<ChecklistEntryView> = {}): ChecklistEntryView {
  return { criterion, verdict: null, note: '', auto: null, rerunId: null, reviewer: null, updatedAt: null, version: 1, ...over };
}

const ALL = (): ChecklistEntryView[] =>
  CRITERIA.map((c) =>
    c === 'variance-homogeneity'
      ? entry(c, {
          auto: {
            criterion: c, suggested: 'met', summary: 'Variances look similar.',
            evidence: [{ label: 'Largest / smallest variance', value: '1.23' }],
            basis: ['Largest/smallest variance ratio above 4 (common practice)', "Levene's test, Brown–Forsythe variant (center = median)"],
          },
        })
      : entry(c),
  );

describe('ChecklistPanel', () => {
  let fixture: ComponentFixture<ChecklistPanel>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [ChecklistPanel], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ChecklistPanel);
    fixture.componentRef.setInput('requestId', 'r1');
    fixture.detectChanges();
    el = fixture.nativeElement;
    http.expectOne('/api/requests/r1/checklist').flush(ALL());
    fixture.detectChanges();
  });
  afterEach(() => http.verify());

  const item = (c: Criterion) => el.querySelector(`[data-criterion="${c}"]`) as HTMLElement;
  const radio = (c: Criterion, label: string) =>
    Array.from(item(c).querySelectorAll('mat-radio-button')).find((r) => r.textContent?.trim() === label)!.querySelector('input') as HTMLInputElement;

  it('lists the nine criteria in order with the automatic finding and its common-practice basis', () => {
    const headings = Array.from(el.querySelectorAll('h3')).map((h) => h.textContent?.trim());
    expect(headings.length).toBe(9);
    expect(headings[0]).toBe('Independence of observations');
    expect(headings[8]).toBe('Reported versus recomputed results');
    const v = item('variance-homogeneity');
    expect(v.textContent).toContain('suggests Met');
    expect(v.textContent).toContain('Variances look similar.');
    expect(v.querySelector('.cp')?.textContent).toBe('common practice');
    expect(v.querySelector('.basis')?.textContent).toContain('Largest/smallest variance ratio above 4');
  });

  it('saves a verdict at once with the entry version and says so', () => {
    radio('outliers', 'Concern').click();
    fixture.detectChanges();
    const req = http.expectOne('/api/requests/r1/checklist/outliers');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ verdict: 'concern', note: '', version: 1 });
    req.flush(entry('outliers', { verdict: 'concern', version: 2 }));
    fixture.detectChanges();
    expect(item('outliers').textContent).toContain('Saved.');
    expect(el.querySelector('.count')?.textContent).toContain('1 of 9');
  });

  it('on 409 reloads that entry, tells the reviewer and keeps their note text', () => {
    const box = item('independence').querySelector('textarea') as HTMLTextAreaElement;
    box.value = 'Students in the same section share an instructor.';
    box.dispatchEvent(new Event('input'));
    box.dispatchEvent(new Event('change'));
    fixture.detectChanges();
    const put = http.expectOne('/api/requests/r1/checklist/independence');
    expect(put.request.body.note).toBe('Students in the same section share an instructor.');
    put.flush({ error: { status: 409, code: 'conflict', message: 'Stale version.' } }, { status: 409, statusText: 'Conflict' });
    const fresh = ALL();
    fresh[0] = entry('independence', { verdict: 'met', note: 'Checked with the registrar.', version: 3, reviewer: { id: 'u9', name: 'Head Person', email: 'h@x' }, updatedAt: '2026-11-30T10:00:00Z' });
    http.expectOne('/api/requests/r1/checklist').flush(fresh);
    fixture.detectChanges();
    const it = item('independence');
    expect(it.textContent).toContain('Someone else saved this criterion');
    expect((it.querySelector('textarea') as HTMLTextAreaElement).value).toBe('Students in the same section share an instructor.');
    expect(it.querySelector('.theirs')?.textContent).toContain('Checked with the registrar.');
    expect(radio('independence', 'Met').checked).toBe(true);
    // Saving again goes over the reloaded version.
    (Array.from(it.querySelectorAll('button')).find((b) => b.textContent?.includes('Save my version')) as HTMLButtonElement).click();
    const again = http.expectOne('/api/requests/r1/checklist/independence');
    expect(again.request.body).toEqual({ verdict: 'met', note: 'Students in the same section share an instructor.', version: 3 });
    again.flush(entry('independence', { verdict: 'met', note: 'Students in the same section share an instructor.', version: 4 }));
  });

  it('shows a state refusal as it is, without the conflict flow', () => {
    radio('outliers', 'Met').click();
    http.expectOne('/api/requests/r1/checklist/outliers').flush(
      { error: { status: 409, code: 'invalid-state', message: 'Checklist verdicts are recorded while the request is in review; this one is assigned.' } },
      { status: 409, statusText: 'Conflict' },
    );
    fixture.detectChanges();
    http.expectNone('/api/requests/r1/checklist');
    expect(item('outliers').textContent).toContain('Not saved: Checklist verdicts are recorded while the request is in review');
  });

  it('marks criteria the decision is waiting for', () => {
    fixture.componentRef.setInput('missing', ['sphericity']);
    fixture.detectChanges();
    expect(item('sphericity').classList.contains('missing')).toBe(true);
    expect(item('sphericity').textContent).toContain('Needs a verdict before the decision.');
  });

  it('is read-only for the head', () => {
    fixture.componentRef.setInput('readOnly', true);
    fixture.detectChanges();
    expect(radio('outliers', 'Met').disabled).toBe(true);
    expect((item('outliers').querySelector('textarea') as HTMLTextAreaElement).readOnly).toBe(true);
  });
});
