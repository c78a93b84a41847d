import { describe, expect, it } from 'vitest';
import type { EditionData } from '../../service/src/compliance/edition-data.js';
import {
  defaultScheduleSettings,
  exteriorSchedule,
  exteriorScheduleSummary,
  spansMidnightToSix,
  yearRange,
  type SchedulePlace,
  type ScheduleDay,
} from '../../service/src/compliance/exterior-schedule.js';
import { iecc2021 } from './fixtures.js';

/** Minutes between a local ISO time and an almanac's clock time (HH:MM) on the same date and offset. */
function minutesFrom(iso: string | null, clock: string, offset: string): number {
  expect(iso, 'a time was expected').not.toBeNull();
  const date = iso!.slice(0, 10);
  return Math.abs(Date.parse(iso!) - Date.parse(`${date}T${clock}:00${offset}`)) / 60_000;
}

function day(place: SchedulePlace, date: string): ScheduleDay {
  const [row] = exteriorSchedule(place, { from: date, days: 1 });
  return row!;
}

const washington: SchedulePlace = { latitude: 38.9, longitude: -77.0, timeZone: 'America/New_York' };
const capeMay: SchedulePlace = { latitude: 38.9, longitude: -74.9, timeZone: 'America/New_York' };
// W121°55′, N37°24′, as the almanac names the place.
const cupertino: SchedulePlace = { latitude: 37.4, longitude: -(121 + 55 / 60), timeZone: 'America/Los_Angeles' };
const newYork: SchedulePlace = { latitude: 40.7128, longitude: -74.006, timeZone: 'America/New_York' };
const utqiagvik: SchedulePlace = { latitude: 71.2906, longitude: -156.7886, timeZone: 'America/Anchorage' };

describe('sunrise and sunset against published almanacs (within two minutes)', () => {
  it('Washington, D.C. and Cape May, N.J. at the March equinox of 2002', () => {
    // U.S. Naval Observatory, Complete Sun and Moon Data for One Day, 20 March 2002, Eastern Standard Time
    // (quoted at stevekluge.com/astronomy/equinoxsunrise.html):
    // Washington (W77.0, N38.9): sunrise 6:12 a.m., sunset 6:21 p.m.; Cape May (W74.9, N38.9): 6:04 a.m., 6:12 p.m.
    const dc = day(washington, '2002-03-20');
    expect(minutesFrom(dc.sunrise, '06:12', '-05:00')).toBeLessThanOrEqual(2);
    expect(minutesFrom(dc.sunset, '18:21', '-05:00')).toBeLessThanOrEqual(2);
    const cape = day(capeMay, '2002-03-20');
    expect(minutesFrom(cape.sunrise, '06:04', '-05:00')).toBeLessThanOrEqual(2);
    expect(minutesFrom(cape.sunset, '18:12', '-05:00')).toBeLessThanOrEqual(2);
    // The same almanac: the day at the equinox is longer than 12 hours (refraction and the Sun's disk), 12 h 9 min here.
    const length = (Date.parse(dc.sunset!) - Date.parse(dc.sunrise!)) / 60_000;
    expect(length).toBeGreaterThan(12 * 60);
    expect(length).toBeLessThan(12 * 60 + 15);
  });

  it('Cupertino, California through 2008, standard and daylight time', () => {
    // U.S. Naval Observatory, Rise and Set for the Sun for 2008, W121°55′ N37°24′, zone 8h west of Greenwich (standard
    // time all year; quoted at khuang.blogspot.com/2008/09/sunrise-sunset-time-for-one-year.html):
    // Jan 1 0722 1700; Jun 1 0448 1923; Jul 1 0451 1932; Dec 1 0704 1650 (PST). The schedule shows summer days in
    // daylight time, an hour later on the clock: the almanac's clock times are compared at −08:00.
    const cases: [string, string, string][] = [
      ['2008-01-01', '07:22', '17:00'],
      ['2008-06-01', '04:48', '19:23'],
      ['2008-07-01', '04:51', '19:32'],
      ['2008-12-01', '07:04', '16:50'],
    ];
    for (const [date, rise, set] of cases) {
      const row = day(cupertino, date);
      expect(minutesFrom(row.sunrise, rise, '-08:00'), `sunrise ${date}`).toBeLessThanOrEqual(2);
      expect(minutesFrom(row.sunset, set, '-08:00'), `sunset ${date}`).toBeLessThanOrEqual(2);
    }
    expect(day(cupertino, '2008-06-01').sunrise).toMatch(/^2008-06-01T05:\d\d:00-07:00$/);
    expect(day(cupertino, '2008-01-01').sunrise).toMatch(/^2008-01-01T07:\d\d:00-08:00$/);
  });

  it('New York at the solstices of 2026', () => {
    // From memory (a published almanac's values recalled, not looked up): New York City, June 21: sunrise 5:25 a.m.,
    // sunset 8:31 p.m. EDT; December 21: sunrise 7:17 a.m., sunset 4:32 p.m. EST.
    const june = day(newYork, '2026-06-21');
    expect(minutesFrom(june.sunrise, '05:25', '-04:00')).toBeLessThanOrEqual(2);
    expect(minutesFrom(june.sunset, '20:31', '-04:00')).toBeLessThanOrEqual(2);
    const december = day(newYork, '2026-12-21');
    expect(minutesFrom(december.sunrise, '07:17', '-05:00')).toBeLessThanOrEqual(2);
    expect(minutesFrom(december.sunset, '16:32', '-05:00')).toBeLessThanOrEqual(2);
  });

  it('the solstices hold the longest and shortest days of the year, the equinoxes about twelve hours', () => {
    const year = exteriorSchedule(newYork, yearRange(2026));
    const daylight = year.map((row) => ({ date: row.date, minutes: (Date.parse(row.sunset!) - Date.parse(row.sunrise!)) / 60_000 }));
    const longest = Math.max(...daylight.map((entry) => entry.minutes));
    const shortest = Math.min(...daylight.map((entry) => entry.minutes));
    // The June solstice of 2026 is on June 21 and the December one on December 21 (common practice: the dates the almanacs
    // give each year fall on June 20–21 and December 21–22); day lengths to the minute tie for a few days around them.
    expect(daylight.filter((entry) => entry.minutes === longest).map((entry) => entry.date)).toContain('2026-06-21');
    expect(daylight.filter((entry) => entry.minutes === shortest).map((entry) => entry.date)).toContain('2026-12-21');
    for (const equinox of ['2026-03-20', '2026-09-22']) {
      const minutes = daylight.find((entry) => entry.date === equinox)!.minutes;
      expect(minutes).toBeGreaterThan(12 * 60);
      expect(minutes).toBeLessThan(12 * 60 + 15);
    }
  });
});

describe('daylight saving time in the site’s zone', () => {
  // U.S. daylight saving time runs from the second Sunday in March to the first Sunday in November (Energy Policy Act of
  // 2005, §110, 15 U.S.C. 260a): in 2026, March 8 and November 1, the change at 2:00 a.m. local time.
  it('springs forward on March 8: offsets −05:00 then −04:00, a 23-hour day, an hour less of setback', () => {
    const [before, change, after] = exteriorSchedule(newYork, { from: '2026-03-07', days: 3 });
    expect(before!.sunrise).toMatch(/-05:00$/);
    expect(before!.utcOffset).toBe('-05:00');
    expect(change!.utcOffset).toBe('-05:00 to -04:00');
    expect(change!.sunrise).toMatch(/-04:00$/);
    expect(change!.setbackStart).toBe('2026-03-08T00:00:00-05:00');
    expect(change!.setbackEnd).toBe('2026-03-08T06:00:00-04:00');
    expect(change!.setbackMinutes).toBe(5 * 60);
    expect(change!.note).toContain('23 hours');
    expect(after!.utcOffset).toBe('-04:00');
    // Sunrise jumps about an hour later on the clock (the Sun moves only a minute or two).
    const clock = (iso: string) => Number(iso.slice(11, 13)) * 60 + Number(iso.slice(14, 16));
    expect(clock(change!.sunrise!) - clock(before!.sunrise!)).toBeGreaterThan(55);
    // Lights burn from midnight to the off time and from the on time to midnight: 23 hours less the time off.
    const off = (Date.parse(change!.on!) - Date.parse(change!.off!)) / 60_000;
    expect(change!.litMinutes).toBe(23 * 60 - off);
  });

  it('falls back on November 1: offsets −04:00 then −05:00, a 25-hour day, an hour more of setback', () => {
    const [before, change, after] = exteriorSchedule(newYork, { from: '2026-10-31', days: 3 });
    expect(before!.utcOffset).toBe('-04:00');
    expect(change!.utcOffset).toBe('-04:00 to -05:00');
    expect(change!.sunrise).toMatch(/-05:00$/);
    expect(change!.setbackStart).toBe('2026-11-01T00:00:00-04:00');
    expect(change!.setbackEnd).toBe('2026-11-01T06:00:00-05:00');
    expect(change!.setbackMinutes).toBe(7 * 60);
    expect(change!.note).toContain('25 hours');
    expect(after!.sunset).toMatch(/-05:00$/);
    const off = (Date.parse(change!.on!) - Date.parse(change!.off!)) / 60_000;
    expect(change!.litMinutes).toBe(25 * 60 - off);
  });

  it('puts on 10 minutes before sunset and off 10 minutes after sunrise by default (common practice)', () => {
    const row = day(newYork, '2026-06-21');
    expect((Date.parse(row.sunset!) - Date.parse(row.on!)) / 60_000).toBe(10);
    expect((Date.parse(row.off!) - Date.parse(row.sunrise!)) / 60_000).toBe(10);
    const [wider] = exteriorSchedule(newYork, { from: '2026-06-21', days: 1 }, { ...defaultScheduleSettings, onMinutesBeforeSunset: 30 });
    expect((Date.parse(wider!.sunset!) - Date.parse(wider!.on!)) / 60_000).toBe(30);
  });
});

describe('a polar site: Utqiaġvik, Alaska', () => {
  it('has no sunrise in December and no sunset in June, says so in words, and counts the hours without NaN', () => {
    // News reports (not an almanac): the sun set for the last time in 2023 on November 18 and rose again on January 23,
    // 2024 (Anchorage Daily News and others, as reposted at meghanmussoline.com, 21 January 2024); midnight sun from
    // about May 10 to early August (common knowledge of the town, from memory).
    const december = day(utqiagvik, '2024-12-21');
    expect(december.sun).toBe('sun-never-rises');
    expect(december.sunrise).toBeNull();
    expect(december.on).toBeNull();
    expect(december.litMinutes).toBe(24 * 60);
    expect(december.note).toContain('does not rise');
    const june = day(utqiagvik, '2025-06-21');
    expect(june.sun).toBe('sun-never-sets');
    expect(june.sunset).toBeNull();
    expect(june.litMinutes).toBe(0);
    expect(june.note).toContain('does not set');

    const year = exteriorSchedule(utqiagvik, yearRange(2024));
    expect(year).toHaveLength(366);
    for (const row of year) {
      expect(Number.isInteger(row.litMinutes)).toBe(true);
      expect(row.litMinutes).toBeGreaterThanOrEqual(0);
      expect(row.setbackMinutes).toBeLessThanOrEqual(row.litMinutes);
      for (const time of [row.sunrise, row.sunset, row.on, row.off, row.setbackStart]) {
        if (time !== null) expect(time).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:00[+-]\d\d:\d\d$/);
      }
    }
    expect(year.filter((row) => row.sun === 'sun-never-rises').length).toBeGreaterThan(50);
    expect(year.filter((row) => row.sun === 'sun-never-sets').length).toBeGreaterThan(70);
  });

  it('handles the poles themselves', () => {
    const pole = exteriorSchedule({ latitude: 90, longitude: 0, timeZone: 'UTC' }, yearRange(2025));
    expect(pole.every((row) => row.sun !== 'rises-and-sets')).toBe(true);
    expect(day({ latitude: -90, longitude: 0, timeZone: 'Antarctica/McMurdo' }, '2025-06-21').sun).toBe('sun-never-rises');
  });
});

describe('annual hours and energy', () => {
  // The reduction IECC 2021 C405.2.7.3 states: ≥ 30 % (IECC 2018 text, Massachusetts adoption, up.codes/s/lighting-setback;
  // reference/iecc-2021/control-strategies.json). The calculation fixture leaves the figure out, so it is added here.
  const tables: EditionData = {
    ...iecc2021,
    controlStrategies: iecc2021.controlStrategies.map((strategy) =>
      strategy.key === 'exterior-setback' ? { ...strategy, parameters: { ...strategy.parameters, reductionPercent: '30' } } : strategy,
    ),
  };
  const applications = [
    { id: 'p', key: 'parking', installedWatts: '1000' },
    { id: 'f', key: 'facade', installedWatts: '500' },
    { id: 'x', key: 'not-an-application', installedWatts: '100' },
  ];

  // New York's earliest sunrise is after 5:20 a.m. daylight time and its latest sunset before 8:40 p.m. (see the solstice
  // case above), so a window of 0:00–4:00 is dark every night of the year.
  const darkWindow = { ...defaultScheduleSettings, setback: { start: '00:00', end: '04:00' } };

  it('adds the lit minutes of each day, and prices each application by its watts and its setback rule', () => {
    const range = yearRange(2026);
    const days = exteriorSchedule(newYork, range, darkWindow);
    const lit = days.reduce((total, row) => total + row.litMinutes, 0);
    const setback = days.reduce((total, row) => total + row.setbackMinutes, 0);
    // Four hours a night (the change days are at 2:00 a.m., inside the window: 3 h and 5 h), 1460 h in all.
    expect(setback).toBe(365 * 4 * 60);
    const summary = exteriorScheduleSummary(newYork, range, darkWindow, applications, tables);
    expect(summary.hours).toBe((Math.round((lit / 60) * 100) / 100).toString());
    expect(summary.setbackHours).toBe('1460');

    const [parking, facade, unknown] = summary.applications;
    // 1000 W × lit hours; the setback takes 30 % of 1000 W for 1460 h = 438 kWh.
    expect(parking!.setback).toBe('reduced');
    expect(parking!.section).toBe('C405.2.7.3');
    expect(Number(parking!.kWhWithoutSetback)).toBeCloseTo(lit / 60, 1);
    expect(parking!.savingKWh).toBe('438');
    expect(Number(parking!.kWh)).toBeCloseTo(lit / 60 - 438, 1);
    // The facade is off in the setback hours: 500 W × 1460 h = 730 kWh saved.
    expect(facade!.setback).toBe('off');
    expect(facade!.section).toBe('C405.2.7.2');
    expect(facade!.savingKWh).toBe('730');
    // What the tables do not know is to verify and saves nothing.
    expect(unknown!.setback).toBe('to-verify');
    expect(unknown!.savingKWh).toBe('0');
    expect(unknown!.note).toMatch(/^To verify/);
    expect(Number(summary.totals.savingKWh)).toBe(438 + 730);
    expect(summary.unverified.length).toBeGreaterThan(0);
  });

  it('counts only the lit part of the window: a June morning is light before 6 a.m.', () => {
    const june = day(newYork, '2026-06-21');
    const midnight = Date.parse('2026-06-21T00:00:00-04:00');
    expect(june.setbackMinutes).toBe((Date.parse(june.off!) - midnight) / 60_000);
    expect(june.setbackMinutes).toBeLessThan(6 * 60);
  });

  it('takes the schedule’s own reduction, and without a setback saves nothing', () => {
    const range = yearRange(2026);
    const chosen = exteriorScheduleSummary(
      newYork,
      range,
      { ...darkWindow, setback: { start: '00:00', end: '04:00', reductionPercent: 50 } },
      applications.slice(0, 1),
      tables,
    );
    expect(chosen.applications[0]!.savingKWh).toBe('730');
    const none = exteriorScheduleSummary(newYork, range, { ...defaultScheduleSettings, setback: null }, applications.slice(0, 1), tables);
    expect(none.applications[0]!.savingKWh).toBe('0');
    expect(none.applications[0]!.kWh).toBe(none.applications[0]!.kWhWithoutSetback);
  });

  it('counts a window across midnight on both days it touches', () => {
    const [first, second] = exteriorSchedule(
      newYork,
      { from: '2026-01-10', days: 2 },
      { ...defaultScheduleSettings, setback: { start: '22:00', end: '05:00' } },
    );
    expect(first!.setbackStart).toBe('2026-01-10T22:00:00-05:00');
    expect(first!.setbackEnd).toBe('2026-01-11T05:00:00-05:00');
    // The first day has 0:00–5:00 of the window begun the night before, and 22:00–24:00 of its own.
    expect(first!.setbackMinutes).toBe(7 * 60);
    expect(second!.setbackMinutes).toBe(7 * 60);
  });
});

describe('bounds', () => {
  it('refuses more than 366 days, a latitude past a pole, an offset over two hours and an unknown zone', () => {
    expect(() => exteriorSchedule(newYork, { from: '2026-01-01', days: 367 })).toThrow();
    expect(() => exteriorSchedule({ ...newYork, latitude: 91 }, { from: '2026-01-01', days: 1 })).toThrow();
    expect(() =>
      exteriorSchedule(newYork, { from: '2026-01-01', days: 1 }, { ...defaultScheduleSettings, offMinutesAfterSunrise: 121 }),
    ).toThrow();
    expect(() => exteriorSchedule({ ...newYork, timeZone: 'Mars/Olympus' }, { from: '2026-01-01', days: 1 })).toThrow();
    expect(() => exteriorSchedule(newYork, { from: '2026-02-30', days: 1 })).toThrow();
  });
});

describe('spansMidnightToSix', () => {
  // The night hours of the setback: from midnight to 6 a.m. (IECC C405.2.7.3; 90.1 §9.4.1.4).
  it('takes a window that covers midnight to 6 a.m., across midnight or from it', () => {
    expect(spansMidnightToSix({ start: '00:00', end: '06:00' })).toBe(true);
    expect(spansMidnightToSix({ start: '23:00', end: '06:00' })).toBe(true);
    expect(spansMidnightToSix({ start: '22:00', end: '07:30' })).toBe(true);
  });
  it('refuses one that starts after midnight, ends before six, or is a daytime window', () => {
    expect(spansMidnightToSix({ start: '00:30', end: '06:00' })).toBe(false);
    expect(spansMidnightToSix({ start: '23:00', end: '05:59' })).toBe(false);
    expect(spansMidnightToSix({ start: '06:00', end: '00:00' })).toBe(false);
    expect(spansMidnightToSix({ start: '01:00', end: '05:00' })).toBe(false);
  });
});
