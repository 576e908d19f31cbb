import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import type { Me } from '../../../shared/api/types';
import { roleGuard, signedInGuard, signedOutGuard, startPageGuard } from './auth-guards';

const state = (url: string) => ({ url }) as RouterStateSnapshot;
const route = {} as ActivatedRouteSnapshot;
const person = (roles: Me['roles']): Me => ({ id: 'u9', email: 'x@demo.test', name: 'X', roles });

describe('auth guards', () => {
  let http: HttpTestingController;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
  });
  afterEach(() => http.verify());

  // Runs a guard while answering the session check it makes.
  async function run(guard: typeof signedInGuard, url: string, me: Me | null) {
    const result = TestBed.runInInjectionContext(() => guard(route, state(url))) as Promise<boolean | UrlTree>;
    const req = http.expectOne('/api/auth/me');
    if (me) req.flush(me);
    else req.flush({ error: { status: 401, code: 'unauthenticated', message: 'no' } }, { status: 401, statusText: 'Unauthorized' });
    return result;
  }

  it('signedInGuard sends a signed-out visitor to sign-in with the return address', async () => {
    const result = await run(signedInGuard, '/requests/r1', null);
    expect(result instanceof UrlTree && router.serializeUrl(result)).toBe('/sign-in?returnUrl=%2Frequests%2Fr1');
  });

  it('signedInGuard lets a signed-in person through', async () => {
    expect(await run(signedInGuard, '/requests/r1', person(['submitter']))).toBe(true);
  });

  it('roleGuard lets through a holder of the role', async () => {
    expect(await run(roleGuard('head'), '/requests/intake', person(['reviewer', 'head']))).toBe(true);
  });

  it('roleGuard sends someone without the role to the not-allowed page', async () => {
    const result = await run(roleGuard('admin'), '/admin/people', person(['submitter']));
    expect(result instanceof UrlTree && router.serializeUrl(result)).toBe('/not-allowed');
  });

  it('roleGuard sends a signed-out visitor to sign-in', async () => {
    const result = await run(roleGuard('admin'), '/admin/audit', null);
    expect(result instanceof UrlTree && router.serializeUrl(result)).toBe('/sign-in?returnUrl=%2Fadmin%2Faudit');
  });

  it('startPageGuard opens the first page the roles allow', async () => {
    const reviewer = await run(startPageGuard, '/', person(['reviewer']));
    expect(reviewer instanceof UrlTree && router.serializeUrl(reviewer)).toBe('/requests/assigned');
  });

  it('startPageGuard starts an office head who also reviews at the intake queue', async () => {
    const head = await run(startPageGuard, '/', person(['reviewer', 'head']));
    expect(head instanceof UrlTree && router.serializeUrl(head)).toBe('/requests/intake');
  });

  it('signedOutGuard keeps a signed-in admin off the sign-in page', async () => {
    const result = await run(signedOutGuard, '/sign-in', person(['admin']));
    expect(result instanceof UrlTree && router.serializeUrl(result)).toBe('/admin/people');
  });

  it('signedOutGuard shows the sign-in page to visitors', async () => {
    expect(await run(signedOutGuard, '/sign-in', null)).toBe(true);
  });
});
