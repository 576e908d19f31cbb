import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { Me } from '../../../shared/api/types';
import { AuthService } from './auth-service';

const PRIYA: Me = { id: 'u1', email: 'submitter@demo.test', name: 'Priya Okonkwo-Hale', roles: ['submitter'] };

describe('AuthService', () => {
  let auth: AuthService;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    auth = TestBed.inject(AuthService);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('asks GET /api/auth/me once and keeps the answer as signals', async () => {
    const first = auth.ensureLoaded();
    const second = auth.ensureLoaded();
    expect(auth.loading()).toBe(true);
    http.expectOne({ method: 'GET', url: '/api/auth/me' }).flush(PRIYA);
    expect(await first).toEqual(PRIYA);
    expect(await second).toEqual(PRIYA);
    expect(auth.me()?.name).toBe('Priya Okonkwo-Hale');
    expect(auth.loading()).toBe(false);
    expect(auth.roles()).toEqual(['submitter']);
    expect(auth.hasAnyRole(['head', 'submitter'])).toBe(true);
    expect(auth.hasAnyRole(['admin'])).toBe(false);
    await auth.ensureLoaded();
    http.expectNone('/api/auth/me');
  });

  it('treats a 401 from /api/auth/me as signed out', async () => {
    const answer = auth.ensureLoaded();
    http.expectOne('/api/auth/me').flush({ error: { status: 401, code: 'unauthenticated', message: 'Not signed in' } }, { status: 401, statusText: 'Unauthorized' });
    expect(await answer).toBeNull();
    expect(auth.me()).toBeNull();
    expect(auth.checked()).toBe(true);
    expect(auth.roles()).toEqual([]);
  });

  it('signs in with POST /api/auth/login and stores the person', () => {
    let result: Me | undefined;
    auth.signIn('submitter@demo.test', 'assayer-demo').subscribe((me) => (result = me));
    const req = http.expectOne({ method: 'POST', url: '/api/auth/login' });
    expect(req.request.body).toEqual({ email: 'submitter@demo.test', password: 'assayer-demo' });
    req.flush(PRIYA);
    expect(result).toEqual(PRIYA);
    expect(auth.me()).toEqual(PRIYA);
  });

  it('signs out with POST /api/auth/logout, forgets the person and goes to sign-in', async () => {
    const router = TestBed.inject(Router);
    const navigate = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    auth.me.set(PRIYA);
    const done = auth.signOut();
    http.expectOne({ method: 'POST', url: '/api/auth/logout' }).flush(null, { status: 204, statusText: 'No Content' });
    await done;
    expect(auth.me()).toBeNull();
    expect(navigate).toHaveBeenCalledWith('/sign-in');
  });
});
