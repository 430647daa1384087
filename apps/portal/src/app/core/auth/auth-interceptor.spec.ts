import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { Auth } from './auth';
import { authInterceptor } from './auth-interceptor';

describe('authInterceptor', () => {
  let http: HttpClient;
  let httpTesting: HttpTestingController;
  let auth: Auth;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    httpTesting = TestBed.inject(HttpTestingController);
    auth = TestBed.inject(Auth);
    auth.useSession({
      user: { id: 1, email: 'agent@example.test', name: 'Ada Agent', role: 'agent', organisationId: null, organisationName: null },
      csrfToken: 'token-1',
    });
  });

  afterEach(() => httpTesting.verify());

  it('adds the session token to a POST', () => {
    http.post('/api/requests', {}).subscribe();
    const req = httpTesting.expectOne('/api/requests');
    expect(req.request.headers.get('x-csrf-token')).toBe('token-1');
    req.flush({});
  });

  it('sends a GET without the token', () => {
    http.get('/api/requests').subscribe();
    const req = httpTesting.expectOne('/api/requests');
    expect(req.request.headers.has('x-csrf-token')).toBe(false);
    req.flush({ items: [], total: 0, page: 0, pageSize: 20 });
  });

  it('fetches a token first when the visitor has none yet', () => {
    auth.clear();
    http.post('/api/auth/sign-in', { email: 'a@example.test', password: 'x' }).subscribe();
    httpTesting.expectOne('/api/auth/csrf').flush({ csrfToken: 'fresh' });
    const req = httpTesting.expectOne('/api/auth/sign-in');
    expect(req.request.headers.get('x-csrf-token')).toBe('fresh');
    req.flush({});
  });

  it('forgets the session and goes to sign in when the server answers 401', () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    http.get('/api/requests').subscribe({ error: () => undefined });
    httpTesting.expectOne('/api/requests').flush({ error: 'Sign in first', details: [] }, { status: 401, statusText: 'Unauthorized' });
    expect(auth.isSignedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], expect.objectContaining({ queryParams: expect.any(Object) }));
  });
});
