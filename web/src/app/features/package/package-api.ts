import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MadePackage, PackageComparison, PackageJobAnswer, PackageRevisionList } from '../../../../../contract/package';

/** A project's submittal packages: engineers make them; members list, download and compare them. */
@Injectable({ providedIn: 'root' })
export class PackageApi {
  private readonly http = inject(HttpClient);

  revisions(projectId: string): Observable<PackageRevisionList> {
    return this.http.get<PackageRevisionList>(`/api/projects/${projectId}/packages`);
  }

  /** The package at once for a small project; for a large one, the background job making it. */
  make(projectId: string): Observable<MadePackage | PackageJobAnswer> {
    return this.http.post<MadePackage | PackageJobAnswer>(`/api/projects/${projectId}/packages`, {});
  }

  job(projectId: string, jobId: string): Observable<PackageJobAnswer> {
    return this.http.get<PackageJobAnswer>(`/api/projects/${projectId}/packages/jobs/${jobId}`);
  }

  compare(projectId: string, from: string, to: string): Observable<PackageComparison> {
    return this.http.get<PackageComparison>(`/api/projects/${projectId}/packages/compare`, { params: { from, to } });
  }
}
