import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
});

afterAll(async () => {
  await database.drop();
});

function write(who: SignedInAgent, method: 'post' | 'put' | 'patch' | 'delete', url: string) {
  return who.agent[method](url).set('X-CSRF-Token', who.csrfToken);
}

async function newProject(units: 'ip' | 'si', name: string): Promise<string> {
  const created = await write(engineer, 'post', '/api/projects').send({
    name,
    edition: 'iecc-2021',
    method: 'space-by-space',
    units,
    lightingZone: 2,
  });
  expect(created.status).toBe(201);
  return created.body.id;
}

async function projectVersion(projectId: string): Promise<number> {
  return (await engineer.agent.get(`/api/projects/${projectId}`)).body.version;
}

async function changeUnits(projectId: string, units: 'ip' | 'si') {
  const response = await write(engineer, 'patch', `/api/projects/${projectId}`).send({ version: await projectVersion(projectId), units });
  expect(response.status).toBe(200);
  return response;
}

const room = {
  name: 'Plant room',
  spaceType: 'electrical-mechanical-room',
  area: '9.5',
  length: '3',
  width: '3.17',
  ceilingHeight: '2.7',
  controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', zoneSize: '9.5', autoOn: 'manual' }],
  windows: [{ width: '1.2', headHeight: '2.1', sillHeight: '0.9', wall: 'north', offset: '0.4' }],
};

describe('a change of units', () => {
  it('returns SI → IP → SI exactly what was stored', async () => {
    const projectId = await newProject('si', 'Round trip, SI first');
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send(room);
    expect(created.status).toBe(201);
    await changeUnits(projectId, 'ip');
    const inFeet = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${created.body.id}`)).body;
    // 3 m ÷ 0.3048 m/ft = 9.842519… ft, kept to six places (1 ft = 0.3048 m exactly, as mathjs defines it).
    expect(inFeet.length).toBe('9.84252');
    await changeUnits(projectId, 'si');
    const back = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${created.body.id}`)).body;
    expect(back).toMatchObject({ area: '9.5', length: '3', width: '3.17', ceilingHeight: '2.7' });
    expect(back.windows[0]).toMatchObject({ width: '1.2', headHeight: '2.1', sillHeight: '0.9', offset: '0.4' });
    expect(back.controls[0].zoneSize).toBe('9.5');
  });

  it('keeps the exact values through a save in between that changes only other fields, and converts a value that was changed', async () => {
    const projectId = await newProject('si', 'Round trip with an edit');
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send(room);
    await changeUnits(projectId, 'ip');
    const inFeet = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${created.body.id}`)).body;
    // A form saves the whole space back: same (converted) values, a new name and a new ceiling height.
    const { id: _id, position: _position, updatedAt: _at, updatedBy: _by, luminaires: _luminaires, ...fields } = inFeet;
    const saved = await write(engineer, 'put', `/api/projects/${projectId}/spaces/${created.body.id}`).send({
      ...fields,
      name: 'Plant room 2',
      ceilingHeight: '10',
    });
    expect(saved.status).toBe(200);
    await changeUnits(projectId, 'si');
    const back = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${created.body.id}`)).body;
    expect(back).toMatchObject({ name: 'Plant room 2', area: '9.5', length: '3', width: '3.17' });
    expect(back.windows[0]).toMatchObject({ width: '1.2', headHeight: '2.1' });
    // 10 ft × 0.3048 m/ft = 3.048 m: the changed value converts from what was saved.
    expect(back.ceilingHeight).toBe('3.048');
  });

  it('gives every converted row a new version, so a writer still holding the old one gets 409', async () => {
    const projectId = await newProject('ip', 'Stale writer');
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Office',
      spaceType: 'office-enclosed',
      area: '1000',
    });
    const typeWithLength = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'T',
      inputWatts: '100',
      use: 'general',
      basis: 'line-voltage-track',
      length: '8',
    });
    const exterior = await write(engineer, 'post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'parking-lots-and-drives',
      quantity: '5000',
      installedWatts: '200',
    });
    expect(created.body.version).toBe(1);
    await changeUnits(projectId, 'si');
    const stale = await write(engineer, 'put', `/api/projects/${projectId}/spaces/${created.body.id}`).send({
      name: 'Office',
      spaceType: 'office-enclosed',
      area: '1000',
      version: 1,
    });
    expect(stale.status).toBe(409);
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces/${created.body.id}`)).body).toMatchObject({
      version: 2,
      area: '92.90304',
    });
    const types = (await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body;
    expect(types.find((type: { id: string }) => type.id === typeWithLength.body.id).version).toBe(2);
    const applications = (await engineer.agent.get(`/api/projects/${projectId}/exterior-applications`)).body;
    expect(applications.find((application: { id: string }) => application.id === exterior.body.id)).toMatchObject({
      version: 2,
      quantity: '464.5152',
    });
  });

  it('stops, converting nothing, when a value would leave its range in the new unit', async () => {
    const projectId = await newProject('si', 'Too long in feet');
    // 9,000 m is within the length range; 29,527.6 ft is not.
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Runway shed',
      spaceType: 'electrical-mechanical-room',
      area: '90000',
      length: '9000',
      width: '10',
    });
    expect(created.status).toBe(201);
    const response = await write(engineer, 'patch', `/api/projects/${projectId}`).send({
      version: await projectVersion(projectId),
      units: 'ip',
    });
    expect(response.status).toBe(400);
    expect(response.body.error.details[0].message).toContain('spaces');
    expect((await engineer.agent.get(`/api/projects/${projectId}`)).body.units).toBe('si');
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces/${created.body.id}`)).body.length).toBe('9000');
  });
});

describe('the team under parallel changes', () => {
  it('never leaves a project without an engineer: of two engineers removing each other at once, one is refused', async () => {
    const projectId = await newProject('ip', 'Two engineers');
    const admin = await signIn(app, 'admin@alderbay.example');
    const other = await signIn(app, 'reviewer@alderbay.example');
    expect(
      (await write(engineer, 'post', `/api/projects/${projectId}/members`).send({ email: 'reviewer@alderbay.example', role: 'engineer' }))
        .status,
    ).toBe(200);
    const [first, second] = await Promise.all([
      write(engineer, 'delete', `/api/projects/${projectId}/members/${other.user.id}`),
      write(other, 'delete', `/api/projects/${projectId}/members/${engineer.user.id}`),
    ]);
    // The later one is refused either way: 409 when it passed its role check before the first removal committed
    // (removing the last engineer), 403 when it arrives after (its sender is no longer on the team).
    const statuses = [first.status, second.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const members = (await admin.agent.get(`/api/projects/${projectId}/members`)).body as { role: string }[];
    expect(members.filter((member) => member.role === 'engineer')).toHaveLength(1);
  });
});

describe('imports with an idempotency key', () => {
  const spaces = [1, 2, 3].map((index) => ({ name: `Study ${index}`, spaceType: 'office-enclosed', area: '120' }));

  it('imports once however often the same request is retried, even in parallel', async () => {
    const projectId = await newProject('ip', 'Retried import');
    const post = () =>
      write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).set('Idempotency-Key', 'import-7f3a').send({ spaces });
    const [first, second] = await Promise.all([post(), post()]);
    const third = await post();
    for (const response of [first, second, third]) expect(response.status).toBe(201);
    const ids = (response: { body: { id: string }[] }) => response.body.map((space) => space.id);
    expect(ids(second)).toEqual(ids(first));
    expect(ids(third)).toEqual(ids(first));
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body).toHaveLength(3);
  });

  it('refuses the same key for a different import, and imports again under a new key', async () => {
    const projectId = await newProject('ip', 'Reused key');
    expect(
      (await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).set('Idempotency-Key', 'k-1').send({ spaces })).status,
    ).toBe(201);
    const reused = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`)
      .set('Idempotency-Key', 'k-1')
      .send({ spaces: spaces.slice(0, 1) });
    expect(reused.status).toBe(422);
    expect(reused.body.error.code).toBe('idempotency_key_reused');
    expect(
      (await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).set('Idempotency-Key', 'k-2').send({ spaces })).status,
    ).toBe(201);
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body).toHaveLength(6);
    const bad = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`)
      .set('Idempotency-Key', 'has space')
      .send({ spaces });
    expect(bad.status).toBe(400);
  });
});
