import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { openDeclineDialog } from './decline-dialog';

describe('DeclineDialog', () => {
  let http: HttpTestingController;
  let result: boolean | undefined | 'open';

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    result = 'open';
    openDeclineDialog(TestBed.inject(MatDialog), { requestId: 'req-7', reference: 'HV-2026-007' }).subscribe((r) => (result = r));
    TestBed.tick();
  });
  afterEach(() => {
    http.verify();
    TestBed.inject(MatDialog).closeAll();
  });

  const pane = () => document.querySelector<HTMLElement>('as-decline-dialog')!;
  const declineButton = () => Array.from(pane().querySelectorAll<HTMLButtonElement>('button')).find((b) => b.textContent?.includes('Decline'))!;

  it('asks for a reason and a note before sending anything', () => {
    expect(pane().querySelector('h2')!.textContent).toContain('Decline HV-2026-007');
    declineButton().click();
    TestBed.tick();
    expect(pane().textContent).toContain('Choose a reason.');
    expect(pane().textContent).toContain('Say briefly why');
    http.expectNone('/api/requests/req-7/assignment/decline');
    expect(result).toBe('open');
  });

  it('sends a declared conflict with its note and closes with true', async () => {
    const conflict = Array.from(pane().querySelectorAll<HTMLInputElement>('input[type=radio]'))[0]!;
    conflict.click();
    const note = pane().querySelector<HTMLTextAreaElement>('textarea')!;
    note.value = 'I advised the submitter on this survey design last spring.';
    note.dispatchEvent(new Event('input'));
    TestBed.tick();
    declineButton().click();
    const req = http.expectOne('/api/requests/req-7/assignment/decline');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ reason: 'conflict', note: 'I advised the submitter on this survey design last spring.' });
    req.flush(null, { status: 204, statusText: 'No Content' });
    TestBed.tick();
    await new Promise((r) => setTimeout(r, 0));
    expect(result).toBe(true);
  });

  it('keeps the dialog open and shows the server message when the decline is refused', () => {
    Array.from(pane().querySelectorAll<HTMLInputElement>('input[type=radio]'))[1]!.click();
    const note = pane().querySelector<HTMLTextAreaElement>('textarea')!;
    note.value = 'Two other reviews due the same week.';
    note.dispatchEvent(new Event('input'));
    declineButton().click();
    http.expectOne('/api/requests/req-7/assignment/decline').flush(
      { error: { status: 403, code: 'forbidden', message: 'Only the assigned reviewer can decline this request.' } }, { status: 403, statusText: 'Forbidden' });
    TestBed.tick();
    expect(pane().querySelector('[role=alert]')!.textContent).toContain('Only the assigned reviewer can decline this request.');
    expect(result).toBe('open');
  });
});
