import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  ExteriorScheduleDay,
  ExteriorScheduleSettings,
  ExteriorScheduleSummary,
  StoredExteriorSchedule,
} from '../../core/api/api-types';

/** The schedule's settings as the service's query parameters. */
export function settingsParams(settings: ExteriorScheduleSettings): Record<string, string> {
  return {
    onBefore: String(settings.onMinutesBeforeSunset),
    offAfter: String(settings.offMinutesAfterSunrise),
    ...(settings.setback === null
      ? { setback: 'none' }
      : {
          setbackFrom: settings.setback.start,
          setbackTo: settings.setback.end,
          ...(settings.setback.reductionPercent !== undefined ? { reduction: String(settings.setback.reductionPercent) } : {}),
        }),
  };
}

export function daysInYear(year: number): number {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 366 : 365;
}

/** The astronomical schedule of the site's exterior lighting; every member reads it. */
@Injectable({ providedIn: 'root' })
export class ExteriorScheduleApi {
  private readonly http = inject(HttpClient);

  year(projectId: string, year: number, settings: ExteriorScheduleSettings): Observable<ExteriorScheduleDay[]> {
    const params = new HttpParams({
      fromObject: { from: `${year}-01-01`, days: String(daysInYear(year)), ...settingsParams(settings) },
    });
    return this.http.get<ExteriorScheduleDay[]>(`/api/projects/${projectId}/exterior-schedule`, { params });
  }

  /** The project's saved schedule, or the defaults (version 0) until one is saved. */
  stored(projectId: string): Observable<StoredExteriorSchedule> {
    return this.http.get<StoredExteriorSchedule>(`/api/projects/${projectId}/exterior-schedule/settings`);
  }

  /** Saves the schedule with the version read; a stale version is refused (409). */
  save(projectId: string, settings: ExteriorScheduleSettings, version: number): Observable<StoredExteriorSchedule> {
    return this.http.put<StoredExteriorSchedule>(`/api/projects/${projectId}/exterior-schedule/settings`, { settings, version });
  }

  summary(projectId: string, year: number, settings: ExteriorScheduleSettings): Observable<ExteriorScheduleSummary> {
    const params = new HttpParams({ fromObject: { year: String(year), ...settingsParams(settings) } });
    return this.http.get<ExteriorScheduleSummary>(`/api/projects/${projectId}/exterior-schedule/summary`, { params });
  }
}
