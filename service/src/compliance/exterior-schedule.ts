import type {
  ApplicationEnergy,
  ExteriorScheduleSettings,
  ScheduleCheck,
  ScheduleDay,
  ScheduleSummary,
  SetbackRule,
  SunPattern,
} from '../../../contract/exterior-schedule.js';
import SunCalc from 'suncalc';
import { z } from 'zod';
import type { RequirementCode } from '../../../contract/editions.js';
import { controlExceptionWords } from './controls.js';
import type { ProvidedControl } from './document.js';
import type { EditionData } from './edition-data.js';
import { dec, text, type Dec } from './numbers.js';

/**
 * The astronomical clock of the exterior lighting: sunrise and sunset for the site on each day
 * (suncalc), the lights on before sunset and off after sunrise by the schedule's offsets, the night
 * setback window, and from these the hours the lights burn and the energy with and without the
 * setback. Pure: no clock, no database; every time is read in the site's own time zone through
 * Intl (full ICU), so the days daylight saving time begins and ends come out 23 and 25 hours long.
 */

const minute = 60_000;
/** suncalc's sunrise and sunset: the Sun's upper limb on the horizon with standard refraction (−0.833°). */
const horizonDegrees = -0.833;

/** Local time of day as HH:MM, 00:00 to 23:59. */
const clockTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Give a time of day as HH:MM, for example 00:00 or 06:00.');
const offsetMinutes = (what: string) =>
  z
    .number({ error: `Give the minutes ${what} as a number.` })
    .int(`Give the minutes ${what} as whole minutes.`)
    .min(0, `The minutes ${what} cannot be negative.`)
    .max(120, `The minutes ${what} can be at most 120.`);

/** The schedule an astronomical time switch runs: common practice sets on and off a few minutes inside the dark hours. */
export const scheduleSettingsSchema = z.object({
  /** Lights on this many minutes before sunset. */
  onMinutesBeforeSunset: offsetMinutes('before sunset'),
  /** Lights off this many minutes after sunrise. */
  offMinutesAfterSunrise: offsetMinutes('after sunrise'),
  /** The night setback window in local time; an end at or before the start is on the next morning. Null: no setback. */
  setback: z
    .object({
      start: clockTime,
      end: clockTime,
      /** Replaces the edition's reduction for the applications it requires to be reduced (not those it requires off). */
      reductionPercent: z.number().min(0, 'The reduction cannot be negative.').max(100, 'The reduction can be at most 100 %.').optional(),
    })
    .refine((window) => window.start !== window.end, { message: 'The setback must start and end at different times.', path: ['end'] })
    .nullable(),
});
export type ScheduleSettings = z.output<typeof scheduleSettingsSchema>;
// The settings the contract names are the ones this schema reads: a change to one side fails the type check.
const settingsMatch: ExteriorScheduleSettings extends ScheduleSettings
  ? ScheduleSettings extends ExteriorScheduleSettings
    ? true
    : never
  : never = true;
void settingsMatch;

/**
 * On 10 minutes before sunset, off 10 minutes after sunrise (common practice: offsets of about
 * 10–15 minutes are typical); the setback from midnight to 6 a.m., the hours the editions name
 * (IECC C405.2.7.3, 90.1 §9.4.1.4: midnight or business closing to 6 a.m. or opening).
 */
export const defaultScheduleSettings: ScheduleSettings = {
  onMinutesBeforeSunset: 10,
  offMinutesAfterSunrise: 10,
  setback: { start: '00:00', end: '06:00' },
};

export const schedulePlaceSchema = z.object({
  latitude: z.number().min(-90, 'The latitude is between −90 and 90.').max(90, 'The latitude is between −90 and 90.'),
  longitude: z.number().min(-180, 'The longitude is between −180 and 180.').max(180, 'The longitude is between −180 and 180.'),
  timeZone: z.string().min(1).max(100).refine(isTimeZone, 'Use an IANA time zone such as America/New_York.'),
});
export type SchedulePlace = z.output<typeof schedulePlaceSchema>;

export const maxScheduleDays = 366;
export const scheduleRangeSchema = z.object({
  from: z.iso.date({ error: 'Give the first day as a date, for example 2026-01-01.' }),
  days: z
    .number()
    .int('Give the number of days as a whole number.')
    .min(1, 'Ask for at least one day.')
    .max(maxScheduleDays, `Ask for at most ${maxScheduleDays} days.`),
});
export type ScheduleRange = z.output<typeof scheduleRangeSchema>;

export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

// ---------------------------------------------------------------- the zone's clock

interface WallClock {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

/** One formatter per zone: building Intl formatters is the costly part. */
class ZoneClock {
  private readonly format: Intl.DateTimeFormat;

  constructor(readonly timeZone: string) {
    this.format = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
  }

  wall(instant: number): WallClock {
    const parts: Record<string, number> = {};
    for (const part of this.format.formatToParts(new Date(instant))) {
      if (part.type !== 'literal') parts[part.type] = Number(part.value);
    }
    return {
      year: parts['year']!,
      month: parts['month']!,
      day: parts['day']!,
      hour: parts['hour']!,
      minute: parts['minute']!,
      second: parts['second']!,
    };
  }

  /** Minutes the zone's clock is ahead of UTC at this instant (negative west of Greenwich). */
  offset(instant: number): number {
    const wall = this.wall(instant);
    const asUtc = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
    return Math.round((asUtc - Math.floor(instant / 1000) * 1000) / minute);
  }

  /**
   * The instant the zone's clock shows this date and time of day. A time the clocks skip (the hour
   * lost in spring) comes out as the instant the same distance past the change; an hour shown twice
   * (in autumn) as its first showing.
   */
  instant(date: string, minutesOfDay: number): number {
    const [year, month, day] = date.split('-').map(Number) as [number, number, number];
    const asUtc = Date.UTC(year, month - 1, day) + minutesOfDay * minute;
    const first = asUtc - this.offset(asUtc) * minute;
    const corrected = this.offset(first);
    if (asUtc - corrected * minute === first) return first;
    const second = asUtc - corrected * minute;
    if (this.offset(second) === corrected) return second;
    // Neither offset shows this time: it falls in the hour the clocks skip.
    return Math.max(first, second);
  }

  /** Local ISO 8601 with the offset, e.g. 2026-03-08T19:12:00-04:00. */
  iso(instant: number): string {
    const wall = this.wall(instant);
    return `${wall.year}-${pad(wall.month)}-${pad(wall.day)}T${pad(wall.hour)}:${pad(wall.minute)}:${pad(wall.second)}${offsetText(this.offset(instant))}`;
  }
}

function pad(value: number): string {
  return String(value).padStart(2, '0');
}

export function offsetText(minutes: number): string {
  const sign = minutes < 0 ? '-' : '+';
  const size = Math.abs(minutes);
  return `${sign}${pad(Math.floor(size / 60))}:${pad(size % 60)}`;
}

function nextDate(date: string, by = 1): string {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(year, month - 1, day + by)).toISOString().slice(0, 10);
}

function minutesOf(time: string): number {
  const [hours, minutes] = time.split(':').map(Number) as [number, number];
  return hours * 60 + minutes;
}

function roundToMinute(instant: number): number {
  return Math.round(instant / minute) * minute;
}

// ---------------------------------------------------------------- the Sun

interface SunDay {
  pattern: SunPattern;
  sunrise: number | null;
  sunset: number | null;
  /** When the lights are off by the schedule: from sunrise + offset to sunset − offset (empty when they meet). */
  off: number | null;
  on: number | null;
  /** The stretch the lights are off, as an interval of instants; null when they stay on all the solar day. */
  dark: [number, number] | null;
}

function sunDay(clock: ZoneClock, place: SchedulePlace, settings: ScheduleSettings, date: string): SunDay {
  // suncalc takes the solar transit nearest the instant it is given: local noon finds this date's.
  const noon = clock.instant(date, 12 * 60);
  const times = SunCalc.getTimes(new Date(noon), place.latitude, place.longitude);
  const rise = times.sunrise.getTime();
  const set = times.sunset.getTime();
  if (Number.isFinite(rise) && Number.isFinite(set)) {
    const sunrise = roundToMinute(rise);
    const sunset = roundToMinute(set);
    const off = sunrise + settings.offMinutesAfterSunrise * minute;
    const on = sunset - settings.onMinutesBeforeSunset * minute;
    return { pattern: 'rises-and-sets', sunrise, sunset, off, on, dark: off < on ? [off, on] : null };
  }
  const transit = times.solarNoon.getTime();
  const altitude = (SunCalc.getPosition(new Date(transit), place.latitude, place.longitude).altitude * 180) / Math.PI;
  if (altitude > horizonDegrees) {
    // Above the horizon the whole solar day: off from one solar midnight to the next.
    return {
      pattern: 'sun-never-sets',
      sunrise: null,
      sunset: null,
      off: null,
      on: null,
      dark: [transit - 12 * 60 * minute, transit + 12 * 60 * minute],
    };
  }
  return { pattern: 'sun-never-rises', sunrise: null, sunset: null, off: null, on: null, dark: null };
}

/** The parts of [from, to) that none of the intervals (which may overlap) covers. */
function uncovered(from: number, to: number, covers: readonly [number, number][]): [number, number][] {
  const sorted = covers
    .map(([start, end]) => [Math.max(start, from), Math.min(end, to)] as [number, number])
    .filter(([start, end]) => start < end)
    .sort((a, b) => a[0] - b[0]);
  const gaps: [number, number][] = [];
  let cursor = from;
  for (const [start, end] of sorted) {
    if (start > cursor) gaps.push([cursor, start]);
    cursor = Math.max(cursor, end);
  }
  if (cursor < to) gaps.push([cursor, to]);
  return gaps;
}

function overlap(intervals: readonly [number, number][], windows: readonly [number, number][]): number {
  let total = 0;
  for (const [start, end] of intervals) {
    for (const [windowStart, windowEnd] of windows) {
      total += Math.max(0, Math.min(end, windowEnd) - Math.max(start, windowStart));
    }
  }
  return total;
}

// ---------------------------------------------------------------- the schedule

/**
 * Each local day from `range.from`: sunrise, sunset, on, off and the setback window, with the
 * minutes the lights burn that day (midnight to midnight), the dark stretches of the neighbouring
 * solar days counted too, so a sunset after midnight (near the polar summer) is not lost.
 */
export function exteriorSchedule(
  place: SchedulePlace,
  range: ScheduleRange,
  settings: ScheduleSettings = defaultScheduleSettings,
): ScheduleDay[] {
  schedulePlaceSchema.parse(place);
  scheduleRangeSchema.parse(range);
  scheduleSettingsSchema.parse(settings);
  const clock = new ZoneClock(place.timeZone);
  const suns = new Map<string, SunDay>();
  const sunOf = (date: string): SunDay => {
    let found = suns.get(date);
    if (!found) {
      found = sunDay(clock, place, settings, date);
      suns.set(date, found);
    }
    return found;
  };
  const windowOf = (date: string): [number, number] | null => {
    if (!settings.setback) return null;
    const start = minutesOf(settings.setback.start);
    const end = minutesOf(settings.setback.end);
    return [clock.instant(date, start), end > start ? clock.instant(date, end) : clock.instant(nextDate(date), end)];
  };

  const days: ScheduleDay[] = [];
  for (let index = 0; index < range.days; index += 1) {
    const date = nextDate(range.from, index);
    const sun = sunOf(date);
    const dayStart = clock.instant(date, 0);
    const dayEnd = clock.instant(nextDate(date), 0);
    const dark = [sunOf(nextDate(date, -1)), sun, sunOf(nextDate(date))].flatMap((neighbour) => (neighbour.dark ? [neighbour.dark] : []));
    const lit = uncovered(dayStart, dayEnd, dark);
    const windows = [windowOf(nextDate(date, -1)), windowOf(date)].filter((window) => window !== null);
    const startOffset = clock.offset(dayStart);
    const endOffset = clock.offset(dayEnd);
    const window = windowOf(date);
    const row: ScheduleDay = {
      date,
      sunrise: sun.sunrise === null ? null : clock.iso(sun.sunrise),
      sunset: sun.sunset === null ? null : clock.iso(sun.sunset),
      on: sun.on === null ? null : clock.iso(sun.on),
      off: sun.off === null ? null : clock.iso(sun.off),
      ...(window ? { setbackStart: clock.iso(window[0]), setbackEnd: clock.iso(window[1]) } : {}),
      sun: sun.pattern,
      utcOffset: startOffset === endOffset ? offsetText(startOffset) : `${offsetText(startOffset)} to ${offsetText(endOffset)}`,
      litMinutes: Math.round(lit.reduce((total, [start, end]) => total + end - start, 0) / minute),
      setbackMinutes: Math.round(overlap(lit, windows) / minute),
    };
    const notes = [
      ...(startOffset !== endOffset
        ? [
            endOffset > startOffset
              ? `The clocks go forward an hour this day (UTC${offsetText(startOffset)} to UTC${offsetText(endOffset)}): the day is 23 hours long.`
              : `The clocks go back an hour this day (UTC${offsetText(startOffset)} to UTC${offsetText(endOffset)}): the day is 25 hours long.`,
          ]
        : []),
      ...(sun.pattern === 'sun-never-rises'
        ? [
            row.litMinutes * minute === dayEnd - dayStart
              ? 'The sun does not rise this day: the lights stay on from midnight to midnight.'
              : 'The sun does not rise this day: the lights stay on but for the last daylight of the day before or the first of the day after.',
          ]
        : []),
      ...(sun.pattern === 'sun-never-sets'
        ? [
            row.litMinutes === 0
              ? 'The sun does not set this day: the schedule keeps the lights off.'
              : 'The sun does not set this day: the lights are on only for the last minutes of the night before or the first of the night after.',
          ]
        : []),
      ...(sun.pattern === 'rises-and-sets' && !sun.dark
        ? ['The sun is up for less time than the two offsets together: the lights stay on through the day.']
        : []),
    ];
    if (notes.length > 0) row.note = notes.join(' ');
    days.push(row);
  }
  return days;
}

// ---------------------------------------------------------------- the year's hours and energy

export interface ScheduledApplication {
  /** The design's own id for the application, handed back unchanged. */
  id: string;
  /** The edition's application key. */
  key: string;
  description?: string;
  /** Installed watts, an exact decimal string. */
  installedWatts: string;
  /** The controls the design shows for the application; an exception claimed there carries over to the schedule's checks. */
  controls?: readonly Pick<ProvidedControl, 'strategy' | 'provided' | 'exceptionReason'>[];
}

function hoursText(minutes: number): string {
  return text(dec(minutes).dividedBy(60).toDecimalPlaces(2));
}

function kWhOf(watts: Dec, minutes: Dec): Dec {
  return watts.times(minutes).dividedBy(60_000);
}

interface SetbackChoice {
  rule: SetbackRule;
  percent: string;
  section?: string;
  note: string;
  verified: boolean;
}

function setbackChoice(key: string, tables: EditionData, settings: ScheduleSettings): SetbackChoice {
  if (!settings.setback) {
    return { rule: 'none', percent: '0', note: 'The schedule has no setback window.', verified: true };
  }
  const application = tables.exteriorApplications.find((entry) => entry.key === key);
  const strategy = (strategyKey: 'exterior-setback' | 'exterior-facade-landscape-off') =>
    tables.controlStrategies.find((entry) => entry.key === strategyKey);
  const facade = strategy('exterior-facade-landscape-off');
  const setback = strategy('exterior-setback');
  if (!application) {
    return {
      rule: 'to-verify',
      percent: '0',
      note: 'To verify: this application is not in the edition’s exterior table, so whether the setback applies is not known; no saving is counted.',
      verified: false,
    };
  }
  const requirement = (code: RequirementCode | undefined) => code ?? 'not-required';
  const facadeCode = requirement(application.controls['exterior-facade-landscape-off']);
  const setbackCode = requirement(application.controls['exterior-setback']);
  if (facadeCode === 'required' && facade) {
    return {
      rule: 'off',
      percent: '100',
      section: facade.section,
      note: `Off in the setback hours (${facade.section}: facade and landscape lighting).`,
      verified: facade.provenance.verified && application.provenance.verified,
    };
  }
  if (setbackCode === 'required' && setback) {
    const stated = setback.parameters.reductionPercent;
    const chosen = settings.setback.reductionPercent;
    if (chosen !== undefined) {
      return {
        rule: 'reduced',
        percent: String(chosen),
        section: setback.section,
        note: `Reduced by ${chosen} % in the setback hours, as the schedule sets (${setback.section} states ${stated ?? 'no figure'}${stated ? ' %' : ''}).`,
        verified: false,
      };
    }
    if (stated === undefined) {
      return {
        rule: 'to-verify',
        percent: '0',
        section: setback.section,
        note: `To verify: ${setback.section} requires a setback but the tables give no reduction; set one in the schedule. No saving is counted.`,
        verified: false,
      };
    }
    return {
      rule: 'reduced',
      percent: stated,
      section: setback.section,
      note: `Reduced by ${stated} % in the setback hours (${setback.section}).`,
      verified: setback.provenance.verified && application.provenance.verified,
    };
  }
  if (facadeCode === 'not-required' && setbackCode === 'not-required') {
    return {
      rule: 'none',
      percent: '0',
      note: 'The edition requires no setback for this application.',
      verified: application.provenance.verified,
    };
  }
  return {
    rule: 'to-verify',
    percent: '0',
    section: setback?.section ?? facade?.section,
    note: 'To verify: the edition’s tables leave open whether this application is set back at night; no saving is counted.',
    verified: false,
  };
}

/** Minutes after midnight of a local HH:MM. */
function clockMinutes(clock: string): number {
  return Number(clock.slice(0, 2)) * 60 + Number(clock.slice(3, 5));
}

/**
 * Whether the setback window (an end at or before its start is the next morning) spans midnight to
 * 6 a.m., the night hours both families name for the setback (IECC C405.2.7.3; 90.1 §9.4.1.4: from
 * not later than midnight, or business closing, to not earlier than 6 a.m., or business opening).
 */
export function spansMidnightToSix(window: { start: string; end: string }): boolean {
  const start = clockMinutes(window.start);
  const length = (clockMinutes(window.end) - start + 1440) % 1440;
  const toMidnight = (1440 - start) % 1440;
  return toMidnight + 360 <= length;
}

function provided(application: ScheduledApplication, strategies: readonly string[]) {
  return application.controls?.find((control) => strategies.includes(control.strategy));
}

/**
 * The exterior control requirements the schedule answers, for each application: the daylight
 * shutoff (the astronomical clock turns the lights off after sunrise) and the night setback (the
 * window spans midnight to 6 a.m. and cuts at least the edition's reduction, or turns facade and
 * landscape lighting off). An exception the design claims for the control is carried over in words;
 * where the edition's tables leave the requirement open, the check says what to verify.
 */
export function scheduleChecks(
  settings: ScheduleSettings,
  applications: readonly ScheduledApplication[],
  tables: EditionData,
): ScheduleCheck[] {
  const strategy = (key: string) => tables.controlStrategies.find((entry) => entry.key === key);
  const daylightOff = strategy('exterior-daylight-off');
  const setbackStrategy = strategy('exterior-setback');
  const checks: ScheduleCheck[] = [];
  for (const application of applications) {
    const row = tables.exteriorApplications.find((entry) => entry.key === application.key);
    const label = row?.label ?? 'An application not in this edition';
    const base = { applicationId: application.id, label };
    if (!row) {
      checks.push({
        ...base,
        check: 'setback',
        status: 'to-verify',
        words: 'To verify: this application is not in the edition’s exterior table, so its daylight shutoff and setback cannot be checked.',
        verified: false,
      });
      continue;
    }
    const exceptionOf = (strategies: readonly string[]) => {
      const control = provided(application, strategies);
      return control?.exceptionReason ? controlExceptionWords[control.exceptionReason] : undefined;
    };

    const daylightCode = row.controls['exterior-daylight-off'];
    const daylightException = exceptionOf(['exterior-daylight-off']);
    const daylightVerified = row.provenance.verified && (daylightOff?.provenance.verified ?? false);
    if (daylightCode === undefined || daylightCode === 'not-required') {
      checks.push({
        ...base,
        check: 'daylight-off',
        status: 'not-required',
        words: 'The edition asks no daylight shutoff of this application.',
        verified: row.provenance.verified,
      });
    } else if (daylightException) {
      checks.push({
        ...base,
        check: 'daylight-off',
        status: 'exception',
        ...(daylightOff ? { section: daylightOff.section } : {}),
        words: `Exception claimed in the design: ${daylightException}. The schedule’s daylight shutoff is not counted for it.`,
        verified: daylightVerified,
      });
    } else {
      const schedule = `The astronomical schedule turns the lights off ${settings.offMinutesAfterSunrise} min after sunrise and on ${settings.onMinutesBeforeSunset} min before sunset`;
      checks.push({
        ...base,
        check: 'daylight-off',
        status: daylightCode === 'required' ? 'met' : 'to-verify',
        ...(daylightOff ? { section: daylightOff.section } : {}),
        words:
          daylightCode === 'required'
            ? `${schedule}, so they are off while daylight is present${daylightOff ? ` (${daylightOff.section})` : ''}.`
            : `${schedule}. To verify: the edition’s tables leave open whether this application needs a daylight shutoff.`,
        verified: daylightVerified,
      });
    }

    const choice = setbackChoice(application.key, tables, settings);
    const setbackException = exceptionOf(['exterior-setback', 'exterior-facade-landscape-off']);
    const facadeCode = row.controls['exterior-facade-landscape-off'];
    const setbackCode = row.controls['exterior-setback'];
    const requires = facadeCode === 'required' || setbackCode === 'required';
    const open = facadeCode === 'to-verify' || setbackCode === 'to-verify' || choice.rule === 'to-verify';
    const section = choice.section ?? setbackStrategy?.section;
    const setbackBase = { ...base, check: 'setback' as const, ...(section ? { section } : {}), verified: choice.verified };
    if (!requires && !open) {
      checks.push({ ...setbackBase, status: 'not-required', words: 'The edition asks no night setback of this application.' });
      continue;
    }
    if (setbackException) {
      checks.push({
        ...setbackBase,
        status: 'exception',
        words: `Exception claimed in the design: ${setbackException}. The schedule’s setback is not counted for it.`,
      });
      continue;
    }
    const needs =
      facadeCode === 'required'
        ? 'off'
        : `reduced by at least ${setbackStrategy?.parameters['reductionPercent'] ?? 'the edition’s figure'} %`;
    if (!settings.setback) {
      checks.push({
        ...setbackBase,
        status: requires ? 'not-met' : 'to-verify',
        words: requires
          ? `The schedule has no night setback; ${section ?? 'the edition'} asks for this lighting ${needs} at night.`
          : 'The schedule has no night setback. To verify: the edition’s tables leave open whether this application needs one.',
      });
      continue;
    }
    const window = `${settings.setback.start}–${settings.setback.end}`;
    if (choice.rule === 'to-verify' || !requires) {
      checks.push({ ...setbackBase, status: 'to-verify', words: `The schedule sets back from ${window}. ${choice.note}` });
      continue;
    }
    const stated = setbackStrategy?.parameters['reductionPercent'];
    if (choice.rule === 'reduced' && stated !== undefined && dec(choice.percent).lessThan(stated)) {
      checks.push({
        ...setbackBase,
        status: 'not-met',
        words: `The schedule reduces this lighting by ${choice.percent} % from ${window}; ${section} asks for at least ${stated} %.`,
      });
      continue;
    }
    const does = choice.rule === 'off' ? 'turns this lighting off' : `reduces this lighting by ${choice.percent} %`;
    checks.push(
      spansMidnightToSix(settings.setback)
        ? { ...setbackBase, status: 'met', words: `The schedule ${does} from ${window}, which spans midnight to 6 a.m. (${section}).` }
        : {
            ...setbackBase,
            status: 'to-verify',
            words: `The schedule ${does} from ${window}, which does not span midnight to 6 a.m. To verify: ${section} accepts it only if the window runs from business closing to opening (the edition’s text gives the allowance around those hours); check the business hours.`,
          },
    );
  }
  return checks;
}

/**
 * The hours and energy of each exterior application over the range (a year: from Jan 1, 365 or
 * 366 days): all its installed watts for the hours the lights are on, less the edition's reduction
 * in the setback hours for the applications the edition sets back.
 */
export function exteriorScheduleSummary(
  place: SchedulePlace,
  range: ScheduleRange,
  settings: ScheduleSettings,
  applications: readonly ScheduledApplication[],
  tables: EditionData,
): ScheduleSummary {
  const days = exteriorSchedule(place, range, settings);
  const litMinutes = days.reduce((total, day) => total + day.litMinutes, 0);
  const setbackMinutes = days.reduce((total, day) => total + day.setbackMinutes, 0);
  const lit = dec(litMinutes);
  const inSetback = dec(setbackMinutes);
  const unverified = new Set<string>();
  const rows = applications.map((application): ApplicationEnergy => {
    const choice = setbackChoice(application.key, tables, settings);
    const watts = dec(application.installedWatts);
    // Rounded to 0.1 kWh before the difference, so the figures shown add up.
    const without = kWhOf(watts, lit).toDecimalPlaces(1);
    const saved = kWhOf(watts, inSetback).times(choice.percent).dividedBy(100).toDecimalPlaces(1);
    const label = tables.exteriorApplications.find((entry) => entry.key === application.key)?.label ?? 'An application not in this edition';
    if (!choice.verified && choice.rule !== 'none')
      unverified.add(`${label}: ${choice.note} The value is not checked against the published code.`);
    return {
      id: application.id,
      key: application.key,
      label,
      ...(application.description ? { description: application.description } : {}),
      installedWatts: application.installedWatts,
      setback: choice.rule,
      reductionPercent: choice.percent,
      ...(choice.section ? { section: choice.section } : {}),
      hours: hoursText(litMinutes),
      setbackHours: hoursText(choice.rule === 'off' || choice.rule === 'reduced' ? setbackMinutes : 0),
      kWh: text(without.minus(saved)),
      kWhWithoutSetback: text(without),
      savingKWh: text(saved),
      note: choice.note,
      verified: choice.verified,
    };
  });
  const total = (pick: (row: ApplicationEnergy) => string) => text(rows.reduce((sum, row) => sum.plus(pick(row)), dec(0)));
  return {
    from: range.from,
    days: range.days,
    settings,
    hours: hoursText(litMinutes),
    setbackHours: hoursText(setbackMinutes),
    polarNightDays: days.filter((day) => day.sun === 'sun-never-rises').length,
    polarDays: days.filter((day) => day.sun === 'sun-never-sets').length,
    applications: rows,
    checks: scheduleChecks(settings, applications, tables),
    totals: {
      installedWatts: total((row) => row.installedWatts),
      kWh: total((row) => row.kWh),
      kWhWithoutSetback: total((row) => row.kWhWithoutSetback),
      savingKWh: total((row) => row.savingKWh),
    },
    unverified: [...unverified],
  };
}

/** The days of a calendar year in the range form. */
export function yearRange(year: number): ScheduleRange {
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return { from: `${String(year).padStart(4, '0')}-01-01`, days: leap ? 366 : 365 };
}

export type { ApplicationEnergy, ScheduleDay, ScheduleSummary, SetbackRule, SunPattern };
