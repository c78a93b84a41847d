import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ExteriorScheduleDay, ExteriorScheduleSettings, ExteriorScheduleSummary } from '../../core/api/api-types';

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

  summary(projectId: string, year: number, settings: ExteriorScheduleSettings): Observable<ExteriorScheduleSummary> {
    const params = new HttpParams({ fromObject: { year: String(year), ...settingsParams(settings) } });
    return this.http.get<ExteriorScheduleSummary>(`/api/projects/${projectId}/exterior-schedule/summary`, { params });
  }
}
