import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

/** A window's and a skylight's visible transmittance and "daylight blocked": stored, carried into the document, bounded. */
let database: TestDatabase;
let engineer: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  const created = await write('post', '/api/projects').send({
    name: 'Harbor Studio',
    edition: 'ashrae-90.1-2019',
    method: 'space-by-space',
    units: 'ip',
  });
  expect(created.status).toBe(201);
  projectId = created.body.id;
  const type = await write('post', `/api/projects/${projectId}/luminaire-types`).send({
    tag: 'P',
    description: 'linear pendant',
    inputWatts: '50',
    use: 'general',
  });
  expect(type.status).toBe(201);
});

afterAll(async () => {
  await database.drop();
});

function write(method: 'post' | 'patch', url: string) {
  return engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);
}

/** A 30 × 20 ft open office, 4 × 50 W in its primary sidelit area (200 W, at least 150 W: 90.1-2019 §9.4.1.1(e) [I]). */
const office = {
  name: 'Studio',
  spaceType: 'office-open-plan',
  area: '600',
  length: '30',
  width: '20',
  ceilingHeight: '10',
  luminaires: [{ tag: 'P', count: 4, zone: 'primary-sidelit' }],
};

describe('window and skylight daylight fields', () => {
  let spaceId: string;

  it('stores them, reads them back and carries them into the project document', async () => {
    const created = await write('post', `/api/projects/${projectId}/spaces`).send({
      ...office,
      windows: [{ width: '10', headHeight: '8', sillHeight: '3', wall: 'south', visibleTransmittance: '0.62', daylightBlocked: false }],
      skylights: [{ length: '4', width: '4', visibleTransmittance: 0.5, daylightBlocked: true }],
    });
    expect(created.status).toBe(201);
    expect(created.body.windows).toEqual([
      { width: '10', headHeight: '8', sillHeight: '3', wall: 'south', visibleTransmittance: '0.62', daylightBlocked: false },
    ]);
    expect(created.body.skylights).toEqual([{ length: '4', width: '4', visibleTransmittance: '0.5', daylightBlocked: true }]);
    spaceId = created.body.id;

    const document = await engineer.agent.get(`/api/projects/${projectId}/document`);
    expect(document.body.spaces[0].windows[0]).toMatchObject({ visibleTransmittance: '0.62', daylightBlocked: false });
    expect(document.body.spaces[0].skylights[0]).toMatchObject({ visibleTransmittance: '0.5', daylightBlocked: true });
  });

  it('a blank stays blank, and the results say what it decides', async () => {
    const patched = await write('patch', `/api/projects/${projectId}/spaces/${spaceId}`).send({
      version: 1,
      windows: [{ width: '10', headHeight: '8', sillHeight: '3', wall: 'south' }],
    });
    expect(patched.status).toBe(200);
    expect(patched.body.windows).toEqual([{ width: '10', headHeight: '8', sillHeight: '3', wall: 'south' }]);
    const results = await engineer.agent.get(`/api/projects/${projectId}/results`);
    const sidelighting = results.body.interior.spaces[0].controls.find(
      (line: { strategy: string }) => line.strategy === 'daylight-sidelighting',
    );
    expect(sidelighting.status).toBe('to-verify');
    expect(sidelighting.reason).toContain('whether an adjacent structure blocks the daylight of window 1 (south wall) is not recorded');

    const blocked = await write('patch', `/api/projects/${projectId}/spaces/${spaceId}`).send({
      version: 2,
      windows: [{ width: '10', headHeight: '8', sillHeight: '3', wall: 'south', daylightBlocked: true }],
    });
    expect(blocked.status).toBe(200);
    const after = await engineer.agent.get(`/api/projects/${projectId}/results`);
    const settled = after.body.interior.spaces[0].controls.find((line: { strategy: string }) => line.strategy === 'daylight-sidelighting');
    expect(settled.status).toBe('not-required');
    expect(settled.reason).toContain('blocked by an adjacent structure');
  });

  it('refuses a transmittance outside 0 to 1 with a readable message at its place', async () => {
    const high = await write('patch', `/api/projects/${projectId}/spaces/${spaceId}`).send({
      version: 3,
      windows: [{ width: '10', headHeight: '8', visibleTransmittance: '1.2' }],
    });
    expect(high.status).toBe(400);
    expect(high.body.error.details).toEqual([
      { path: 'windows.0.visibleTransmittance', message: 'Out of range. Enter a number from 0 to 1.' },
    ]);
    const negative = await write('post', `/api/projects/${projectId}/spaces`).send({
      ...office,
      name: 'Other',
      skylights: [{ length: '4', width: '4', visibleTransmittance: '-0.1' }],
    });
    expect(negative.status).toBe(400);
    expect(negative.body.error.details).toEqual([
      { path: 'skylights.0.visibleTransmittance', message: expect.stringContaining('from 0 to 1') },
    ]);
    const notYesNo = await write('patch', `/api/projects/${projectId}/spaces/${spaceId}`).send({
      version: 3,
      windows: [{ width: '10', headHeight: '8', daylightBlocked: 'maybe' }],
    });
    expect(notYesNo.status).toBe(400);
    expect(notYesNo.body.error.details[0].path).toBe('windows.0.daylightBlocked');
  });

  it('the evaluation document refuses a misspelt field by name', async () => {
    const document = await engineer.agent.get(`/api/projects/${projectId}/document`);
    const spelled = structuredClone(document.body);
    spelled.spaces[0].windows[0].visibleTransmitance = '0.5';
    const response = await engineer.agent.post('/api/evaluate').set('X-CSRF-Token', engineer.csrfToken).send(spelled);
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body.error.details)).toContain('Unknown field “visibleTransmitance”: check the spelling.');
  });
});
