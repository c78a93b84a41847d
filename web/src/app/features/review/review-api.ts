import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  ReviewBulkRequest,
  ReviewDeskEntry,
  ReviewItem,
  ReviewVerdictRequest,
  TransitionRequest,
} from '../../../../../contract/review';
import type { ProjectDetail } from '../../core/api/api-types';

/** The review loop's calls: moving the project's state, the check items with their verdicts and threads, and the desk. */
@Injectable({ providedIn: 'root' })
export class ReviewApi {
  private readonly http = inject(HttpClient);

  private base(projectId: string): string {
    return `/api/projects/${encodeURIComponent(projectId)}`;
  }

  /** Answers the project with its new state and revision; 409 when stale or not allowed from here, 403 for a role that may not. */
  transition(projectId: string, request: TransitionRequest): Observable<ProjectDetail> {
    return this.http.post<ProjectDetail>(`${this.base(projectId)}/transitions`, request);
  }

  items(projectId: string): Observable<ReviewItem[]> {
    return this.http.get<ReviewItem[]>(`${this.base(projectId)}/review-items`);
  }

  verdict(projectId: string, itemId: string, request: ReviewVerdictRequest): Observable<unknown> {
    return this.http.patch(`${this.base(projectId)}/review-items/${encodeURIComponent(itemId)}`, request);
  }

  reply(projectId: string, itemId: string, text: string): Observable<unknown> {
    return this.http.post(`${this.base(projectId)}/review-items/${encodeURIComponent(itemId)}/replies`, { text });
  }

  bulk(projectId: string, request: ReviewBulkRequest): Observable<unknown> {
    return this.http.post(`${this.base(projectId)}/review-items/bulk`, request);
  }

  desk(): Observable<ReviewDeskEntry[]> {
    return this.http.get<ReviewDeskEntry[]>('/api/review-desk');
  }
}
