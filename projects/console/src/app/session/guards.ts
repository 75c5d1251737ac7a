import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';
import type { Permission } from '../api/api-types';
import { Session } from './session';

/** Lets signed-in people through; others go to the sign-in page and come back afterwards. */
export const signedIn: CanActivateFn = (_route, state) => {
  const session = inject(Session);
  return session.isSignedIn() ? true : inject(Router).createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};

/** Keeps signed-in people away from the sign-in page. */
export const signedOut: CanActivateFn = () => (inject(Session).isSignedIn() ? inject(Router).createUrlTree(['/models']) : true);

/** Lets through people whose role carries a permission; others see the "not for your role" page. */
export function withPermission(permission: Permission): CanActivateFn {
  return (_route, state) => {
    const session = inject(Session);
    if (!session.isSignedIn()) return inject(Router).createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
    return session.can(permission) ? true : inject(Router).createUrlTree(['/not-allowed'], { queryParams: { need: permission } });
  };
}
