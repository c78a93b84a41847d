import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  const created = await engineer.agent.post('/api/projects').set('X-CSRF-Token', engineer.csrfToken).send({
    name: 'Cedar Row Clinic',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
    timeZone: 'America/Los_Angeles',
    latitude: '47.04',
    longitude: '-122.9',
  });
  expect(created.status).toBe(201);
  projectId = created.body.id;
  const reviewerId = reviewer.user.id;
  await database.db('project_members').insert({ project_id: projectId, user_id: reviewerId, role: 'reviewer' });
});

afterAll(async () => {
  await database.drop();
});

const write = (who: SignedInAgent, method: 'post' | 'put' | 'patch' | 'delete', url: string) =>
  who.agent[method](url).set('X-CSRF-Token', who.csrfToken);

describe('POST /api/projects', () => {
  it('makes the creator the engineer and stores the set-up', async () => {
    const detail = await engineer.agent.get(`/api/projects/${projectId}`);
    expect(detail.body).toMatchObject({
      name: 'Cedar Row Clinic',
      role: 'engineer',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
      lightingZone: 2,
      latitude: '47.04',
      longitude: '-122.9',
      state: 'draft',
    });
    expect(detail.body.members.map((member: { role: string }) => member.role).sort()).toEqual(['engineer', 'reviewer']);
  });

  it('rejects an unknown edition, a bad time zone and an out-of-range latitude with their paths', async () => {
    const response = await write(engineer, 'post', '/api/projects').send({
      name: 'x',
      edition: 'iecc-1999',
      method: 'space-by-space',
      units: 'ip',
      timeZone: 'Mars/Olympus',
      latitude: '91',
    });
    expect(response.status).toBe(400);
    const paths = response.body.error.details.map((detail: { path: string }) => detail.path).sort();
    expect(paths).toEqual(['latitude', 'timeZone']);
    const edition = await write(engineer, 'post', '/api/projects').send({
      name: 'x',
      edition: 'iecc-1999',
      method: 'space-by-space',
      units: 'ip',
    });
    expect(edition.body.error.details).toEqual([{ path: 'edition', message: expect.stringContaining('iecc-2021') }]);
  });
});

describe('design data with optimistic locking', () => {
  let spaceId: string;

  it('lets the engineer add luminaire types and a space with counts, controls and a window', async () => {
    const a = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'A',
      description: '2x4 troffer',
      inputWatts: '32.5',
      use: 'general',
    });
    expect(a.status).toBe(201);
    expect(a.body).toMatchObject({ tag: 'A', inputWatts: '32.5', version: 1, updatedBy: 'Ines Halvorsen' });
    const duplicate = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'A',
      inputWatts: 10,
      use: 'general',
    });
    expect(duplicate.status).toBe(409);

    const space = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Exam 1',
      level: 'Level 1',
      spaceType: 'office-enclosed',
      area: '120',
      length: '12',
      width: '10',
      ceilingHeight: '9',
      luminaires: [{ tag: 'A', count: 2, zone: 'primary-sidelit' }],
      controls: [
        { strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'partial', zoneSize: '120', device: 'Ceiling sensor' },
      ],
      windows: [{ width: '4', headHeight: '7', wall: 'south', offset: '4' }],
    });
    expect(space.status).toBe(201);
    expect(space.body).toMatchObject({
      name: 'Exam 1',
      area: '120',
      version: 1,
      luminaires: [{ tag: 'A', count: '2', zone: 'primary-sidelit' }],
    });
    expect(space.body.windows).toEqual([{ width: '4', headHeight: '7', wall: 'south', offset: '4' }]);
    expect(space.body.controls).toEqual([
      { strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'partial', zoneSize: '120', device: 'Ceiling sensor' },
    ]);
    spaceId = space.body.id;
  });

  it('refuses a tag no luminaire type defines, with its path', async () => {
    const response = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Exam 2',
      spaceType: 'office-enclosed',
      area: 100,
      luminaires: [{ tag: 'Z', count: 1 }],
    });
    expect(response.status).toBe(400);
    expect(response.body.error.details).toEqual([{ path: 'luminaires.0.tag', message: 'No luminaire type has the tag "Z".' }]);
  });

  it('refuses a space type the project’s edition does not have, and a space without the type its method needs', async () => {
    const unknown = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Lab',
      spaceType: 'no-such-type',
      area: 100,
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.details).toEqual([
      { path: 'spaceType', message: 'International Energy Conservation Code 2021 (commercial) has no space type “no-such-type”.' },
    ]);
    const wrongMethod = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces: [
        { name: 'Store', spaceType: 'storage-room', area: 80 },
        { name: 'Whole floor', buildingAreaType: 'office', area: 5000 },
      ],
    });
    expect(wrongMethod.status).toBe(400);
    expect(wrongMethod.body.error.details.map((detail: { path: string }) => detail.path)).toEqual(['spaces.1.spaceType']);
  });

  it('keeps a space’s building area type beside its space type, so switching the method loses nothing', async () => {
    const both = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Records',
      spaceType: 'storage-room',
      buildingAreaType: 'office',
      area: 90,
    });
    expect(both.status).toBe(201);
    expect(both.body).toMatchObject({ spaceType: 'storage-room', buildingAreaType: 'office' });
    const unknownAreaType = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Records',
      spaceType: 'storage-room',
      buildingAreaType: 'spaceport',
      area: 90,
    });
    expect(unknownAreaType.status).toBe(400);
    await write(engineer, 'delete', `/api/projects/${projectId}/spaces/${both.body.id}?version=1`);
  });

  it('answers a stale write with 409 naming who changed it, and loses nothing', async () => {
    const first = await write(engineer, 'patch', `/api/projects/${projectId}/spaces/${spaceId}`).send({ version: 1, area: '115' });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ area: '115', version: 2 });
    expect(first.body.luminaires).toHaveLength(1);

    const stale = await write(engineer, 'patch', `/api/projects/${projectId}/spaces/${spaceId}`).send({ version: 1, area: '110' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect(stale.body.error.message).toContain('Ines Halvorsen');
    const after = await engineer.agent.get(`/api/projects/${projectId}/spaces/${spaceId}`);
    expect(after.body.area).toBe('115');

    const staleDelete = await write(engineer, 'delete', `/api/projects/${projectId}/spaces/${spaceId}?version=1`);
    expect(staleDelete.status).toBe(409);
  });

  it('keeps a luminaire type that spaces still count', async () => {
    const types = await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`);
    const response = await write(
      engineer,
      'delete',
      `/api/projects/${projectId}/luminaire-types/${types.body[0].id}?version=${types.body[0].version}`,
    );
    expect(response.status).toBe(409);
    expect(response.body.error.message).toContain('Exam 1');
  });

  it('lets a reviewer read but not write', async () => {
    expect((await reviewer.agent.get(`/api/projects/${projectId}/spaces`)).status).toBe(200);
    const response = await write(reviewer, 'post', `/api/projects/${projectId}/spaces`).send({
      name: 'Sneaky',
      spaceType: 'office-enclosed',
      area: 10,
    });
    expect(response.status).toBe(403);
    const setup = await write(reviewer, 'patch', `/api/projects/${projectId}`).send({ version: 1, name: 'Renamed' });
    expect(setup.status).toBe(403);
  });

  it('creates imported spaces all together or not at all', async () => {
    const before = (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.length;
    const bad = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces: [
        { name: 'Store 1', spaceType: 'storage-room', area: 80, luminaires: [{ tag: 'A', count: 1 }] },
        { name: 'Store 2', spaceType: 'storage-room', area: -5 },
      ],
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('spaces.1.area');
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.length).toBe(before);

    const good = await write(engineer, 'post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces: [
        { name: 'Store 1', spaceType: 'storage-room', area: 80, luminaires: [{ tag: 'A', count: 1 }] },
        { name: 'Store 2', spaceType: 'storage-room', area: 60 },
      ],
    });
    expect(good.status).toBe(201);
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.length).toBe(before + 2);
  });

  it('returns the stored project as an evaluation document', async () => {
    const document = await engineer.agent.get(`/api/projects/${projectId}/document`);
    expect(document.status).toBe(200);
    expect(document.body).toMatchObject({ edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
    expect(document.body.luminaireTypes).toEqual([
      { tag: 'A', description: '2x4 troffer', inputWatts: '32.5', use: 'general', basis: 'rated' },
    ]);
    const exam = document.body.spaces.find((space: { name: string }) => space.name === 'Exam 1');
    expect(exam).toMatchObject({ id: spaceId, area: '115', luminaires: [{ tag: 'A', count: '2', zone: 'primary-sidelit' }] });
    expect(exam).not.toHaveProperty('version');
    expect(document.body.exterior).toEqual({ lightingZone: '2', applications: [] });
  });

  it('converts every stored length and area when the units change, and back again without loss', async () => {
    await write(engineer, 'post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'parking-lots-and-drives',
      quantity: '1000',
      installedWatts: '30',
    });
    await write(engineer, 'post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'pedestrian-and-vehicular-entrances-and-exits',
      quantity: '12',
      installedWatts: '100',
    });
    const before = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    const detail = await engineer.agent.get(`/api/projects/${projectId}`);
    const toSi = await write(engineer, 'patch', `/api/projects/${projectId}`).send({ version: detail.body.version, units: 'si' });
    expect(toSi.status).toBe(200);
    expect(toSi.body.units).toBe('si');

    // 1 ft = 0.3048 m and 1 ft² = 0.09290304 m² exactly (mathjs units).
    const exam = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${spaceId}`)).body;
    expect(exam).toMatchObject({ area: '10.6838496', length: '3.6576', width: '3.048', ceilingHeight: '2.7432' }); // 115 ft², 12 ft, 10 ft, 9 ft
    expect(exam.windows[0]).toMatchObject({ width: '1.2192', headHeight: '2.1336', offset: '1.2192' }); // 4 ft, 7 ft, 4 ft
    expect(exam.controls[0].zoneSize).toBe('11.1483648'); // 120 ft²
    const exterior = (await engineer.agent.get(`/api/projects/${projectId}/exterior-applications`)).body;
    expect(exterior.map((application: { key: string; quantity: string }) => [application.key, application.quantity])).toEqual([
      ['parking-lots-and-drives', '92.90304'], // 1,000 ft² (priced per ft²)
      ['pedestrian-and-vehicular-entrances-and-exits', '3.6576'], // 12 ft of door width (priced per linear ft)
    ]);

    const after = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(after.units).toBe('si');
    expect(after.complies).toBe(before.complies);
    expect(after.interior.allowanceW).toBe(before.interior.allowanceW);
    expect(after.interior.installedW).toBe(before.interior.installedW);
    expect(after.exterior.allowanceW).toBe(before.exterior.allowanceW);

    const back = await write(engineer, 'patch', `/api/projects/${projectId}`).send({ version: toSi.body.version, units: 'ip' });
    expect(back.status).toBe(200);
    const restored = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${spaceId}`)).body;
    expect(restored).toMatchObject({ area: '115', length: '12', width: '10', ceilingHeight: '9' });
    expect(restored.controls[0].zoneSize).toBe('120');
  });

  it('keeps the units and every value when the set-up write is stale', async () => {
    const detail = await engineer.agent.get(`/api/projects/${projectId}`);
    const stale = await write(engineer, 'patch', `/api/projects/${projectId}`).send({ version: detail.body.version - 1, units: 'si' });
    expect(stale.status).toBe(409);
    const exam = (await engineer.agent.get(`/api/projects/${projectId}/spaces/${spaceId}`)).body;
    expect(exam.area).toBe('115');
    expect((await engineer.agent.get(`/api/projects/${projectId}`)).body.units).toBe('ip');
    const rename = await write(engineer, 'patch', `/api/projects/${projectId}`).send({
      version: detail.body.version,
      name: 'Cedar Row Clinic, phase 1',
    });
    expect(rename.body).toMatchObject({ name: 'Cedar Row Clinic, phase 1', version: detail.body.version + 1 });
  });
});
