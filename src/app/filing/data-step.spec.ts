import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { DataStep } from './data-step';
import { createFilingForm } from './filing-form';
import { sampleDataset } from './test-data';

describe('DataStep', () => {
  let fixture: ComponentFixture<DataStep>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [DataStep], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DataStep);
    fixture.componentRef.setInput('requestId', 'r1');
    fixture.componentRef.setInput('design', createFilingForm().controls.design);
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  it('shows upload progress as it happens, then the columns, kinds, missing counts and first rows', () => {
    const file = new File(['student_code,format,credits\n'], 'tutoring-pilot.csv', { type: 'text/csv' });
    fixture.componentInstance.upload(file);
    const req = http.expectOne('/api/requests/r1/datasets');
    expect(req.request.method).toBe('POST');
    expect((req.request.body as FormData).get('file')).toBeInstanceOf(File);
    expect(req.request.reportProgress).toBe(true);
    req.event({ type: HttpEventType.UploadProgress, loaded: 512, total: 2048 });
    fixture.detectChanges();
    const live = el.querySelector('.progress')!;
    expect(live.getAttribute('aria-live')).toBe('polite');
    expect(live.textContent).toContain('Uploading… 25%');
    expect(el.querySelector('mat-progress-bar')).not.toBeNull();

    req.flush(sampleDataset());
    fixture.detectChanges();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(el.textContent).toContain('"tutoring-pilot.csv" was read: 96 rows, 3 columns.');
    const colRows = Array.from(el.querySelectorAll('table.cols tbody tr')).map((r) => Array.from(r.children).map((c) => c.textContent!.trim()));
    expect(colRows[0]).toEqual(['student_code', 'Identifier-like', '0', '96', 'S001, S002, …']);
    expect(colRows[2]).toEqual(['credits', 'Numbers', '3', '14', '3 to 18']);
    const cells = Array.from(el.querySelectorAll('table.rows tbody tr')).map((r) => Array.from(r.querySelectorAll('td')).map((c) => c.textContent!.trim()));
    expect(cells).toEqual([['S001', 'drop-in', '12'], ['S002', 'scheduled', '—']]);
    expect(el.querySelector('table.rows caption')!.textContent).toContain('First 2 of 96 rows');
  });

  it('says plainly when the server refuses a file and keeps nothing', () => {
    fixture.componentInstance.upload(new File(['x'], 'scores.csv'));
    http.expectOne('/api/requests/r1/datasets').flush(
      { error: { status: 400, code: 'validation', message: 'Row 14 has 5 cells but the header has 3 columns.' } }, { status: 400, statusText: 'Bad Request' });
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')!.textContent).toContain('The file was not stored. Row 14 has 5 cells');
    expect(fixture.componentInstance.datasets()).toEqual([]);
  });

  it('refuses a file that is not CSV or XLSX before sending it', () => {
    fixture.componentInstance.upload(new File(['x'], 'scores.sav'));
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')!.textContent).toContain('"scores.sav" is not a CSV or XLSX file');
  });

  it('lists flagged identifier columns with the reason and records a confirmation', () => {
    fixture.componentInstance.datasets.set([sampleDataset({
      blocked: true,
      identifierFindings: [{ column: 'email', kind: 'email', matchShare: 1, reason: '100% of the values in column "email" look like e-mail addresses.' }],
    })]);
    fixture.detectChanges();
    const panel = el.querySelector('as-identifier-block')!;
    expect(panel.textContent).toContain('submission is blocked');
    expect(panel.textContent).toContain('look like e-mail addresses');
    Array.from(panel.querySelectorAll('button')).find((b) => b.textContent?.includes('This column is needed'))!.click();
    fixture.detectChanges();
    const area = panel.querySelector('textarea')!;
    const keep = () => Array.from(panel.querySelectorAll('button')).find((b) => b.textContent?.includes('Keep the column'))!;
    area.value = 'too short';
    area.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    expect(keep().disabled).toBe(true);
    area.value = 'Needed to send the follow-up survey link.';
    area.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    expect(keep().disabled).toBe(false);
    keep().click();
    const req = http.expectOne('/api/requests/r1/datasets/d1/identifiers');
    expect(req.request.body).toEqual({ confirmations: [{ column: 'email', reason: 'Needed to send the follow-up survey link.' }] });
    req.flush(sampleDataset({ blocked: false, identifierFindings: [{ column: 'email', kind: 'email', matchShare: 1, reason: 'r' }], identifierConfirmations: [{ column: 'email', reason: 'Needed to send the follow-up survey link.' }] }));
  });
});
