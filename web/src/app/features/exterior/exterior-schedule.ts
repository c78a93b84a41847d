import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
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
import type {
  ExteriorScheduleDay,
  ExteriorScheduleSettings,
  ExteriorScheduleSummary,
  ScheduleCheckStatus,
  SetbackRule,
  StoredExteriorSchedule,
} from '../../core/api/api-types';
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

export const checkStatusWords: Record<ScheduleCheckStatus, string> = {
  met: 'Met',
  'not-met': 'Not met',
  'to-verify': 'To verify',
  exception: 'Exception claimed',
  'not-required': 'Not required',
};

export const checkWords: Record<'daylight-off' | 'setback', string> = {
  'daylight-off': 'Daylight shutoff',
  setback: 'Night setback',
};

/** When and by whom the schedule was saved, in words. */
export function savedWords(stored: StoredExteriorSchedule): string {
  if (!stored.saved || stored.updatedAt === null) {
    return 'The project runs the common-practice schedule until one is saved.';
  }
  const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' }).format(new Date(stored.updatedAt));
  return `The project’s schedule, saved ${when}${stored.updatedBy ? ` by ${stored.updatedBy}` : ''}.`;
}

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
 * setback, and the exterior control requirements the schedule answers. The form opens on the
 * project's saved schedule; other settings can be tried, and the engineer saves them as the
 * project's (with the version read, so a save made on an older read is refused).
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
  protected readonly checkStatusWords = checkStatusWords;
  protected readonly checkWords = checkWords;
  protected readonly savedWords = savedWords;
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
  /** The project's saved schedule as last read or saved; null until read. */
  protected readonly stored = signal<StoredExteriorSchedule | null>(null);
  protected readonly saving = signal(false);
  /** The last save's outcome, or why the saved schedule could not be read, in words. */
  protected readonly saveMessage = signal<string | null>(null);
  /** The save was refused because someone saved the schedule since it was read: offer to read it again. */
  protected readonly staleSave = signal(false);

  constructor() {
    effect((onCleanup) => {
      const id = this.store.projectId();
      if (id === null || this.missingSite().length > 0) return;
      untracked(() => {
        const subscription = this.api.stored(id).subscribe({
          next: (stored) => this.useStored(stored),
          error: (error: unknown) => {
            this.saveMessage.set(failure(error, 'The project’s saved schedule could not be read; the common-practice one is shown.'));
            this.stored.set({ settings: defaultSettings, version: 0, saved: false, updatedAt: null, updatedBy: null });
          },
        });
        onCleanup(() => subscription.unsubscribe());
      });
    });
  }

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
    if (id === null || !project || this.missingSite().length > 0 || this.stored() === null) return null;
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

  /** The form differs from the project's saved schedule. */
  protected readonly differsFromSaved = computed(() => {
    const stored = this.stored();
    return stored !== null && (!stored.saved || JSON.stringify(stored.settings) !== JSON.stringify(this.formSettings()));
  });

  private useStored(stored: StoredExteriorSchedule): void {
    this.stored.set(stored);
    this.fill(stored.settings);
    this.settings.set(stored.settings);
  }

  private fill(settings: ExteriorScheduleSettings): void {
    this.onBefore.set(settings.onMinutesBeforeSunset);
    this.offAfter.set(settings.offMinutesAfterSunrise);
    this.withSetback.set(settings.setback !== null);
    this.setbackFrom.set(settings.setback?.start ?? defaultSettings.setback!.start);
    this.setbackTo.set(settings.setback?.end ?? defaultSettings.setback!.end);
    this.reduction.set(settings.setback?.reductionPercent ?? null);
  }

  /** Saves the form as the project's schedule, and shows the figures for it. */
  protected save(): void {
    const id = this.store.projectId();
    const stored = this.stored();
    if (id === null || stored === null || this.saving()) return;
    this.saving.set(true);
    this.saveMessage.set(null);
    this.staleSave.set(false);
    this.api.save(id, this.formSettings(), stored.version).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.useStored(saved);
        this.saveMessage.set('Saved as the project’s schedule.');
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.staleSave.set(error instanceof ApiError && error.status === 409 && error.code === 'conflict');
        this.saveMessage.set(failure(error, 'The schedule could not be saved.'));
      },
    });
  }

  /** Reads the saved schedule again (after someone else saved one). */
  protected reload(): void {
    const id = this.store.projectId();
    if (id === null) return;
    this.api.stored(id).subscribe({
      next: (stored) => {
        this.useStored(stored);
        this.saveMessage.set(null);
        this.staleSave.set(false);
      },
      error: (error: unknown) => this.saveMessage.set(failure(error, 'The saved schedule could not be read.')),
    });
  }

  protected apply(): void {
    this.settings.set(this.formSettings());
  }

  protected reset(): void {
    this.fill(defaultSettings);
    this.settings.set(defaultSettings);
  }

  protected setbackText(day: ExteriorScheduleDay): string {
    return day.setbackStart ? `${clockText(day.setbackStart, day.date)}–${clockText(day.setbackEnd, day.date)}` : '—';
  }
}
