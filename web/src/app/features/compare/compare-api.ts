import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ProjectComparison } from '../../core/api/api-types';

/** The project's design under its own edition and every other one the service holds; every member reads it. */
@Injectable({ providedIn: 'root' })
export class CompareApi {
  private readonly http = inject(HttpClient);

  comparison(projectId: string): Observable<ProjectComparison> {
    return this.http.get<ProjectComparison>(`/api/projects/${projectId}/comparison`);
  }
}
