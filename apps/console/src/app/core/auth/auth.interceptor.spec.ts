import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { ErrorNotifier } from '../notify/error-notifier';
import { errorNotifierInterceptor } from '../notify/error-notifier.interceptor';
import { authInterceptor } from './auth.interceptor';
import { AuthSession } from './auth-session';

const user = { id: 3, email: 'lee@example.org', name: 'Lee', role: 'lead' as const };

describe('authInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;
  let notices: string[];

  beforeEach(() => {
    sessionStorage.clear();
    notices = [];
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorNotifierInterceptor, authInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
        { provide: ErrorNotifier, useValue: { show: (m: string) => notices.push(m), notify: () => notices.push('notified') } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  });

  afterEach(() => http.verify());

  function signIn(expiresIn = 900, refreshToken: string | null = 'r1') {
    TestBed.inject(AuthSession).signIn({ email: user.email, password: 'x' }).subscribe();
    http.expectOne('/api/v1/auth/login').flush({ accessToken: 'a1', expiresIn, refreshToken: refreshToken ?? undefined, user });
  }

  it('adds the bearer token to API calls and nothing to other addresses', () => {
    signIn();
    client.get('/api/v1/studies').subscribe();
    client.get('/fonts/fonts.css').subscribe();
    expect(http.expectOne('/api/v1/studies').request.headers.get('Authorization')).toBe('Bearer a1');
    expect(http.expectOne('/fonts/fonts.css').request.headers.has('Authorization')).toBe(false);
  });

  it('answers a 401 with one refresh and retries the call with the new token', () => {
    signIn();
    let body: unknown;
    client.get('/api/v1/studies').subscribe((response) => (body = response));
    http.expectOne('/api/v1/studies').flush({ error: { code: 'unauthorized', message: 'expired' } }, { status: 401, statusText: 'Unauthorized' });
    const refresh = http.expectOne('/api/v1/auth/refresh');
    expect(refresh.request.body).toEqual({ refreshToken: 'r1' });
    refresh.flush({ accessToken: 'a2', expiresIn: 900, refreshToken: 'r2', user });
    const retry = http.expectOne('/api/v1/studies');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer a2');
    retry.flush([]);
    expect(body).toEqual([]);
    expect(notices).toEqual([]);
  });

  it('shares one refresh between calls that fail together', () => {
    signIn();
    client.get('/api/v1/studies').subscribe();
    client.get('/api/v1/analyses').subscribe();
    for (const url of ['/api/v1/studies', '/api/v1/analyses']) {
      http.expectOne(url).flush(null, { status: 401, statusText: 'Unauthorized' });
    }
    http.expectOne('/api/v1/auth/refresh').flush({ accessToken: 'a2', expiresIn: 900, refreshToken: 'r2', user });
    http.expectOne('/api/v1/studies').flush([]);
    http.expectOne('/api/v1/analyses').flush([]);
  });

  it('renews an access token that has already run out before sending the call', () => {
    signIn(1);
    client.get('/api/v1/studies').subscribe();
    http.expectOne('/api/v1/auth/refresh').flush({ accessToken: 'a2', expiresIn: 900, user });
    expect(http.expectOne('/api/v1/studies').request.headers.get('Authorization')).toBe('Bearer a2');
  });

  it('signs out and sends the person to sign in when the refresh is refused', async () => {
    signIn();
    const router = TestBed.inject(Router);
    const navigate = jest.spyOn(router, 'navigate').mockResolvedValue(true);
    let failed = false;
    client.get('/api/v1/studies').subscribe({ error: () => (failed = true) });
    http.expectOne('/api/v1/studies').flush(null, { status: 401, statusText: 'Unauthorized' });
    http.expectOne('/api/v1/auth/refresh').flush({ error: { code: 'unauthorized', message: 'gone' } }, { status: 401, statusText: 'Unauthorized' });
    expect(failed).toBe(true);
    expect(TestBed.inject(AuthSession).signedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: router.url } });
    expect(notices).toEqual(['Your session has ended. Sign in again to continue.']);
  });

  it('signs out at once on a 401 when there is no refresh token', () => {
    signIn(900, null);
    jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    client.get('/api/v1/studies').subscribe({ error: () => undefined });
    http.expectOne('/api/v1/studies').flush(null, { status: 401, statusText: 'Unauthorized' });
    http.expectNone('/api/v1/auth/refresh');
    expect(TestBed.inject(AuthSession).signedIn()).toBe(false);
  });

  it('revokes the refresh token when the person signs out', () => {
    signIn();
    TestBed.inject(AuthSession).signOut({ revoke: true });
    const logout = http.expectOne('/api/v1/auth/logout');
    expect(logout.request.body).toEqual({ refreshToken: 'r1' });
    expect(logout.request.headers.get('Authorization')).toBe('Bearer a1');
    logout.flush(null, { status: 204, statusText: 'No Content' });
  });
});
