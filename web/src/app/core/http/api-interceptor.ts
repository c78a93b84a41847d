import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { CsrfToken } from '../auth/csrf-token';
import { ApiError } from './api-error';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);
const quietUnauthorized = ['/api/auth/me', '/api/auth/login'];

/** Sends the session cookie and CSRF header with API calls, and turns failures into ApiError. */
export const apiInterceptor: HttpInterceptorFn = (request, next) => {
  if (!request.url.startsWith('/api/')) {
    return next(request);
  }
  const csrf = inject(CsrfToken).value();
  const router = inject(Router);
  const withSession = request.clone({
    withCredentials: true,
    setHeaders: csrf && !safeMethods.has(request.method) ? { 'X-CSRF-Token': csrf } : {},
  });
  return next(withSession).pipe(
    catchError((failure: unknown) => {
      if (!(failure instanceof HttpErrorResponse)) {
        return throwError(() => failure);
      }
      const error = ApiError.from(failure);
      if (error.status === 401 && !quietUnauthorized.some((url) => request.url.startsWith(url))) {
        void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
      }
      return throwError(() => error);
    }),
  );
};
