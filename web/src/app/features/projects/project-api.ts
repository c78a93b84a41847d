import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { EvaluationResult, ProjectSummary } from '../../core/api/api-types';

/** The projects list's calls: the user's projects, and one project's results for its verdict column. */
@Injectable({ providedIn: 'root' })
export class ProjectApi {
  private readonly http = inject(HttpClient);

  list(): Observable<ProjectSummary[]> {
    return this.http.get<ProjectSummary[]>('/api/projects');
  }

  results(id: string): Observable<EvaluationResult> {
    return this.http.get<EvaluationResult>(`/api/projects/${encodeURIComponent(id)}/results`);
  }
}
