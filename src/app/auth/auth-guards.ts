import { inject } from '@angular/core';
import { CanActivateFn, Router, UrlTree } from '@angular/router';
import type { Role } from '../../../shared/api/types';
import { firstAllowedPath } from '../shell/nav-items';
import { AuthService } from './auth-service';

/** Lets signed-in people through; sends others to the sign-in page with a return address. */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  const auth = inject(AuthService);
  const router = inject(Router);
  const me = await auth.ensureLoaded();
  return me ? true : router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};

/** Lets through people holding at least one of `roles`; others go to their own start page. */
export function roleGuard(...roles: Role[]): CanActivateFn {
  return async (_route, state) => {
    const auth = inject(AuthService);
    const router = inject(Router);
    const me = await auth.ensureLoaded();
    if (!me) return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
    if (auth.hasAnyRole(roles)) return true;
    return router.createUrlTree(['/not-allowed']);
  };
}

/** Sends a signed-in person from "/" to the first page their roles open. */
export const startPageGuard: CanActivateFn = async (): Promise<UrlTree> => {
  const auth = inject(AuthService);
  const router = inject(Router);
  const me = await auth.ensureLoaded();
  if (!me) return router.createUrlTree(['/sign-in']);
  return router.parseUrl(firstAllowedPath(me.roles) ?? '/not-allowed');
};

/** Keeps signed-in people off the sign-in page. */
export const signedOutGuard: CanActivateFn = async () => {
  const auth = inject(AuthService);
  const router = inject(Router);
  const me = await auth.ensureLoaded();
  return me ? router.parseUrl(firstAllowedPath(me.roles) ?? '/not-allowed') : true;
};
