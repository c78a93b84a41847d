import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ProjectRole } from '../../core/auth/auth-store';

export type ProjectState = 'draft' | 'in-review' | 'returned' | 'accepted' | 'issued';

export interface ProjectSummary {
  id: string;
  name: string;
  state: ProjectState;
  role: ProjectRole | null;
  version: number;
  updatedAt: string;
}

@Injectable({ providedIn: 'root' })
export class ProjectApi {
  private readonly http = inject(HttpClient);

  list(): Observable<ProjectSummary[]> {
    return this.http.get<ProjectSummary[]>('/api/projects');
  }

  get(id: string): Observable<ProjectSummary> {
    return this.http.get<ProjectSummary>(`/api/projects/${encodeURIComponent(id)}`);
  }
}
