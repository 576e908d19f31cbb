import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { Page, RequestSummary } from '../../../shared/api/types';
import { RequestTable } from './request-table';

function summary(n: number): RequestSummary {
  return {
    id: `r${n}`, reference: `HV-2026-${String(n).padStart(3, '0')}`, title: `Request ${n}`, state: 'filed', designKind: 'paired',
    department: 'Mathematics', submitter: { id: 'u1', name: 'Priya Okonkwo-Hale', email: 'submitter@demo.test' }, reviewer: null,
    createdAt: '2026-10-01T00:00:00Z', filedAt: '2026-10-02T00:00:00Z', dueAt: null, deadline: null, updatedAt: '2026-10-02T00:00:00Z',
  };
}
const pageOf = (items: RequestSummary[], total: number, page = 0, pageSize = 25): Page<RequestSummary> => ({ items, total, page, pageSize });

describe('RequestTable', () => {
  let fixture: ComponentFixture<RequestTable>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [RequestTable],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RequestTable);
    fixture.componentRef.setInput('scope', 'intake');
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  const nextList = (): TestRequest => http.expectOne((r) => r.url === '/api/requests');
  const param = (req: TestRequest, name: string) => req.request.params.get(name);
  function answer(req: TestRequest, body: Page<RequestSummary>) {
    req.flush(body);
    fixture.detectChanges();
  }

  it('first asks for the scope, the scope default sort and the first page', () => {
    const req = nextList();
    expect(param(req, 'scope')).toBe('intake');
    expect(param(req, 'sort')).toBe('filedAt');
    expect(param(req, 'dir')).toBe('asc');
    expect(param(req, 'page')).toBe('0');
    expect(param(req, 'pageSize')).toBe('25');
    expect(param(req, 'q')).toBeNull();
    answer(req, pageOf([summary(1), summary(2)], 2));
    const rows = el.querySelectorAll('tr.mat-mdc-row');
    expect(rows.length).toBe(2);
    expect(rows[0].textContent).toContain('HV-2026-001');
    expect(rows[0].textContent).toContain('Filed');
  });

  it('sends a new sort to the server when a column header is clicked, back on page 0', () => {
    answer(nextList(), pageOf([summary(1)], 60));
    const titleHeader = Array.from(el.querySelectorAll<HTMLElement>('th')).find((th) => th.textContent?.includes('Title'))!;
    titleHeader.click();
    fixture.detectChanges();
    const req = nextList();
    expect(param(req, 'sort')).toBe('title');
    expect(param(req, 'dir')).toBe('asc');
    expect(param(req, 'page')).toBe('0');
    answer(req, pageOf([summary(1)], 60));
  });

  it('pages through the server with the paginator', () => {
    answer(nextList(), pageOf([summary(1)], 60));
    el.querySelector<HTMLButtonElement>('button[aria-label="Next page"]')!.click();
    fixture.detectChanges();
    const req = nextList();
    expect(param(req, 'page')).toBe('1');
    expect(param(req, 'pageSize')).toBe('25');
    answer(req, pageOf([summary(26)], 60, 1));
    expect(el.textContent).toContain('26 – 50 of 60');
  });

  it('filters by state chips and by text, each time from page 0', () => {
    answer(nextList(), pageOf([summary(1)], 60));
    const chip = Array.from(el.querySelectorAll<HTMLElement>('[role="option"]')).find((o) => o.textContent?.includes('In review'))!;
    chip.click();
    fixture.detectChanges();
    let req = nextList();
    expect(param(req, 'state')).toBe('in-review');
    answer(req, pageOf([], 0));

    const input = el.querySelector<HTMLInputElement>('input[type="search"]')!;
    input.value = '  belonging ';
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    fixture.detectChanges();
    req = nextList();
    expect(param(req, 'q')).toBe('belonging');
    expect(param(req, 'state')).toBe('in-review');
    expect(param(req, 'page')).toBe('0');
    answer(req, pageOf([], 0));
    expect(el.textContent).toContain('No requests match these filters.');
  });

  it('says when the list is empty without filters', () => {
    answer(nextList(), pageOf([], 0));
    expect(el.textContent).toContain('The intake queue is empty.');
  });

  it('shows the server error with a retry that asks again', () => {
    nextList().flush({ error: { status: 500, code: 'internal', message: 'The database did not answer.' } }, { status: 500, statusText: 'Server Error' });
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('The database did not answer.');
    Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Try again'))!.click();
    fixture.detectChanges();
    answer(nextList(), pageOf([summary(3)], 1));
    expect(el.querySelector('[role="alert"]')).toBeNull();
    expect(el.textContent).toContain('HV-2026-003');
  });
});
