import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ExteriorScheduleDay, ExteriorScheduleSummary, ProjectDetail, StoredExteriorSchedule } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { clockText, ExteriorSchedule } from './exterior-schedule';
import { minutesAfterNoon, scheduleChart } from './schedule-chart';

// Invented days in the service's shape: the figures are made up, only their form matters here.
function day(date: string, fields: Partial<ExteriorScheduleDay> = {}): ExteriorScheduleDay {
  return {
    date,
    sunrise: `${date}T07:00:00-05:00`,
    sunset: `${date}T17:00:00-05:00`,
    on: `${date}T16:50:00-05:00`,
    off: `${date}T07:10:00-05:00`,
    setbackStart: `${date}T00:00:00-05:00`,
    setbackEnd: `${date}T06:00:00-05:00`,
    sun: 'rises-and-sets',
    utcOffset: '-05:00',
    litMinutes: 860,
    setbackMinutes: 360,
    ...fields,
  };
}

const polar = (date: string): ExteriorScheduleDay =>
  day(date, {
    sunrise: null,
    sunset: null,
    on: null,
    off: null,
    sun: 'sun-never-rises',
    litMinutes: 1440,
    note: 'The sun does not rise this day: the lights stay on from midnight to midnight.',
  });

describe('the schedule chart', () => {
  it('reads a local time as minutes after the day’s noon, the next morning past midnight', () => {
    expect(minutesAfterNoon('2026-01-05T16:50:00-05:00', '2026-01-05')).toBe(4 * 60 + 50);
    expect(minutesAfterNoon('2026-01-06T07:10:00-05:00', '2026-01-05')).toBe(19 * 60 + 10);
  });

  it('lights each night from the on time to the next off time, with the setback inside it', () => {
    const chart = scheduleChart([day('2026-01-05'), day('2026-01-06')]);
    expect(chart.columns[0]!.lit).toEqual([4 * 60 + 50, 19 * 60 + 10]);
    // The next morning's window, midnight to 6 a.m., is 12 to 18 hours after noon.
    expect(chart.columns[0]!.setback).toEqual([[12 * 60, 18 * 60]]);
    expect(chart.runs).toEqual([]);
  });

  it('marks a change of the clocks and names a run of days without sunrise in words', () => {
    const chart = scheduleChart([
      day('2026-03-07'),
      day('2026-03-08', { utcOffset: '-05:00 to -04:00', sunrise: '2026-03-08T08:00:00-04:00' }),
      polar('2026-03-09'),
      polar('2026-03-10'),
    ]);
    expect(chart.changes).toEqual([{ index: 1, words: '8 Mar: clocks forward an hour' }]);
    expect(chart.runs.map((run) => run.words)).toEqual(['No sunrise 9 Mar – 10 Mar: lights on all day']);
    expect(chart.columns[2]!.lit).toEqual([0, 24 * 60]);
  });

  it('shows a time on the day’s own clock, and says when it falls the next day', () => {
    expect(clockText('2024-05-10T01:42:00-08:00', '2024-05-09')).toBe('01:42 next day');
    expect(clockText(null, '2024-05-09')).toBe('—');
  });
});

const site = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 3,
  members: [],
  archivedAt: null,
  latitude: '47.04',
  longitude: '-122.9',
  timeZone: 'America/Los_Angeles',
} as unknown as ProjectDetail;

const summary: ExteriorScheduleSummary = {
  year: 2026,
  from: '2026-01-01',
  days: 365,
  settings: { onMinutesBeforeSunset: 10, offMinutesAfterSunrise: 10, setback: { start: '00:00', end: '06:00' } },
  hours: '4321.5',
  setbackHours: '2190',
  polarNightDays: 0,
  polarDays: 0,
  applications: [
    {
      id: 'a1',
      key: 'parking',
      label: 'Parking lots and drives',
      installedWatts: '1000',
      setback: 'reduced',
      reductionPercent: '30',
      section: 'C405.2.7.3',
      hours: '4321.5',
      setbackHours: '2190',
      kWh: '3664.5',
      kWhWithoutSetback: '4321.5',
      savingKWh: '657',
      note: 'Reduced by 30 % in the setback hours (C405.2.7.3).',
      verified: false,
    },
  ],
  totals: { installedWatts: '1000', kWh: '3664.5', kWhWithoutSetback: '4321.5', savingKWh: '657' },
  checks: [
    {
      check: 'setback',
      applicationId: 'a1',
      label: 'Parking lots and drives',
      status: 'not-met',
      section: 'C405.2.7.3',
      words: 'The schedule reduces this lighting by 20 % from 00:00–06:00; C405.2.7.3 asks for at least 30 %.',
      verified: false,
    },
  ],
  unverified: ['Parking lots and drives: reduced by 30 %. The value is not checked against the published code.'],
};

describe('ExteriorSchedule', () => {
  let fixture: ComponentFixture<ExteriorSchedule>;
  let http: HttpTestingController;
  let element: HTMLElement;
  let store: ProjectStore;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [ExteriorSchedule],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const notSaved: StoredExteriorSchedule = {
    settings: { onMinutesBeforeSunset: 10, offMinutesAfterSunrise: 10, setback: { start: '00:00', end: '06:00' } },
    version: 0,
    saved: false,
    updatedAt: null,
    updatedBy: null,
  };

  /** Opens the schedule; the project's saved schedule is read first, and answered with `stored` unless it is null. */
  async function open(project: ProjectDetail, stored: StoredExteriorSchedule | null = notSaved): Promise<void> {
    store.seed({ project });
    fixture = TestBed.createComponent(ExteriorSchedule);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    if (stored !== null) {
      http.expectOne((request) => request.url === '/api/projects/p1/exterior-schedule/settings').flush(stored);
      await fixture.whenStable();
    }
  }

  const requests = (): { year: TestRequest; summary: TestRequest } => ({
    year: http.expectOne((request) => request.url === '/api/projects/p1/exterior-schedule'),
    summary: http.expectOne((request) => request.url === '/api/projects/p1/exterior-schedule/summary'),
  });

  it('sends the engineer to the set-up when the site has no coordinates, without asking the service', async () => {
    await open({ ...site, latitude: null, timeZone: null }, null);
    const notice = element.querySelector('.notice');
    expect(notice?.textContent?.replace(/\s+/g, ' ')).toContain("needs the site's latitude, time zone: fill them in on the Set-up page");
    expect(notice?.querySelector('a')?.getAttribute('href')).toMatch(/setup$/);
    http.expectNone(() => true);
  });

  it('draws the year, lists the chosen month and gives the year’s hours and energy per application', async () => {
    await open(site);
    const { year, summary: annual } = requests();
    const year2026 = Number(year.request.params.get('from')!.slice(0, 4));
    expect(year.request.params.get('onBefore')).toBe('10');
    expect(year.request.params.get('setbackFrom')).toBe('00:00');
    const month = String(new Date().getMonth() + 1).padStart(2, '0');
    year.flush([
      day(`${year2026}-${month}-01`),
      day(`${year2026}-${month}-02`, { utcOffset: '-05:00 to -04:00', note: 'The clocks go forward an hour this day.' }),
      polar(`${year2026}-${month}-03`),
    ]);
    annual.flush({ ...summary, year: year2026 });
    await fixture.whenStable();

    expect(element.querySelector('[data-testid="schedule-chart"]')).not.toBeNull();
    expect(element.querySelector('[data-testid="polar-label"]')?.textContent).toContain('No sunrise');
    const rows = element.querySelectorAll('[data-testid="schedule-month"] tbody tr');
    expect(rows.length).toBe(3);
    expect(rows[0]!.textContent).toContain('07:00');
    expect(rows[1]!.textContent).toContain('clocks go forward');
    expect(rows[2]!.textContent).toContain('does not rise');
    const annualText = element.querySelector('[data-testid="schedule-annual"]')!.textContent!.replace(/\s+/g, ' ');
    expect(annualText).toContain('Parking lots and drives');
    expect(annualText).toContain('Reduced by 30 % (C405.2.7.3)');
    expect(annualText).toContain('4,322');
    expect(annualText).toContain('657');
    expect(element.textContent).toContain('To verify: these figures rest on values not checked');
    const checks = element.querySelector('[data-testid="schedule-checks"]')!.textContent!.replace(/\s+/g, ' ');
    expect(checks).toContain('Night setback (C405.2.7.3)');
    expect(checks).toContain('Not met');
    expect(checks).toContain('asks for at least 30 %');
    expect(element.querySelector('[data-testid="schedule-saved"]')?.textContent).toContain('common-practice schedule until one is saved');
  });

  it('opens on the project’s saved schedule, saves the engineer’s change with the version read, and offers to read again when stale', async () => {
    const saved: StoredExteriorSchedule = {
      settings: { onMinutesBeforeSunset: 15, offMinutesAfterSunrise: 5, setback: { start: '23:00', end: '06:00', reductionPercent: 50 } },
      version: 2,
      saved: true,
      updatedAt: '2026-11-30T18:00:00Z',
      updatedBy: 'Dana Engineer',
    };
    await open(site, saved);
    let pending = requests();
    expect(pending.year.request.params.get('onBefore')).toBe('15');
    expect(pending.year.request.params.get('setbackFrom')).toBe('23:00');
    expect(pending.year.request.params.get('reduction')).toBe('50');
    pending.year.flush([]);
    pending.summary.flush(summary);
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="schedule-saved"]')?.textContent).toContain('by Dana Engineer');
    const saveButton = () =>
      Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find((button) =>
        button.textContent?.includes('Save as the project'),
      )!;
    expect(saveButton().disabled).toBe(true);

    const input = element.querySelector<HTMLInputElement>('input[name="offAfter"]')!;
    input.value = '20';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(saveButton().disabled).toBe(false);
    saveButton().click();
    const put = http.expectOne((request) => request.method === 'PUT' && request.url === '/api/projects/p1/exterior-schedule/settings');
    expect(put.request.body).toEqual({ settings: { ...saved.settings, offMinutesAfterSunrise: 20 }, version: 2 });
    put.flush(
      { error: { code: 'conflict', message: 'Someone saved the schedule since you opened it: reload to see their settings.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(element.querySelector('.save-status')?.textContent).toContain('Someone saved the schedule');
    const again = Array.from(element.querySelectorAll<HTMLButtonElement>('.save-status button')).find((button) =>
      button.textContent?.includes('Read the saved schedule'),
    )!;
    again.click();
    http
      .expectOne((request) => request.method === 'GET' && request.url === '/api/projects/p1/exterior-schedule/settings')
      .flush({ ...saved, version: 3, settings: { ...saved.settings, offMinutesAfterSunrise: 30 } });
    await fixture.whenStable();
    expect(element.querySelector<HTMLInputElement>('input[name="offAfter"]')!.value).toBe('30');
    pending = requests();
    expect(pending.year.request.params.get('offAfter')).toBe('30');
    pending.year.flush([]);
    pending.summary.flush(summary);
  });

  it('lets a reviewer try settings but not save them', async () => {
    await open({ ...site, role: 'reviewer' } as ProjectDetail);
    const pending = requests();
    pending.year.flush([]);
    pending.summary.flush(summary);
    await fixture.whenStable();
    expect(Array.from(element.querySelectorAll('button')).some((button) => button.textContent?.includes('Save as the project'))).toBe(
      false,
    );
    expect(element.querySelector('button[type="submit"]')).not.toBeNull();
  });

  it('asks again with the offsets the engineer tries', async () => {
    await open(site);
    let pending = requests();
    pending.year.flush([]);
    pending.summary.flush(summary);
    await fixture.whenStable();
    const input = element.querySelector<HTMLInputElement>('input[name="onBefore"]')!;
    input.value = '20';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    await fixture.whenStable();
    pending = requests();
    expect(pending.year.request.params.get('onBefore')).toBe('20');
    expect(pending.summary.request.params.get('onBefore')).toBe('20');
    pending.year.flush([]);
    pending.summary.flush(summary);
  });
});
