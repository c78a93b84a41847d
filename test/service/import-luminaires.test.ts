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

function write(method: 'post' | 'put', url: string) {
  return engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);
}

async function newProject(name: string): Promise<string> {
  const created = await write('post', '/api/projects').send({ name, edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
  expect(created.status).toBe(201);
  return created.body.id;
}

// Invented schedule and rooms; the space types are rows of IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data.
const types = [
  {
    tag: 'H1',
    description: 'High-bay',
    inputWatts: '151.5',
    use: 'general',
    manufacturer: 'Invented Lighting Co.',
    catalogNumber: 'HB-150',
  },
  { tag: 'X1', description: 'Exit sign', inputWatts: '2', use: 'exempt', exemptReason: 'Exit sign' },
];
const spaces = [
  {
    name: 'Apparatus bay',
    spaceType: 'emergency-vehicle-garage',
    area: '3000',
    luminaires: [
      { tag: 'H1', count: '10' },
      { tag: 'X1', count: '2' },
    ],
  },
  { name: 'Hose store', spaceType: 'storage-room', area: '200', luminaires: [{ tag: 'H1', count: '1' }] },
];

describe('POST /api/projects/:id/spaces/bulk with luminaire types', () => {
  it('creates the types and the spaces that count them in one step, and audits each type as a create', async () => {
    const projectId = await newProject('Station 9');
    const response = await write('post', `/api/projects/${projectId}/spaces/bulk`)
      .set('Idempotency-Key', 'station-9')
      .send({ spaces, luminaireTypes: types });
    expect(response.status).toBe(201);
    expect(response.body.map((space: { name: string }) => space.name)).toEqual(['Apparatus bay', 'Hose store']);
    expect(response.body[0].luminaires).toMatchObject([
      { tag: 'H1', count: '10' },
      { tag: 'X1', count: '2' },
    ]);
    const stored = (await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body;
    expect(stored).toMatchObject([
      { tag: 'H1', inputWatts: '151.5', manufacturer: 'Invented Lighting Co.', catalogNumber: 'HB-150' },
      { tag: 'X1', use: 'exempt', exemptReason: 'Exit sign' },
    ]);
    const audit = await database.db('audit_log').where({ project_id: projectId, entity: 'luminaire-type' }).select('action', 'detail');
    expect(audit.map((entry) => [entry.action, (entry.detail as { name: string }).name]).sort()).toEqual([
      ['create', 'H1'],
      ['create', 'X1'],
    ]);

    // Installed power is the count times the rated input watts (IECC 2021 C405.3.1, from memory): 10 × 151.5 W = 1,515 W.
    const results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(results.interior.spaces.find((space: { name: string }) => space.name === 'Apparatus bay').installedW).toBe('1515');

    // A retry of the same import (same key, same body) returns the spaces and creates nothing twice.
    const retry = await write('post', `/api/projects/${projectId}/spaces/bulk`)
      .set('Idempotency-Key', 'station-9')
      .send({ spaces, luminaireTypes: types });
    expect(retry.status).toBe(201);
    expect(retry.body.map((space: { id: string }) => space.id)).toEqual(response.body.map((space: { id: string }) => space.id));
    expect((await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body).toHaveLength(2);
    // The key covers the whole body: the same spaces with other types are another import.
    const reused = await write('post', `/api/projects/${projectId}/spaces/bulk`)
      .set('Idempotency-Key', 'station-9')
      .send({ spaces, luminaireTypes: [{ ...types[0], inputWatts: '120' }, types[1]] });
    expect(reused.status).toBe(422);
  });

  it('refuses a tag the project already has with a 409 naming it, and imports nothing', async () => {
    const projectId = await newProject('Station 10');
    expect(
      (await write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'H1', inputWatts: '99', use: 'general' })).status,
    ).toBe(201);
    const response = await write('post', `/api/projects/${projectId}/spaces/bulk`).send({ spaces, luminaireTypes: types });
    expect(response.status).toBe(409);
    expect(response.body.error.message).toContain('"H1"');
    expect(response.body.error.details).toEqual([{ path: 'luminaireTypes.0.tag', message: 'Tags are unique within a project.' }]);
    expect((await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body).toEqual([]);
    expect((await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body.map((type: { tag: string }) => type.tag)).toEqual([
      'H1',
    ]);
  });

  it('says which imported type is wrong: a tag twice, exempt lighting without its reason, a count of an undefined tag', async () => {
    const projectId = await newProject('Station 11');
    const twice = await write('post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces,
      luminaireTypes: [types[0], { ...types[0], description: 'Again' }, types[1]],
    });
    expect(twice.status).toBe(400);
    expect(twice.body.error.details.map((detail: { path: string }) => detail.path)).toContain('luminaireTypes.1.tag');

    const noReason = await write('post', `/api/projects/${projectId}/spaces/bulk`).send({
      spaces,
      luminaireTypes: [types[0], { tag: 'X1', inputWatts: '2', use: 'exempt' }],
    });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details).toContainEqual({
      path: 'luminaireTypes.1.exemptReason',
      message: 'Exempt lighting needs the reason it is exempt.',
    });

    const unknownTag = await write('post', `/api/projects/${projectId}/spaces/bulk`).send({ spaces, luminaireTypes: [types[0]] });
    expect(unknownTag.status).toBe(400);
    expect(unknownTag.body.error.details.map((detail: { path: string }) => detail.path)).toContain('spaces.0.luminaires.1.tag');
    expect((await engineer.agent.get(`/api/projects/${projectId}/luminaire-types`)).body).toEqual([]);
  });
});
