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

interface Check {
  check: 'daylight-off' | 'setback';
  applicationId: string;
  label: string;
  status: string;
  section?: string;
  words: string;
}

describe('the project’s saved schedule', () => {
  let kioskApplicationId: string;

  beforeAll(async () => {
    // IECC 2021 sets back parking lots (C405.2.7.3, code table in reference/iecc-2021) and asks facades off (C405.2.7.2).
    const parking = await engineer.agent
      .post(`/api/projects/${privateId}/exterior-applications`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ key: 'parking-lots-and-drives', quantity: '4000', installedWatts: '300' });
    expect(parking.status).toBe(201);
    kioskApplicationId = parking.body.id;
    const facade = await engineer.agent
      .post(`/api/projects/${privateId}/exterior-applications`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({
        key: 'building-facades',
        quantity: '200',
        installedWatts: '40',
        controls: [{ strategy: 'exterior-facade-landscape-off', provided: false, exceptionReason: 'security-or-emergency-continuous' }],
      });
    expect(facade.status).toBe(201);
  });

  const checksOf = async (query = '') => {
    const response = await engineer.agent.get(`/api/projects/${privateId}/exterior-schedule/summary?year=2026${query}`);
    expect(response.status).toBe(200);
    return response.body.checks as Check[];
  };
  const parkingSetback = (checks: Check[]) =>
    checks.find((check) => check.applicationId === kioskApplicationId && check.check === 'setback')!;

  it('runs on the defaults until the engineer saves one, and the demo runs the one its controls describe', async () => {
    const fresh = await engineer.agent.get(`/api/projects/${privateId}/exterior-schedule/settings`);
    expect(fresh.body).toMatchObject({
      saved: false,
      version: 0,
      settings: { onMinutesBeforeSunset: 10, offMinutesAfterSunrise: 10, setback: { start: '00:00', end: '06:00' } },
    });
    const demo = await contractor.agent.get(`/api/projects/${demoId}/exterior-schedule/settings`);
    expect(demo.body).toMatchObject({ saved: true, settings: { setback: { start: '23:00', end: '06:00', reductionPercent: 50 } } });
  });

  it('checks the daylight shutoff and the setback of each application, and carries an exception over', async () => {
    const checks = await checksOf();
    const parking = parkingSetback(checks);
    expect(parking).toMatchObject({ status: 'met', section: 'C405.2.7.3', label: 'Parking lots and drives' });
    expect(parking.words).toContain('00:00–06:00');
    const daylight = checks.find((check) => check.applicationId === kioskApplicationId && check.check === 'daylight-off')!;
    expect(daylight.status).toBe('met');
    expect(daylight.words).toContain('10 min after sunrise');
    const facade = checks.find((check) => check.label === 'Building facades' && check.check === 'setback')!;
    expect(facade.status).toBe('exception');
    expect(facade.words).toContain('security or emergency area');
  });

  it('says what is not met and what is to verify, in words', async () => {
    // IECC 2021 C405.2.7.3 asks for at least 30 % (reference/iecc-2021/control-strategies.json, reductionPercent).
    const weak = parkingSetback(await checksOf('&reduction=20'));
    expect(weak.status).toBe('not-met');
    expect(weak.words).toContain('at least 30 %');
    const none = parkingSetback(await checksOf('&setback=none'));
    expect(none.status).toBe('not-met');
    expect(none.words).toContain('no night setback');
    const short = parkingSetback(await checksOf('&setbackFrom=01:00&setbackTo=05:00'));
    expect(short.status).toBe('to-verify');
    expect(short.words).toContain('does not span midnight to 6 a.m.');
    const evening = parkingSetback(await checksOf('&setbackFrom=22:00&setbackTo=07:00'));
    expect(evening.status).toBe('met');
  });

  it('is saved by the engineer with the version read, refused when stale or from another role, and used by every answer', async () => {
    const settings = {
      onMinutesBeforeSunset: 15,
      offMinutesAfterSunrise: 20,
      setback: { start: '23:30', end: '06:00', reductionPercent: 40 },
    };
    const put = (who: SignedInAgent, version: number, body: object = { settings, version }) =>
      who.agent.put(`/api/projects/${privateId}/exterior-schedule/settings`).set('X-CSRF-Token', who.csrfToken).send(body);
    const saved = await put(engineer, 0);
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ saved: true, version: 1, settings, updatedBy: expect.any(String) });
    const stale = await put(engineer, 0);
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toContain('reload');
    const bad = await put(engineer, 1, { settings: { ...settings, offMinutesAfterSunrise: 500 }, version: 1 });
    expect(bad.status).toBe(400);
    const days = await engineer.agent.get(`/api/projects/${privateId}/exterior-schedule?from=2026-06-21&days=1`);
    const [day] = days.body as Day[];
    expect((Date.parse(day!.off!) - Date.parse(day!.sunrise!)) / 60_000).toBe(20);
    expect(day!.setbackStart).toBe('2026-06-21T23:30:00-07:00');
    expect(parkingSetback(await checksOf()).words).toContain('by 40 %');
    const history = await engineer.agent.get(`/api/projects/${privateId}/history`);
    expect(history.body.entries[0]).toMatchObject({ entity: 'exterior-schedule', action: 'create', after: settings });
  });

  it('is closed to the contractor for writing and to non-members for reading', async () => {
    const demoContractor = await contractor.agent
      .put(`/api/projects/${demoId}/exterior-schedule/settings`)
      .set('X-CSRF-Token', contractor.csrfToken)
      .send({ settings: { onMinutesBeforeSunset: 10, offMinutesAfterSunrise: 10, setback: null }, version: 1 });
    expect(demoContractor.status).toBe(403);
    expect((await contractor.agent.get(`/api/projects/${privateId}/exterior-schedule/settings`)).status).toBe(404);
  });
});
