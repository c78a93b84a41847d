import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let contractor: SignedInAgent;
let demoId: string;
let privateId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  demoId = (await database.db('projects').where({ name: 'Alder Bay Library & Makerspace' }).first<{ id: string }>('id')).id;
  // A project of the engineer's own, which the contractor is not on.
  const created = await engineer.agent.post('/api/projects').set('X-CSRF-Token', engineer.csrfToken).send({
    name: 'Quay Kiosk',
    edition: 'iecc-2021',
    method: 'building-area',
    units: 'ip',
    latitude: '47.04',
    longitude: '-122.9',
    timeZone: 'America/Los_Angeles',
  });
  expect(created.status).toBe(201);
  privateId = created.body.id;
});

afterAll(async () => {
  await database.drop();
});

interface Day {
  date: string;
  sunrise: string | null;
  sunset: string | null;
  on: string | null;
  off: string | null;
  setbackStart?: string;
  setbackEnd?: string;
  utcOffset: string;
  note?: string;
}

describe('GET /api/projects/:id/exterior-schedule', () => {
  it('gives each day in the site’s zone, across the spring change of the clocks, to any member', async () => {
    // The demo site is at 47.04° N, 122.90° W, in America/Los_Angeles; U.S. daylight time began on 8 March 2026
    // (Energy Policy Act of 2005, §110: the second Sunday in March).
    const response = await contractor.agent.get(`/api/projects/${demoId}/exterior-schedule?from=2026-03-07&days=3`);
    expect(response.status).toBe(200);
    const days = response.body as Day[];
    expect(days.map((day) => day.date)).toEqual(['2026-03-07', '2026-03-08', '2026-03-09']);
    expect(days[0]!.sunset).toMatch(/^2026-03-07T1\d:\d\d:00-08:00$/);
    expect(days[1]!.utcOffset).toBe('-08:00 to -07:00');
    expect(days[2]!.sunrise).toMatch(/-07:00$/);
    for (const day of days) {
      expect(Object.keys(day)).toEqual(expect.arrayContaining(['date', 'sunrise', 'sunset', 'on', 'off', 'setbackStart', 'setbackEnd']));
      expect((Date.parse(day.sunset!) - Date.parse(day.on!)) / 60_000).toBe(10);
    }
  });

  it('takes the schedule’s offsets and window from the query, or no setback at all', async () => {
    const response = await engineer.agent.get(
      `/api/projects/${demoId}/exterior-schedule?from=2026-06-21&days=1&onBefore=20&offAfter=5&setbackFrom=23:00&setbackTo=05:00`,
    );
    expect(response.status).toBe(200);
    const [day] = response.body as Day[];
    expect((Date.parse(day!.sunset!) - Date.parse(day!.on!)) / 60_000).toBe(20);
    expect((Date.parse(day!.off!) - Date.parse(day!.sunrise!)) / 60_000).toBe(5);
    expect(day!.setbackStart).toBe('2026-06-21T23:00:00-07:00');
    expect(day!.setbackEnd).toBe('2026-06-22T05:00:00-07:00');
    const none = await engineer.agent.get(`/api/projects/${demoId}/exterior-schedule?from=2026-06-21&days=1&setback=none`);
    expect(none.body[0].setbackStart).toBeUndefined();
  });

  it('refuses a range or offset out of bounds, in words', async () => {
    for (const query of ['days=367', 'days=0', 'from=2026-13-01', 'onBefore=121', 'offAfter=-1', 'setbackFrom=25:00', 'reduction=101']) {
      const response = await engineer.agent.get(`/api/projects/${demoId}/exterior-schedule?${query}`);
      expect(response.status, query).toBe(400);
      expect(response.body.error.code).toBe('validation_failed');
    }
    const same = await engineer.agent.get(`/api/projects/${demoId}/exterior-schedule?setbackFrom=06:00&setbackTo=06:00`);
    expect(same.status).toBe(400);
    expect(same.body.error.message).toContain('different times');
  });

  it('sends the engineer to the set-up when the site has no coordinates or time zone', async () => {
    const created = await engineer.agent
      .post('/api/projects')
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Siteless Depot', edition: 'iecc-2021', method: 'building-area', units: 'ip' });
    expect(created.status).toBe(201);
    for (const path of ['exterior-schedule', 'exterior-schedule/summary']) {
      const response = await engineer.agent.get(`/api/projects/${created.body.id}/${path}`);
      expect(response.status).toBe(400);
      expect(response.body.error.message).toMatch(/latitude, longitude and time zone.*Set-up page/);
      expect(response.body.error.details.map((detail: { path: string }) => detail.path).sort()).toEqual([
        'latitude',
        'longitude',
        'timeZone',
      ]);
    }
  });

  it('is closed to a non-member', async () => {
    const response = await contractor.agent.get(`/api/projects/${privateId}/exterior-schedule`);
    expect(response.status).toBe(404);
  });
});

describe('GET /api/projects/:id/exterior-schedule/summary', () => {
  it('gives the year’s hours and kWh of every exterior application, with and without the setback', async () => {
    const applications = await engineer.agent.get(`/api/projects/${demoId}/exterior-applications`);
    expect(applications.body.length).toBeGreaterThan(0);
    const response = await engineer.agent.get(`/api/projects/${demoId}/exterior-schedule/summary?year=2026`);
    expect(response.status).toBe(200);
    const summary = response.body as {
      year: number;
      days: number;
      hours: string;
      applications: {
        id: string;
        installedWatts: string;
        hours: string;
        setbackHours: string;
        kWh: string;
        kWhWithoutSetback: string;
        savingKWh: string;
        reductionPercent: string;
        setback: string;
      }[];
    };
    expect(summary.year).toBe(2026);
    expect(summary.days).toBe(365);
    // About half the year is night at 47° N: between 4,000 and 5,000 hours (the schedule trims 20 minutes a day).
    expect(Number(summary.hours)).toBeGreaterThan(4000);
    expect(Number(summary.hours)).toBeLessThan(5000);
    expect(summary.applications.map((application) => application.id).sort()).toEqual(
      (applications.body as { id: string }[]).map((application) => application.id).sort(),
    );
    for (const application of summary.applications) {
      const watts = Number(application.installedWatts);
      expect(Number(application.kWhWithoutSetback)).toBeCloseTo((watts * Number(application.hours)) / 1000, 0);
      const saving = (watts * Number(application.setbackHours) * Number(application.reductionPercent)) / 100 / 1000;
      expect(Number(application.savingKWh)).toBeCloseTo(saving, 0);
      expect(Number(application.kWh)).toBeCloseTo(Number(application.kWhWithoutSetback) - Number(application.savingKWh), 1);
    }
    // IECC 2021 sets back the demo's parking and walkways (C405.2.7.3): at least one application saves energy.
    expect(summary.applications.some((application) => Number(application.savingKWh) > 0)).toBe(true);
  });

  it('refuses a year out of range', async () => {
    const response = await engineer.agent.get(`/api/projects/${demoId}/exterior-schedule/summary?year=99999`);
    expect(response.status).toBe(400);
  });
});
