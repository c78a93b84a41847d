import { Router } from 'express';
import type { StoredExteriorSchedule } from '../../../contract/exterior-schedule.js';
import { z } from 'zod';
import { loadEditionData } from '../code-tables/code-tables.repository.js';
import {
  defaultScheduleSettings,
  exteriorSchedule,
  exteriorScheduleSummary,
  maxScheduleDays,
  schedulePlaceSchema,
  scheduleSettingsSchema,
  yearRange,
  type SchedulePlace,
  type ScheduleSettings,
} from '../compliance/exterior-schedule.js';
import type { Database } from '../db/database.js';
import { listExteriorApplications } from '../design/design.repository.js';
import { Refused } from '../domain-errors.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { parse } from '../http/validate.js';
import { projectSite } from '../projects/projects.repository.js';
import { saveScheduleSettings, scheduleSettings } from './schedule-settings.repository.js';

const minutes = (what: string) =>
  z.coerce
    .number({ error: `Give the minutes ${what} as a number.` })
    .int(`Give the minutes ${what} as whole minutes.`)
    .min(0, `The minutes ${what} cannot be negative.`)
    .max(120, `The minutes ${what} can be at most 120.`);
const clockTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Give a time of day as HH:MM, for example 00:00 or 06:00.');

/** The schedule's settings as query parameters; each one left out keeps its default. */
const settingsQuery = {
  onBefore: minutes('before sunset').optional(),
  offAfter: minutes('after sunrise').optional(),
  setbackFrom: clockTime.optional(),
  setbackTo: clockTime.optional(),
  /** "none": no setback window at all. */
  setback: z.enum(['none'], { error: 'Leave the setback out, or give "none" for no setback.' }).optional(),
  reduction: z.coerce.number().min(0, 'The reduction cannot be negative.').max(100, 'The reduction can be at most 100 %.').optional(),
};

const scheduleQuerySchema = z.object({
  from: z.iso.date({ error: 'Give the first day as a date, for example 2026-01-01.' }).optional(),
  days: z.coerce
    .number({ error: 'Give the number of days as a number.' })
    .int('Give the number of days as a whole number.')
    .min(1, 'Ask for at least one day.')
    .max(maxScheduleDays, `Ask for at most ${maxScheduleDays} days.`)
    .default(31),
  ...settingsQuery,
});

const summaryQuerySchema = z.object({
  year: z.coerce.number({ error: 'Give the year as a number.' }).int('Give the year as a whole number.').min(1900).max(2200).optional(),
  ...settingsQuery,
});

/**
 * The settings an answer uses: the project's saved schedule (or the defaults), each query parameter
 * given replacing its part, so a setting can be tried before it is saved.
 */
function settingsFrom(query: z.output<z.ZodObject<typeof settingsQuery>>, saved: ScheduleSettings): ScheduleSettings {
  const base = saved.setback ?? defaultScheduleSettings.setback!;
  const start = query.setbackFrom ?? base.start;
  const end = query.setbackTo ?? base.end;
  const tried = query.setbackFrom !== undefined || query.setbackTo !== undefined || query.reduction !== undefined;
  if (query.setback === undefined && saved.setback === null && !tried) {
    return {
      onMinutesBeforeSunset: query.onBefore ?? saved.onMinutesBeforeSunset,
      offMinutesAfterSunrise: query.offAfter ?? saved.offMinutesAfterSunrise,
      setback: null,
    };
  }
  if (query.setback !== 'none' && start === end) {
    throw new Refused('The setback must start and end at different times.', [{ path: 'setbackTo', message: 'Choose another end time.' }]);
  }
  return {
    onMinutesBeforeSunset: query.onBefore ?? saved.onMinutesBeforeSunset,
    offMinutesAfterSunrise: query.offAfter ?? saved.offMinutesAfterSunrise,
    setback:
      query.setback === 'none'
        ? null
        : { start, end, ...reductionOf(query.reduction ?? (tried ? undefined : saved.setback?.reductionPercent)) },
  };
}

function reductionOf(percent: number | undefined): { reductionPercent?: number } {
  return percent === undefined ? {} : { reductionPercent: percent };
}

const saveSchema = z.strictObject({
  settings: scheduleSettingsSchema,
  /** The version read: 0 when the project had no saved schedule. */
  version: z.number({ error: 'Give the version of the schedule you read.' }).int().min(0).max(2_147_483_647),
});

/** The site's place, or a refusal in words that sends the engineer to the set-up. */
async function siteOf(db: Database, projectId: string): Promise<{ place: SchedulePlace; editionId: string | null }> {
  const site = await projectSite(db, projectId);
  const missing = [
    ...(site?.latitude == null ? [{ path: 'latitude', message: 'The latitude is not entered.' }] : []),
    ...(site?.longitude == null ? [{ path: 'longitude', message: 'The longitude is not entered.' }] : []),
    ...(site?.timeZone == null ? [{ path: 'timeZone', message: 'The time zone is not chosen.' }] : []),
  ];
  if (!site || missing.length > 0) {
    throw new Refused(
      'The exterior schedule needs the site’s latitude, longitude and time zone: fill them in on the Set-up page, then come back.',
      missing,
    );
  }
  const place = schedulePlaceSchema.safeParse({
    latitude: Number(site.latitude),
    longitude: Number(site.longitude),
    timeZone: site.timeZone,
  });
  if (!place.success) {
    throw new Refused('The site’s latitude, longitude or time zone cannot be read: correct them on the Set-up page.', [
      { path: 'timeZone', message: 'Check the latitude, longitude and time zone.' },
    ]);
  }
  return { place: place.data, editionId: site.editionId };
}

/** Today's date, or this year, on the site's own calendar. */
function siteToday(timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date());
}

/**
 * `GET /api/projects/:projectId/exterior-schedule?from=&days=` (each day's sunrise, sunset, on, off
 * and setback window, local times with the offset) and `…/exterior-schedule/summary?year=` (the
 * year's hours and kWh per exterior application, with and without the setback, and the exterior
 * control requirements the schedule answers). Members read. `GET/PUT …/exterior-schedule/settings`:
 * the project's saved schedule (the defaults until one is saved); the engineer saves it, under the
 * design lock, with the version read.
 */
export function exteriorScheduleRouter(db: Database): Router {
  const router = Router({ mergeParams: true });
  router.get('/exterior-schedule/settings', requireProjectAction('read'), async (req, res) => {
    const answer: StoredExteriorSchedule = await scheduleSettings(db, projectAccess(req).projectId);
    res.json(answer);
  });
  router.put('/exterior-schedule/settings', requireProjectAction('edit-design'), async (req, res) => {
    const input = parse(saveSchema, req.body);
    const answer: StoredExteriorSchedule = await saveScheduleSettings(
      db,
      projectAccess(req).projectId,
      input.settings,
      input.version,
      currentSession(req).user.id,
    );
    res.json(answer);
  });
  router.get('/exterior-schedule', requireProjectAction('read'), async (req, res) => {
    const query = parse(scheduleQuerySchema, req.query);
    const projectId = projectAccess(req).projectId;
    const settings = settingsFrom(query, (await scheduleSettings(db, projectId)).settings);
    const { place } = await siteOf(db, projectId);
    res.json(exteriorSchedule(place, { from: query.from ?? siteToday(place.timeZone), days: query.days }, settings));
  });
  router.get('/exterior-schedule/summary', requireProjectAction('read'), async (req, res) => {
    const query = parse(summaryQuerySchema, req.query);
    const projectId = projectAccess(req).projectId;
    const settings = settingsFrom(query, (await scheduleSettings(db, projectId)).settings);
    const { place, editionId } = await siteOf(db, projectId);
    if (!editionId) {
      throw new Refused('Choose the code edition in the set-up first: the setback each application needs comes from it.', [
        { path: 'edition', message: 'Required.' },
      ]);
    }
    const [tables, applications] = await Promise.all([loadEditionData(db, editionId), listExteriorApplications(db, projectId)]);
    if (!tables)
      throw new Refused('The project’s code edition is not loaded.', [{ path: 'edition', message: 'Choose the edition again.' }]);
    const year = query.year ?? Number(siteToday(place.timeZone).slice(0, 4));
    res.json({
      year,
      ...exteriorScheduleSummary(
        place,
        yearRange(year),
        settings,
        applications.map(({ id, key, description, installedWatts, controls }) => ({ id, key, description, installedWatts, controls })),
        tables,
      ),
    });
  });
  return router;
}
