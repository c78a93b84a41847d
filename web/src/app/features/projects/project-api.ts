import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { EvaluationResult, ProjectDetail, ProjectSummary } from '../../core/api/api-types';

/** The projects list's calls: the user's projects (current or archived), one project's results for its verdict column, copying and archiving. */
@Injectable({ providedIn: 'root' })
export class ProjectApi {
  private readonly http = inject(HttpClient);

  list(archived = false): Observable<ProjectSummary[]> {
    return this.http.get<ProjectSummary[]>('/api/projects', archived ? { params: { archived: 'true' } } : {});
  }

  results(id: string): Observable<EvaluationResult> {
    return this.http.get<EvaluationResult>(`/api/projects/${encodeURIComponent(id)}/results`);
  }

  /** Keeps everything and makes the project read-only; it leaves the list of current projects. */
  archive(id: string): Observable<ProjectDetail> {
    return this.http.post<ProjectDetail>(`/api/projects/${encodeURIComponent(id)}/archive`, {});
  }

  /** A new draft with the same set-up and design; the person copying becomes its engineer. */
  copy(id: string, name: string): Observable<ProjectDetail> {
    return this.http.post<ProjectDetail>(`/api/projects/${encodeURIComponent(id)}/copy`, { name });
  }

  unarchive(id: string): Observable<ProjectDetail> {
    return this.http.post<ProjectDetail>(`/api/projects/${encodeURIComponent(id)}/unarchive`, {});
  }
}
