import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { InvitationPreview } from '../../../../../contract/accounts';

export type { InvitationPreview };

/** What an invitation's link invites to, read before sign-in (accepting it is the auth store's). */
@Injectable({ providedIn: 'root' })
export class InvitationApi {
  private readonly http = inject(HttpClient);

  preview(token: string): Observable<InvitationPreview> {
    return this.http.get<InvitationPreview>(`/api/invitations/${encodeURIComponent(token)}`);
  }
}
