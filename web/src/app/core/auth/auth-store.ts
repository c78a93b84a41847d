import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { catchError, map, of, tap, type Observable } from 'rxjs';
import { CsrfToken } from './csrf-token';

export type ProjectRole = 'engineer' | 'reviewer' | 'contractor';

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  roles: ProjectRole[];
}

interface SessionResponse {
  user: SignedInUser;
  csrfToken: string;
}

const roleNames: Record<ProjectRole, string> = { engineer: 'Engineer', reviewer: 'Reviewer', contractor: 'Contractor' };

/** The signed-in user, restored from the session cookie after a reload. */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly http = inject(HttpClient);
  private readonly csrf = inject(CsrfToken);
  private readonly current = signal<SignedInUser | null>(null);
  private restored = false;

  readonly user = this.current.asReadonly();
  readonly roleLabel = computed(() => {
    const user = this.current();
    if (!user) return '';
    if (user.isAdmin) return 'Administrator';
    return user.roles.length ? user.roles.map((role) => roleNames[role]).join(' · ') : 'No project role yet';
  });

  signIn(email: string, password: string): Observable<SignedInUser> {
    return this.http.post<SessionResponse>('/api/auth/login', { email, password }).pipe(
      tap((session) => this.accept(session)),
      map((session) => session.user),
    );
  }

  /** Accepts an invitation: the service makes the account and signs it in; answers the project to open. */
  acceptInvitation(token: string, name: string, password: string): Observable<string> {
    return this.http
      .post<SessionResponse & { projectId: string }>(`/api/invitations/${encodeURIComponent(token)}/accept`, { name, password })
      .pipe(
        tap((session) => this.accept(session)),
        map((session) => session.projectId),
      );
  }

  /** Asks the service once per page load whether the cookie still carries a session. */
  restore(): Observable<SignedInUser | null> {
    if (this.restored || this.current()) {
      return of(this.current());
    }
    return this.http.get<SessionResponse>('/api/auth/me').pipe(
      tap((session) => this.accept(session)),
      map((session) => session.user),
      catchError(() => of(null)),
      tap(() => (this.restored = true)),
    );
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/logout', {}).pipe(
      catchError(() => of(undefined)),
      tap(() => {
        this.current.set(null);
        this.csrf.value.set(null);
      }),
      map(() => undefined),
    );
  }

  private accept(session: SessionResponse): void {
    this.current.set(session.user);
    this.csrf.value.set(session.csrfToken);
    this.restored = true;
  }
}
