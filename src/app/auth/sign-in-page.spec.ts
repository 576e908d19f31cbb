import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { Router, provideRouter } from '@angular/router';
import { SignInPage } from './sign-in-page';

describe('SignInPage', () => {
  let fixture: ComponentFixture<SignInPage>;
  let http: HttpTestingController;
  let el: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [SignInPage],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignInPage);
    fixture.detectChanges();
    el = fixture.nativeElement;
  });
  afterEach(() => http.verify());

  const health = (demo: boolean) => {
    http.expectOne('/api/health').flush({ status: 'ok', version: '0.1.0', database: { status: 'ok' }, uptimeSeconds: 1, demo });
    fixture.detectChanges();
  };
  const type = (selector: string, value: string) => {
    const input = el.querySelector<HTMLInputElement>(selector)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  };
  const submit = () => {
    el.querySelector('form')!.dispatchEvent(new Event('submit'));
    fixture.detectChanges();
  };

  it('explains a refused institution sign-in and keeps the SSO link pointing back with RelayState', () => {
    health(false);
    fixture.componentRef.setInput('sso-error', 'no-role');
    fixture.componentRef.setInput('returnUrl', '/requests/abc');
    fixture.detectChanges();
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('no Assayer role yet');
    expect(el.querySelector<HTMLAnchorElement>('a.sso')!.getAttribute('href')).toBe('/api/auth/saml/login?RelayState=%2Frequests%2Fabc');
  });

  it('shows a message next to each empty field and sends nothing', () => {
    health(false);
    submit();
    expect(el.textContent).toContain('Enter your e-mail address.');
    expect(el.textContent).toContain('Enter your password.');
    http.expectNone('/api/auth/login');
  });

  it('asks for a full e-mail address', () => {
    health(false);
    type('input[type="email"]', 'priya');
    type('input[type="password"]', 'secret');
    submit();
    expect(el.textContent).toContain('Enter a full e-mail address');
    http.expectNone('/api/auth/login');
  });

  it('says plainly when the e-mail and password do not match', () => {
    health(false);
    type('input[type="email"]', 'submitter@demo.test');
    type('input[type="password"]', 'wrong');
    submit();
    http.expectOne('/api/auth/login').flush({ error: { status: 401, code: 'unauthenticated', message: 'x' } }, { status: 401, statusText: 'Unauthorized' });
    fixture.detectChanges();
    expect(el.querySelector('#form-error')?.textContent).toContain('do not match');
  });

  it('explains the rate limit', () => {
    health(false);
    type('input[type="email"]', 'submitter@demo.test');
    type('input[type="password"]', 'wrong');
    submit();
    http.expectOne('/api/auth/login').flush({ error: { status: 429, code: 'rate-limited', message: 'x' } }, { status: 429, statusText: 'Too Many Requests' });
    fixture.detectChanges();
    expect(el.querySelector('#form-error')?.textContent).toContain('Too many sign-in attempts');
  });

  it('signs in and goes to the start page of the roles', () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    health(false);
    type('input[type="email"]', ' head@demo.test ');
    type('input[type="password"]', 'assayer-demo');
    submit();
    const req = http.expectOne({ method: 'POST', url: '/api/auth/login' });
    expect(req.request.body).toEqual({ email: 'head@demo.test', password: 'assayer-demo' });
    req.flush({ id: 'u4', email: 'head@demo.test', name: 'Dana', roles: ['head'] });
    expect(navigate).toHaveBeenCalledWith('/requests/intake');
  });

  it('offers single sign-on as a full-page link to the SAML endpoint', () => {
    health(false);
    const link = Array.from(el.querySelectorAll('a')).find((a) => a.textContent?.includes('Sign in with your institution'))!;
    expect(link.getAttribute('href')).toBe('/api/auth/saml/login');
  });

  it('lists demo accounts only in demo mode', () => {
    health(false);
    expect(el.textContent).not.toContain('reviewer2@demo.test');
    fixture.destroy();
  });

  it('fills the form from a demo account', () => {
    health(true);
    expect(el.textContent).toContain('reviewer2@demo.test');
    Array.from(el.querySelectorAll('button')).find((b) => b.textContent?.includes('admin@demo.test'))!.click();
    fixture.detectChanges();
    expect(el.querySelector<HTMLInputElement>('input[type="email"]')!.value).toBe('admin@demo.test');
  });
});
