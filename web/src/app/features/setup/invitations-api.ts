import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ProjectRole } from '../../core/api/api-types';
import type { InvitationOutcome, InvitationView } from '../../../../../contract/accounts';

export type { InvitationOutcome, InvitationView };

/** A project's invitations to its team. */
@Injectable({ providedIn: 'root' })
export class InvitationsApi {
  private readonly http = inject(HttpClient);

  list(projectId: string): Observable<InvitationView[]> {
    return this.http.get<InvitationView[]>(`/api/projects/${encodeURIComponent(projectId)}/invitations`);
  }

  invite(projectId: string, email: string, role: ProjectRole): Observable<InvitationOutcome> {
    return this.http.post<InvitationOutcome>(`/api/projects/${encodeURIComponent(projectId)}/invitations`, { email, role });
  }

  withdraw(projectId: string, invitationId: string): Observable<InvitationView[]> {
    return this.http.delete<InvitationView[]>(
      `/api/projects/${encodeURIComponent(projectId)}/invitations/${encodeURIComponent(invitationId)}`,
    );
  }
}
