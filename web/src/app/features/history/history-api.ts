import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { HistoryPage, HistoryQuery } from '../../core/api/api-types';

/** A project's history, newest first, a page at a time; every member reads it. */
@Injectable({ providedIn: 'root' })
export class HistoryApi {
  private readonly http = inject(HttpClient);

  history(projectId: string, query: HistoryQuery): Observable<HistoryPage> {
    const params: Record<string, string> = {};
    for (const [name, value] of Object.entries(query)) if (value !== undefined && value !== '') params[name] = String(value);
    return this.http.get<HistoryPage>(`/api/projects/${projectId}/history`, { params });
  }
}
