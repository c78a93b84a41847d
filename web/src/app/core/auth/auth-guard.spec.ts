import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, UrlTree, type ActivatedRouteSnapshot, type RouterStateSnapshot } from '@angular/router';
import { firstValueFrom, isObservable, of, type Observable } from 'rxjs';
import { apiInterceptor } from '../http/api-interceptor';
import { authGuard } from './auth-guard';
import { CsrfToken } from './csrf-token';

describe('authGuard', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function runGuard(url: string): Promise<boolean | UrlTree> {
    const result = TestBed.runInInjectionContext(() => authGuard({} as ActivatedRouteSnapshot, { url } as RouterStateSnapshot));
    const observable = (isObservable(result) ? result : of(result)) as Observable<boolean | UrlTree>;
    return firstValueFrom(observable);
  }

  it('sends a visitor without a session to the sign-in page with the return URL', async () => {
    const decision = runGuard('/projects/42');
    http
      .expectOne('/api/auth/me')
      .flush({ error: { code: 'unauthorized', message: 'Sign in to continue.' } }, { status: 401, statusText: 'Unauthorized' });
    const tree = await decision;
    expect(tree).toBeInstanceOf(UrlTree);
    expect(TestBed.inject(Router).serializeUrl(tree as UrlTree)).toBe('/sign-in?returnUrl=%2Fprojects%2F42');
  });

  it('lets a restored session through and keeps its CSRF token for later writes', async () => {
    const decision = runGuard('/');
    http.expectOne('/api/auth/me').flush({
      user: { id: 'u1', email: 'reviewer@alderbay.example', name: 'Dario Quint', isAdmin: false, roles: ['reviewer'] },
      csrfToken: 'abc',
    });
    expect(await decision).toBe(true);
    expect(TestBed.inject(CsrfToken).value()).toBe('abc');
  });

  it('asks the service only once per page load', async () => {
    const first = runGuard('/');
    http
      .expectOne('/api/auth/me')
      .flush({ user: { id: 'u1', email: 'a@b.example', name: 'A', isAdmin: true, roles: [] }, csrfToken: 'abc' });
    await first;
    expect(await runGuard('/')).toBe(true);
    http.expectNone('/api/auth/me');
  });
});
