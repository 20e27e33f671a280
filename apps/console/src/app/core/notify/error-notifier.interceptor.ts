import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';
import { ErrorNotifier } from './error-notifier';
import { PAGE_HANDLES_ERRORS } from './page-handles-errors';

/**
 * Reports failed API calls that the calling page does not handle itself. 401s are left to the
 * auth interceptor, which refreshes the session or sends the person to sign in.
 */
export const errorNotifierInterceptor: HttpInterceptorFn = (request, next) => {
  const notifier = inject(ErrorNotifier);
  return next(request).pipe(
    catchError((error: unknown) => {
      const unauthorised = error instanceof HttpErrorResponse && error.status === 401;
      if (!unauthorised && !request.context.get(PAGE_HANDLES_ERRORS)) notifier.notify(error);
      return throwError(() => error);
    }),
  );
};
