import { inject } from '@angular/core';
import { Router, type CanMatchFn } from '@angular/router';
import type { Role } from '@tallyfit/contracts';
import { AuthSession } from './auth-session';

/** Matches a route only for the given roles; anyone else lands on the studies list. */
export function roleGuard(...roles: Role[]): CanMatchFn {
  return () => {
    const role = inject(AuthSession).role();
    return (role !== null && roles.includes(role)) || inject(Router).createUrlTree(['/studies']);
  };
}
