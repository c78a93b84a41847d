import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { AccountChange, AccountView } from '../../../../../contract/accounts';

export type { AccountChange, AccountView };

/** The administrator's calls on accounts. */
@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  list(): Observable<AccountView[]> {
    return this.http.get<AccountView[]>('/api/admin/users');
  }

  create(account: { email: string; name: string; isAdmin: boolean }): Observable<AccountView> {
    return this.http.post<AccountView>('/api/admin/users', account);
  }

  /** The changes to accounts, newest first. */
  changes(): Observable<AccountChange[]> {
    return this.http.get<AccountChange[]>('/api/admin/audit', { params: { limit: 100 } });
  }

  change(id: string, change: { isAdmin?: boolean; disabled?: boolean }): Observable<AccountView> {
    return this.http.patch<AccountView>(`/api/admin/users/${encodeURIComponent(id)}`, change);
  }
}
