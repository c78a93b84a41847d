import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { AllowanceClaim } from '../../core/api/api-types';

export interface AllowanceClaimInput {
  spaceId: string;
  allowance: string;
  area: string;
}

/** A project's claims on its edition's additional allowances (the catalogue is a code table: WorkspaceApi). */
@Injectable({ providedIn: 'root' })
export class AllowancesApi {
  private readonly http = inject(HttpClient);

  claims(projectId: string): Observable<AllowanceClaim[]> {
    return this.http.get<AllowanceClaim[]>(`/api/projects/${projectId}/additional-allowances`);
  }

  create(projectId: string, claim: AllowanceClaimInput): Observable<AllowanceClaim> {
    return this.http.post<AllowanceClaim>(`/api/projects/${projectId}/additional-allowances`, claim);
  }

  replace(projectId: string, claimId: string, version: number, claim: AllowanceClaimInput): Observable<AllowanceClaim> {
    return this.http.put<AllowanceClaim>(`/api/projects/${projectId}/additional-allowances/${claimId}`, { ...claim, version });
  }

  remove(projectId: string, claimId: string, version: number): Observable<void> {
    return this.http.delete<void>(`/api/projects/${projectId}/additional-allowances/${claimId}`, { params: { version } });
  }

  /** Brings back a claim deleted in the last 30 days, with its id. */
  restore(projectId: string, claimId: string): Observable<AllowanceClaim> {
    return this.http.post<AllowanceClaim>(`/api/projects/${projectId}/additional-allowances/${claimId}/restore`, {});
  }
}
