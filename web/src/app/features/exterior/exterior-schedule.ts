import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import type { ExteriorScheduleDay, ExteriorScheduleSettings, ExteriorScheduleSummary, SetbackRule } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { CardRows } from '../../shared/card-rows';
import { wattsFigure } from '../../shared/format';
import { inProjectUnits } from '../../shared/unit-words';
import { ProjectStore } from '../workspace/project-store';
import { ExteriorScheduleApi } from './exterior-schedule-api';
import { ScheduleChart, shortDate } from './schedule-chart';

type Loaded<T> = { status: 'loading' } | { status: 'ready'; value: T } | { status: 'failed'; message: string };

/** On 10 minutes before sunset, off 10 minutes after sunrise, set back from midnight to 6 a.m. (common practice; the service's defaults). */
export const defaultSettings: ExteriorScheduleSettings = {
  onMinutesBeforeSunset: 10,
  offMinutesAfterSunrise: 10,
  setback: { start: '00:00', end: '06:00' },
};

export const monthNames = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/** A local ISO time as the clock on the site shows it, HH:MM, with "next day" when it falls after the row's date. */
export function clockText(iso: string | null | undefined, date: string): string {
  if (!iso) return '—';
  const clock = iso.slice(11, 16);
  const onDate = iso.slice(0, 10);
  if (onDate === date) return clock;
  return onDate > date ? `${clock} next day` : `${clock} day before`;
}

export const setbackWords: Record<SetbackRule, string> = {
  off: 'Off',
  reduced: 'Reduced',
  none: 'None required',
  'to-verify': 'To verify',
};

function hoursText(value: string): string {
  return new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(Number(value));
}

function kWhText(value: string): string {
  return new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 }).format(Number(value));
}

function failure(error: unknown, fallback: string): string {
  return error instanceof ApiError ? error.message : fallback;
}

/**
 * The astronomical schedule of the site's exterior lighting: the year as a picture, a month's
 * schedule as a table, and the year's hours and energy per application with and without the
 * setback. The settings here are tried, not stored: the service computes each answer from them.
 */
@Component({
  selector: 'al-exterior-schedule',
  imports: [
    CardRows,
    FormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    RouterLink,
    ScheduleChart,
  ],
  templateUrl: './exterior-schedule.html',
  styleUrl: './exterior-schedule.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExteriorSchedule {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(ExteriorScheduleApi);

  protected readonly monthNames = monthNames;
  protected readonly setbackWords = setbackWords;
  protected readonly clockText = clockText;
  protected readonly shortDate = shortDate;
  protected readonly watts = wattsFigure;
  protected readonly hoursText = hoursText;
  protected readonly kWhText = kWhText;

  private readonly thisYear = new Date().getFullYear();
  protected readonly years = [this.thisYear - 1, this.thisYear, this.thisYear + 1, this.thisYear + 2];
  protected readonly year = signal(this.thisYear);
  protected readonly month = signal(new Date().getMonth());

  /** What the form holds; applied on its button. */
  protected readonly onBefore = signal(defaultSettings.onMinutesBeforeSunset);
  protected readonly offAfter = signal(defaultSettings.offMinutesAfterSunrise);
  protected readonly withSetback = signal(true);
  protected readonly setbackFrom = signal(defaultSettings.setback!.start);
  protected readonly setbackTo = signal(defaultSettings.setback!.end);
  /** Blank: the edition's reduction. */
  protected readonly reduction = signal<number | null>(null);
  protected readonly settings = signal<ExteriorScheduleSettings>(defaultSettings);

  /** The set-up fields the schedule needs and the project leaves blank, in words. */
  protected readonly missingSite = computed(() => {
    const project = this.store.project();
    if (!project) return [];
    return [
      ...(project.latitude === null ? ['latitude'] : []),
      ...(project.longitude === null ? ['longitude'] : []),
      ...(project.timeZone === null ? ['time zone'] : []),
    ];
  });

  private readonly request = computed(() => {
    const id = this.store.projectId();
    const project = this.store.project();
    if (id === null || !project || this.missingSite().length > 0) return null;
    // Asked again when the site or the design's exterior applications change.
    return {
      id,
      year: this.year(),
      settings: this.settings(),
      site: `${project.latitude} ${project.longitude} ${project.timeZone} ${project.edition}`,
      applications: this.store.exterior().map((application) => `${application.id}@${application.version}`),
    };
  });

  protected readonly days = toSignal(
    toObservable(this.request).pipe(
      switchMap((request) =>
        request === null
          ? of<Loaded<ExteriorScheduleDay[]>>({ status: 'loading' })
          : this.api.year(request.id, request.year, request.settings).pipe(
              map((value): Loaded<ExteriorScheduleDay[]> => ({ status: 'ready', value })),
              catchError((error: unknown) =>
                of<Loaded<ExteriorScheduleDay[]>>({ status: 'failed', message: failure(error, 'The schedule could not be loaded.') }),
              ),
              startWith<Loaded<ExteriorScheduleDay[]>>({ status: 'loading' }),
            ),
      ),
    ),
    { initialValue: { status: 'loading' } as Loaded<ExteriorScheduleDay[]> },
  );

  protected readonly summary = toSignal(
    toObservable(this.request).pipe(
      switchMap((request) =>
        request === null
          ? of<Loaded<ExteriorScheduleSummary>>({ status: 'loading' })
          : this.api.summary(request.id, request.year, request.settings).pipe(
              map((value): Loaded<ExteriorScheduleSummary> => ({ status: 'ready', value })),
              catchError((error: unknown) =>
                of<Loaded<ExteriorScheduleSummary>>({
                  status: 'failed',
                  message: failure(error, 'The year’s figures could not be loaded.'),
                }),
              ),
              startWith<Loaded<ExteriorScheduleSummary>>({ status: 'loading' }),
            ),
      ),
    ),
    { initialValue: { status: 'loading' } as Loaded<ExteriorScheduleSummary> },
  );

  protected readonly yearDays = computed(() => {
    const state = this.days();
    return state.status === 'ready' ? state.value : null;
  });

  protected readonly daysError = computed(() => {
    const state = this.days();
    return state.status === 'failed' ? state.message : null;
  });
  protected readonly summaryValue = computed(() => {
    const state = this.summary();
    return state.status === 'ready' ? state.value : null;
  });
  protected readonly summaryError = computed(() => {
    const state = this.summary();
    return state.status === 'failed' ? state.message : null;
  });

  protected readonly monthDays = computed(() => {
    const days = this.yearDays();
    if (!days) return [];
    const prefix = `${this.year()}-${String(this.month() + 1).padStart(2, '0')}-`;
    return days.filter((day) => day.date.startsWith(prefix));
  });

  /** The form differs from the settings the figures below were computed with. */
  protected readonly settingsChanged = computed(() => JSON.stringify(this.settings()) !== JSON.stringify(this.formSettings()));

  protected label(text: string): string {
    return inProjectUnits(text, this.store.units());
  }

  private formSettings(): ExteriorScheduleSettings {
    const reduction = this.reduction();
    return {
      onMinutesBeforeSunset: this.onBefore(),
      offMinutesAfterSunrise: this.offAfter(),
      setback: this.withSetback()
        ? { start: this.setbackFrom(), end: this.setbackTo(), ...(reduction !== null ? { reductionPercent: reduction } : {}) }
        : null,
    };
  }

  protected apply(): void {
    this.settings.set(this.formSettings());
  }

  protected reset(): void {
    this.onBefore.set(defaultSettings.onMinutesBeforeSunset);
    this.offAfter.set(defaultSettings.offMinutesAfterSunrise);
    this.withSetback.set(true);
    this.setbackFrom.set(defaultSettings.setback!.start);
    this.setbackTo.set(defaultSettings.setback!.end);
    this.reduction.set(null);
    this.settings.set(defaultSettings);
  }

  protected setbackText(day: ExteriorScheduleDay): string {
    return day.setbackStart ? `${clockText(day.setbackStart, day.date)}–${clockText(day.setbackEnd, day.date)}` : '—';
  }
}
