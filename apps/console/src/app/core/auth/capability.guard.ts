import { inject } from '@angular/core';
import { Router, type CanMatchFn } from '@angular/router';
import { can, type Capability } from '@tallyfit/contracts';
import { AuthSession } from './auth-session';

/** Matches a route only for people with the capability (the API's own table); anyone else lands on the studies list. */
export function capabilityGuard(capability: Capability): CanMatchFn {
  return () => can(inject(AuthSession).role(), capability) || inject(Router).createUrlTree(['/studies']);
}
