import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { OfficeSettings, Workload } from '../../../shared/api/workflow';
import { addDaysIso, todayIso } from '../intake/calendar-days';
import { WorkloadPage } from './workload-page';

const today = todayIso();
const workload: Workload = {
  serviceLevelDays: 15,
  unassigned: 2,
  reviewers: [
    {
      reviewer: { id: 'r1', name: 'Tomasz Reyes-Hallam', email: 'reviewer@demo.test' }, department: 'Office of Institutional Effectiveness',
      expertise: ['two-independent', 'mixed'], openCount: 4, dueSoon: 1, overdue: 1,
      open: [
        { id: 'a', reference: 'HV-2026-011', title: 'Belonging survey waves', state: 'in-review', dueAt: addDaysIso(today, 20) },
        { id: 'b', reference: 'HV-2026-004', title: 'Writing centre visits', state: 'in-review', dueAt: addDaysIso(today, -2) },
        { id: 'c', reference: 'HV-2026-009', title: 'Advising contact hours', state: 'assigned', dueAt: addDaysIso(today, 2) },
        { id: 'd', reference: 'HV-2026-012', title: 'Tutoring midterms', state: 'revision-requested', dueAt: addDaysIso(today, -5) },
      ],
      medianTurnaroundDays: 12,
      completed: [
        { reference: 'HV-2026-001', decidedAt: '2026-10-02T00:00:00Z', days: 9 },
        { reference: 'HV-2026-002', decidedAt: '2026-10-20T00:00:00Z', days: 15 },
      ],
    },
    {
      reviewer: { id: 'r2', name: 'Imani Castellanos', email: 'reviewer2@demo.test' }, department: null,
      expertise: [], openCount: 0, dueSoon: 0, overdue: 0, open: [], medianTurnaroundDays: null, completed: [],
    },
  ],
};

describe('WorkloadPage', () => {
  let fixture: ComponentFixture<WorkloadPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [WorkloadPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(WorkloadPage);
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  function load(): void {
    http.expectOne('/api/workload').flush(workload);
    http.expectOne('/api/office/settings').flush({ dueSoonDays: 3 } as OfficeSettings);
    fixture.detectChanges();
  }
  const card = (name: string) => Array.from(el.querySelectorAll<HTMLElement>('section.card')).find((c) => c.textContent?.includes(name))!;

  it('shows one card per reviewer with counts, expertise and open requests soonest due first', () => {
    load();
    expect(el.querySelectorAll('section.card').length).toBe(2);
    const t = card('Tomasz Reyes-Hallam');
    expect(t.textContent).toContain('Two independent groups');
    expect(t.textContent).toContain('Mixed (between and within factors)');
    const refs = Array.from(t.querySelectorAll('tbody tr')).map((r) => r.querySelector('.ref')!.textContent!.trim());
    expect(refs).toEqual(['HV-2026-012', 'HV-2026-004', 'HV-2026-009', 'HV-2026-011']);
    expect(card('Imani Castellanos').textContent).toContain('None declared');
    expect(card('Imani Castellanos').textContent).toContain('No open requests.');
    expect(el.querySelector('.summary')!.textContent).toContain('2 waiting for assignment');
  });

  it('marks overdue and due-soon requests in words, not colour alone, and offers reassignment', () => {
    load();
    const rows = Array.from(card('Tomasz Reyes-Hallam').querySelectorAll('tbody tr'));
    // A revision round pauses the reviewer's clock: no overdue marker although the date has passed.
    expect(rows[0].querySelector('.marker')!.textContent).toContain('With submitter');
    expect(rows[1].querySelector('.marker')!.textContent).toContain('Overdue');
    expect(rows[2].querySelector('.marker')!.textContent).toContain('Due soon');
    expect(rows[3].querySelector('.marker')).toBeNull();
    expect(rows[1].querySelector('a[aria-label="Reassign HV-2026-004"]')!.getAttribute('href')).toBe('/requests/b/assign');
  });

  it('draws the turnaround chart with a title and description, and switches to a data table', () => {
    load();
    const svg = el.querySelector('svg.chart')!;
    expect(svg.getAttribute('role')).toBe('img');
    expect(svg.querySelector('title')!.textContent).toContain('Turnaround per reviewer');
    expect(svg.querySelector('desc')!.textContent).toContain('Tomasz Reyes-Hallam: median 12 days over 2 completed reviews, within the 15-day service level.');
    expect(svg.querySelectorAll('circle.dot').length).toBe(2);
    const toggle = Array.from(el.querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Show as table'))!;
    expect(toggle.getAttribute('aria-pressed')).toBe('false');
    toggle.click();
    fixture.detectChanges();
    expect(el.querySelector('svg.chart')).toBeNull();
    const table = el.querySelector('table.data')!;
    const first = table.querySelector('tbody tr')!;
    expect(first.querySelector('th')!.textContent).toContain('Tomasz Reyes-Hallam');
    expect(first.textContent).toContain('HV-2026-001: 9');
    expect(toggle.getAttribute('aria-pressed')).toBe('true');
  });

  it('shows an error with retry when the board cannot load', () => {
    http.expectOne('/api/workload').flush({ error: { status: 403, code: 'forbidden', message: 'Only the office head sees the workload.' } }, { status: 403, statusText: 'Forbidden' });
    expect(http.expectOne('/api/office/settings').cancelled).toBe(true);
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('Only the office head sees the workload.');
  });
});
