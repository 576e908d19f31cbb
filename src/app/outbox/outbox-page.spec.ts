import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { OutboxMail } from '../../../shared/api/workflow';
import { OutboxPage } from './outbox-page';

const mail = (id: string, at: string, html: string | null): OutboxMail => ({
  id, receivedAt: at, from: 'assayer@demo.test', to: ['reviewer@demo.test'], subject: `Assigned: HV-2026-00${id}`,
  text: `Plain body ${id}`, html,
});

describe('OutboxPage', () => {
  let fixture: ComponentFixture<OutboxPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [OutboxPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(OutboxPage);
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  it('says it is for development, lists newest first and shows the text part', () => {
    http.expectOne('/api/admin/outbox').flush([mail('1', '2026-12-01T08:00:00Z', null), mail('2', '2026-12-01T09:00:00Z', '<p>x</p>')]);
    fixture.detectChanges();
    expect(el.querySelector('.dev-note')!.textContent).toContain('Development only.');
    const subjects = Array.from(el.querySelectorAll('.mail .subject')).map((s) => s.textContent);
    expect(subjects).toEqual(['Assigned: HV-2026-002', 'Assigned: HV-2026-001']);
    expect(el.querySelector('pre.text')!.textContent).toContain('Plain body 2');
  });

  it('renders the HTML part only inside a sandboxed iframe via srcdoc', () => {
    http.expectOne('/api/admin/outbox').flush([mail('2', '2026-12-01T09:00:00Z', '<p>Hello</p><script>parent.x=1</script>')]);
    fixture.detectChanges();
    const htmlToggle = Array.from(el.querySelectorAll<HTMLButtonElement>('mat-button-toggle button')).find((b) => b.textContent?.includes('HTML'))!;
    htmlToggle.click();
    fixture.detectChanges();
    const frame = el.querySelector('iframe')!;
    expect(frame.getAttribute('sandbox')).toBe('');
    expect(frame.getAttribute('srcdoc')).toContain('<p>Hello</p>');
    expect(el.querySelector('.reader p')).toBeNull();
  });

  it('explains a 404 as mail not being caught locally', () => {
    http.expectOne('/api/admin/outbox').flush({ error: { status: 404, code: 'not-found', message: 'Not found' } }, { status: 404, statusText: 'Not Found' });
    fixture.detectChanges();
    expect(el.textContent).toContain('Mail is not caught locally on this installation.');
  });
});
