import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { Role } from '../../../shared/api/types';
import type { OfficeSettings } from '../../../shared/api/workflow';
import { AuthService } from '../auth/auth-service';
import { OfficeSettingsPage } from './office-settings-page';

const saved: OfficeSettings = {
  name: 'Office of Institutional Effectiveness', serviceLevelDays: 15, defaultAlpha: 0.05, countersignRequired: false, dueSoonDays: 3,
  letterhead: { unit: 'Office of Institutional Effectiveness', institution: 'Harrow Vale Community College',
    addressLines: ['1 Orchard Row', 'Harrow Vale'], email: 'oie@demo.test', phone: '', website: '' },
  version: 6,
};

describe('OfficeSettingsPage', () => {
  let fixture: ComponentFixture<OfficeSettingsPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  function create(roles: Role[]): void {
    TestBed.configureTestingModule({
      imports: [OfficeSettingsPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    TestBed.inject(AuthService).me.set({ id: 'u1', email: 'head@demo.test', name: 'Ruth Abernethy-Osei', roles });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(OfficeSettingsPage);
    fixture.detectChanges();
    el = fixture.nativeElement;
    http.expectOne('/api/office/settings').flush(saved);
    fixture.detectChanges();
  }
  afterEach(() => http.verify());

  const input = (label: string) => {
    const field = Array.from(el.querySelectorAll('mat-form-field')).find((f) => f.querySelector('mat-label')?.textContent?.trim().startsWith(label))!;
    return field.querySelector<HTMLInputElement>('input, textarea')!;
  };
  function type(label: string, value: string): void {
    const i = input(label);
    i.value = value;
    i.dispatchEvent(new Event('input'));
    i.dispatchEvent(new Event('blur'));
    fixture.detectChanges();
  }
  const fieldText = (label: string) => input(label).closest('mat-form-field')!.textContent!;
  const submit = () => {
    el.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    fixture.detectChanges();
  };

  it('fills the form from the saved settings', () => {
    create(['head']);
    expect(input('Service-level days').value).toBe('15');
    expect(input('Address').value).toBe('1 Orchard Row\nHarrow Vale');
  });

  it('names the field in each validation message and sends nothing while the form is invalid', () => {
    create(['head']);
    type('Service-level days', '0');
    type('Default alpha', '0.7');
    type('E-mail', 'not-an-address');
    type('Website', 'harrowvale.example');
    type('Institution', '');
    submit();
    expect(fieldText('Service-level days')).toContain('Service-level days must be between 1 and 365 days.');
    expect(fieldText('Default alpha')).toContain('Default alpha must be a number above 0 and below 0.5');
    expect(fieldText('E-mail')).toContain('E-mail must be an e-mail address');
    expect(fieldText('Website')).toContain('Website must start with https://');
    expect(fieldText('Institution')).toContain('Institution is required.');
    http.expectNone('/api/office/settings');
  });

  it('refuses a due-soon warning as long as the service level', () => {
    create(['head']);
    type('Service-level days', '5');
    type('Due-soon warning', '5');
    submit();
    expect(el.querySelector('#due-soon-msg')!.textContent).toContain('must be shorter than the service level');
    http.expectNone('/api/office/settings');
  });

  it('saves with the version it read and confirms', () => {
    create(['head']);
    type('Service-level days', '12');
    submit();
    const put = http.expectOne((r) => r.method === 'PUT');
    expect(put.request.body).toEqual({ ...saved, serviceLevelDays: 12, version: 6 });
    put.flush({ ...saved, serviceLevelDays: 12, version: 7 });
    fixture.detectChanges();
    expect(el.querySelector('.saved')!.textContent).toContain('Settings saved.');
  });

  it('explains a stale save (409), keeps the edits and offers a reload', () => {
    create(['head']);
    type('Service-level days', '12');
    submit();
    http.expectOne((r) => r.method === 'PUT').flush(
      { error: { status: 409, code: 'conflict', message: 'The settings were changed by someone else.' } }, { status: 409, statusText: 'Conflict' });
    fixture.detectChanges();
    expect(el.querySelector('.save-problem')!.textContent).toContain('Someone else saved the settings since you opened them');
    expect(input('Service-level days').value).toBe('12');
    const reload = Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('Reload the settings'))!;
    reload.click();
    http.expectOne('/api/office/settings').flush({ ...saved, serviceLevelDays: 20, version: 7 });
    fixture.detectChanges();
    expect(input('Service-level days').value).toBe('20');
  });

  it('puts server field messages beside their fields', () => {
    create(['head']);
    type('Phone', '01632 960 000');
    submit();
    http.expectOne((r) => r.method === 'PUT').flush(
      { error: { status: 400, code: 'validation', message: 'Check the letterhead.', fields: { 'letterhead.phone': 'Phone must be a number in the office’s country.' } } },
      { status: 400, statusText: 'Bad Request' });
    fixture.detectChanges();
    expect(fieldText('Phone')).toContain('Phone must be a number in the office’s country.');
  });

  it('is read only for a reviewer, with no save button', () => {
    create(['reviewer']);
    expect(el.querySelector('form')).toBeNull();
    expect(el.querySelector('button[type=submit]')).toBeNull();
    expect(el.querySelector('.read dl')!.textContent).toContain('15 days from assignment to decision');
    expect(el.textContent).toContain('Only the office head can change these settings.');
  });
});
