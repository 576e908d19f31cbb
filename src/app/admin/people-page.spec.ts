import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { Page, UserAdminRow } from '../../../shared/api/types';
import { AuthService } from '../auth/auth-service';
import { PeoplePage } from './people-page';

const margit: UserAdminRow = {
  id: 'u3', email: 'reviewer2@demo.test', name: 'Margit Sandoval', department: 'Institutional Effectiveness', roles: ['reviewer'],
  signIn: ['local', 'saml'], active: true, lastSignInAt: null, version: 4,
};
const ruth: UserAdminRow = { ...margit, id: 'u5', email: 'admin@demo.test', name: 'Ruth Abernathy', roles: ['admin'], version: 1 };
const page = (items: UserAdminRow[]): Page<UserAdminRow> => ({ items, total: items.length, page: 0, pageSize: 25 });

describe('PeoplePage', () => {
  let fixture: ComponentFixture<PeoplePage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [PeoplePage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    TestBed.inject(AuthService).me.set({ id: 'u5', email: 'admin@demo.test', name: 'Ruth Abernathy', roles: ['admin'] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PeoplePage);
    fixture.detectChanges();
    el = fixture.nativeElement;
    const req = http.expectOne((r) => r.url === '/api/admin/users');
    expect(req.request.params.get('page')).toBe('0');
    req.flush(page([margit, ruth]));
    fixture.detectChanges();
  });
  afterEach(() => http.verify());

  const box = (label: string) => el.querySelector<HTMLInputElement>(`input[aria-label="${label}"]`)!;
  const patch = (): TestRequest => http.expectOne({ method: 'PATCH', url: '/api/admin/users/u3' });

  it('grants a role with the full role list and the version it read', () => {
    expect(box('Office head role for Margit Sandoval').checked).toBe(false);
    box('Office head role for Margit Sandoval').click();
    fixture.detectChanges();
    const req = patch();
    expect(req.request.body).toEqual({ roles: ['reviewer', 'head'], version: 4 });
    req.flush({ ...margit, roles: ['reviewer', 'head'], version: 5 });
    fixture.detectChanges();
    expect(box('Office head role for Margit Sandoval').checked).toBe(true);
    expect(el.textContent).toContain('Margit Sandoval now holds the Office head role.');

    // The next change carries the new version.
    box('Reviewer role for Margit Sandoval').click();
    fixture.detectChanges();
    const second = patch();
    expect(second.request.body).toEqual({ roles: ['head'], version: 5 });
    second.flush({ ...margit, roles: ['head'], version: 6 });
  });

  it('on 409 puts the box back and offers a reload', () => {
    box('Submitter role for Margit Sandoval').click();
    fixture.detectChanges();
    patch().flush({ error: { status: 409, code: 'conflict', message: 'stale' } }, { status: 409, statusText: 'Conflict' });
    fixture.detectChanges();
    expect(box('Submitter role for Margit Sandoval').checked).toBe(false);
    const alert = el.querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('Someone else changed Margit Sandoval');
    Array.from(alert.querySelectorAll('button')).find((b) => b.textContent?.includes('Reload'))!.click();
    fixture.detectChanges();
    http.expectOne((r) => r.url === '/api/admin/users').flush(page([{ ...margit, roles: ['reviewer', 'submitter'], version: 5 }, ruth]));
    fixture.detectChanges();
    expect(box('Submitter role for Margit Sandoval').checked).toBe(true);
    expect(el.querySelector('[role="alert"]')).toBeNull();
  });

  it('does not let the signed-in admin remove their own admin role', () => {
    expect(box('Administrator role for Ruth Abernathy').disabled).toBe(true);
    expect(box('Administrator role for Margit Sandoval').disabled).toBe(false);
  });
});
