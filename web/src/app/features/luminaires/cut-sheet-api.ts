import { HttpClient, type HttpEvent } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CutSheet } from '../../../../../contract/cut-sheets';

/** The cut sheets of a project's luminaire types. */
@Injectable({ providedIn: 'root' })
export class CutSheetApi {
  private readonly http = inject(HttpClient);

  list(projectId: string): Observable<CutSheet[]> {
    return this.http.get<CutSheet[]>(`/api/projects/${projectId}/cut-sheets`);
  }

  /** The upload as events, so the page can show its progress; the last one carries the cut sheet on file. */
  attach(projectId: string, typeId: string, file: File): Observable<HttpEvent<CutSheet>> {
    return this.http.put<CutSheet>(`/api/projects/${projectId}/luminaire-types/${typeId}/cut-sheet`, file, {
      params: { name: file.name },
      headers: { 'Content-Type': 'application/pdf' },
      reportProgress: true,
      observe: 'events',
    });
  }

  remove(projectId: string, typeId: string): Observable<void> {
    return this.http.delete<void>(`/api/projects/${projectId}/luminaire-types/${typeId}/cut-sheet`);
  }
}
