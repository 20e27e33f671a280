import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { AuthSession } from './auth-session';

/**
 * Lets signed-in people through (an expired access token is fine while the refresh token can
 * renew it); sends everyone else to sign in and back here afterwards.
 */
export const signedInGuard: CanActivateFn = (_route, state) => {
  const session = inject(AuthSession);
  if (session.accessToken || session.canRefresh) return true;
  session.signOut();
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};
