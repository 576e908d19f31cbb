import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { AuthService } from './auth-service';

// These calls answer 401 as part of their normal job; the page handling them decides what to show.
const QUIET_401 = ['/api/auth/me', '/api/auth/login'];

/** On a 401 from any other API call the session has ended: forget it and go to sign-in. */
export const authInterceptor: HttpInterceptorFn = (req, next) => {
  const auth = inject(AuthService);
  const router = inject(Router);
  return next(req).pipe(
    catchError((err: unknown) => {
      if (err instanceof HttpErrorResponse && err.status === 401 && !QUIET_401.some((u) => req.url.startsWith(u))) {
        auth.forget();
        const returnUrl = router.url && !router.url.startsWith('/sign-in') ? router.url : undefined;
        void router.navigate(['/sign-in'], { queryParams: { returnUrl, expired: 1 } });
      }
      return throwError(() => err);
    }),
  );
};
