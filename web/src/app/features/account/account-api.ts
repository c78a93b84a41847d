import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MailSettingsView } from '../../../../../contract/accounts';

export type { MailSettingsView };

/** A live session of the signed-in person, as `/api/auth/sessions` lists it. */
export interface ActiveSession {
  id: string;
  createdAt: string;
  lastSeenAt: string;
  expiresAt: string;
  userAgent: string | null;
  address: string | null;
  /** The session this browser is using. */
  current: boolean;
}

/** The Account page's calls: the person's sessions and ending them, and the optional mail they chose. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  sessions(): Observable<ActiveSession[]> {
    return this.http.get<ActiveSession[]>('/api/auth/sessions');
  }

  endSession(id: string): Observable<void> {
    return this.http.delete<void>(`/api/auth/sessions/${encodeURIComponent(id)}`);
  }

  endOtherSessions(): Observable<{ ended: number }> {
    return this.http.post<{ ended: number }>('/api/auth/sessions/end-others', {});
  }

  mailSettings(): Observable<MailSettingsView> {
    return this.http.get<MailSettingsView>('/api/auth/mail-settings');
  }

  saveMailSettings(settings: MailSettingsView): Observable<MailSettingsView> {
    return this.http.patch<MailSettingsView>('/api/auth/mail-settings', settings);
  }
}
