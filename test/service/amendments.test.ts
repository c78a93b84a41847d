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

const write = (method: 'post' | 'patch', url: string) => engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);

/** A 150 ft² enclosed office (invented) with one 80 W luminaire (0.53 W/ft²): between Washington's 60 W and 0.45 W/ft² and the model code's 100 W. */
const office = {
  name: 'Office',
  spaceType: 'office-enclosed',
  area: '150',
  enclosed: true,
  luminaires: [{ tag: 'P', count: 1 }],
  controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'manual' }],
};

describe('jurisdiction amendments', () => {
  it('are listed per edition, with their source', async () => {
    const response = await engineer.agent.get('/api/code-editions/iecc-2021/amendments');
    expect(response.status).toBe(200);
    expect(response.body).toEqual([
      expect.objectContaining({
        key: 'washington-2021',
        jurisdiction: 'Washington State',
        parameters: { 'light-reduction': { exemptSingleLuminaireBelowW: '60', exemptLpdBelowWPerFt2: '0.45' } },
      }),
    ]);
    expect((await engineer.agent.get('/api/code-editions/ashrae-90.1-2019/amendments')).body).toEqual([]);
  });

  it('change the values only for a project that chooses them: one 80 W luminaire needs light reduction in Washington, not under the model code', async () => {
    const created = await write('post', '/api/projects').send({
      name: 'Tacoma annex',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
    });
    const projectId = created.body.id;
    expect(created.body.amendments).toEqual([]);
    await write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'P', inputWatts: '80', use: 'general' });
    await write('post', `/api/projects/${projectId}/spaces`).send(office);
    const lightReduction = async () =>
      (await engineer.agent.get(`/api/projects/${projectId}/results`)).body.interior.spaces[0].controls.find(
        (line: { strategy: string }) => line.strategy === 'light-reduction',
      );

    // IECC 2021 C405.2.3 model code exception, from memory: one luminaire of less than 100 W.
    expect((await lightReduction()).status).toBe('not-required');
    const version = (await engineer.agent.get(`/api/projects/${projectId}`)).body.version;
    const chosen = await write('patch', `/api/projects/${projectId}`).send({ version, amendments: ['washington-2021'] });
    expect(chosen.body.amendments).toEqual(['washington-2021']);
    // Washington's 2021 text (WAC 51-11C-405024): the exception is for one luminaire of less than 60 W.
    const amended = await lightReduction();
    expect(amended.requirement).toBe('required');
    const results = (await engineer.agent.get(`/api/projects/${projectId}/results`)).body;
    expect(results.amendments).toEqual([{ key: 'washington-2021', title: expect.stringContaining('Washington') }]);
    expect((await engineer.agent.get(`/api/projects/${projectId}/document`)).body.amendments).toEqual(['washington-2021']);
  });

  it('are each chosen once, at most 10, in the set-up and in a document', async () => {
    const twice = await write('post', '/api/projects').send({
      name: 'Twice',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
      amendments: ['washington-2021', 'washington-2021'],
    });
    expect(twice.status).toBe(400);
    expect(twice.body.error.details).toEqual([{ path: 'amendments.1', message: '“washington-2021” is chosen more than once.' }]);

    const created = await write('post', '/api/projects').send({
      name: 'Many',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
    });
    const eleven = Array.from({ length: 11 }, (_, index) => `amendment-${index}`);
    const tooMany = await write('patch', `/api/projects/${created.body.id}`).send({ version: created.body.version, amendments: eleven });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.details).toEqual([{ path: 'amendments', message: 'At most 10 amendments.' }]);
    const again = await write('patch', `/api/projects/${created.body.id}`).send({
      version: created.body.version,
      amendments: ['washington-2021', 'washington-2021'],
    });
    expect(again.body.error.details).toEqual([{ path: 'amendments.1', message: '“washington-2021” is chosen more than once.' }]);
    expect((await engineer.agent.get(`/api/projects/${created.body.id}`)).body.amendments).toEqual([]);

    const document = {
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
      spaces: [{ id: 's', name: 'Office', spaceType: 'office-enclosed', area: '150' }],
    };
    const evaluated = await write('post', '/api/evaluate').send({ ...document, amendments: ['washington-2021', 'washington-2021'] });
    expect(evaluated.status).toBe(400);
    expect(evaluated.body.error.details).toEqual([{ path: 'amendments.1', message: '“washington-2021” is chosen more than once.' }]);
    expect((await write('post', '/api/evaluate').send({ ...document, amendments: eleven })).body.error.details).toContainEqual({
      path: 'amendments',
      message: 'At most 10 amendments.',
    });
  });

  it('must belong to the project’s edition', async () => {
    const created = await write('post', '/api/projects').send({
      name: 'Elsewhere',
      edition: 'ashrae-90.1-2019',
      method: 'space-by-space',
      units: 'ip',
      amendments: ['washington-2021'],
    });
    expect(created.status).toBe(400);
    expect(created.body.error.details[0].path).toBe('amendments.0');
  });
});
