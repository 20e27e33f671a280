import { HttpErrorResponse, type HttpHandlerFn, type HttpInterceptorFn, type HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, switchMap, throwError } from 'rxjs';
import { ErrorNotifier } from '../notify/error-notifier';
import { AuthSession } from './auth-session';

/** Calls that make or renew a session; a 401 from these is an answer, not an expired session. */
const SESSION_CALLS = ['/api/v1/auth/login', '/api/v1/auth/refresh'];
const SIGN_OUT_CALL = '/api/v1/auth/logout';

/**
 * Adds the bearer token to API calls. An expired access token is renewed with the refresh token
 * before the call leaves; a 401 is answered by one refresh and one retry. When the session cannot
 * be renewed the person is signed out and sent to sign in, with the way back remembered.
 */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  if (!request.url.startsWith('/api/') || SESSION_CALLS.includes(request.url)) return next(request);
  const session = inject(AuthSession);
  // Signing out is never renewed or retried: it carries the token it has, if any.
  if (request.url === SIGN_OUT_CALL) return sendWith(request, next, session.accessToken);
  const router = inject(Router);
  const notifier = inject(ErrorNotifier);

  const endSession = (error: unknown) => {
    if (session.signedIn()) {
      session.signOut();
      notifier.show('Your session has ended. Sign in again to continue.');
      void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
    }
    return throwError(() => error);
  };
  const retryAfterRefresh = (error: unknown) =>
    session.refresh().pipe(
      catchError(() => endSession(error)),
      switchMap((token) => sendWith(request, next, token)),
    );

  const token = session.accessToken;
  if (!token && session.canRefresh) return retryAfterRefresh(new HttpErrorResponse({ status: 401, url: request.url }));
  return sendWith(request, next, token).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse) || error.status !== 401 || !session.signedIn()) return throwError(() => error);
      return session.canRefresh ? retryAfterRefresh(error) : endSession(error);
    }),
  );
};

function sendWith(request: HttpRequest<unknown>, next: HttpHandlerFn, token: string | null) {
  return next(token ? request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }) : request);
}
