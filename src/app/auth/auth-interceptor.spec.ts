import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { authInterceptor } from './auth-interceptor';
import { AuthService } from './auth-service';

describe('authInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;
  let navigate: ReturnType<typeof vi.spyOn>;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
    navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });
  afterEach(() => http.verify());

  it('on a 401 from an API call, forgets the session and goes to sign-in', () => {
    const auth = TestBed.inject(AuthService);
    auth.me.set({ id: 'u1', email: 'a@demo.test', name: 'A', roles: ['submitter'] });
    let failed = false;
    client.get('/api/requests').subscribe({ error: () => (failed = true) });
    http.expectOne('/api/requests').flush({}, { status: 401, statusText: 'Unauthorized' });
    expect(failed).toBe(true);
    expect(auth.me()).toBeNull();
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], expect.objectContaining({ queryParams: expect.objectContaining({ expired: 1 }) }));
  });

  it('leaves a 401 from the login call to the sign-in form', () => {
    client.post('/api/auth/login', {}).subscribe({ error: () => undefined });
    http.expectOne('/api/auth/login').flush({}, { status: 401, statusText: 'Unauthorized' });
    expect(navigate).not.toHaveBeenCalled();
  });

  it('does not redirect on other errors', () => {
    client.get('/api/requests').subscribe({ error: () => undefined });
    http.expectOne('/api/requests').flush({}, { status: 500, statusText: 'Server Error' });
    expect(navigate).not.toHaveBeenCalled();
  });
});
