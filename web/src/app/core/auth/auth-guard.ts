import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { map } from 'rxjs';
import { AuthStore } from './auth-store';

/** Lets a signed-in user through; everyone else goes to the sign-in page and comes back after. */
export const authGuard: CanActivateFn = (_route, state) => {
  const auth = inject(AuthStore);
  const router = inject(Router);
  return auth.restore().pipe(map((user) => (user ? true : router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } }))));
};

/** Administrators only (after `authGuard`); anyone else lands on the projects. The service checks again. */
export const adminGuard: CanActivateFn = () => {
  const auth = inject(AuthStore);
  const router = inject(Router);
  return auth.restore().pipe(map((user) => (user?.isAdmin ? true : router.createUrlTree(['/']))));
};
