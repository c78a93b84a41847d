import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MadePackage, PackageComparison, PackageRevisionList } from '../../../../../contract/package';

/** A project's submittal packages: engineers make them; members list, download and compare them. */
@Injectable({ providedIn: 'root' })
export class PackageApi {
  private readonly http = inject(HttpClient);

  revisions(projectId: string): Observable<PackageRevisionList> {
    return this.http.get<PackageRevisionList>(`/api/projects/${projectId}/packages`);
  }

  make(projectId: string): Observable<MadePackage> {
    return this.http.post<MadePackage>(`/api/projects/${projectId}/packages`, {});
  }

  compare(projectId: string, from: string, to: string): Observable<PackageComparison> {
    return this.http.get<PackageComparison>(`/api/projects/${projectId}/packages/compare`, { params: { from, to } });
  }
}
