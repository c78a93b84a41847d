import { Injectable, signal } from '@angular/core';

/** Holds the session's CSRF token apart from the auth state, so the interceptor does not depend on HttpClient users. */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  readonly value = signal<string | null>(null);
}
