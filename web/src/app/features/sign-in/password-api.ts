import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';

/** Choosing a new password: asking for the link, using it, and changing it when signed in. */
@Injectable({ providedIn: 'root' })
export class PasswordApi {
  private readonly http = inject(HttpClient);

  requestReset(email: string): Observable<{ message: string }> {
    return this.http.post<{ message: string }>('/api/auth/password-reset', { email });
  }

  completeReset(token: string, password: string): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset/complete', { token, password });
  }

  change(currentPassword: string, newPassword: string): Observable<{ endedSessions: number }> {
    return this.http.post<{ endedSessions: number }>('/api/auth/password', { currentPassword, newPassword });
  }
}

/** The rules the service applies, said before the person types (it also refuses common and guessable ones). */
export const passwordRuleWords =
  'At least 12 characters. Common passwords, keyboard runs and your own name or e-mail are refused; a few unrelated words make a strong one.';
