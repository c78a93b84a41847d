import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let privateProjectId: string;
let app: ReturnType<typeof testApp>['app'];

beforeAll(async () => {
  database = await freshDatabase();
  app = testApp(database.db, database.url).app;
  const engineer = (await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id'))!;
  const [project] = await database
    .db('projects')
    .insert({ name: 'Harbour Annex (engineer only)', created_by: engineer.id })
    .returning('id');
  privateProjectId = project!.id;
  await database.db('project_members').insert({ project_id: privateProjectId, user_id: engineer.id, role: 'engineer' });
});

afterAll(async () => {
  await database.drop();
});

describe('GET /api/projects', () => {
  it('lists only the projects the user is a member of, with their role', async () => {
    const { agent } = await signIn(app, 'reviewer@alderbay.example');
    const response = await agent.get('/api/projects');
    expect(response.status).toBe(200);
    expect(response.body.map((project: { name: string }) => project.name)).toEqual(['Alder Bay Library & Makerspace']);
    expect(response.body[0].role).toBe('reviewer');
  });

  it('lists every project for an administrator', async () => {
    const { agent } = await signIn(app, 'admin@alderbay.example');
    const response = await agent.get('/api/projects');
    expect(response.body.map((project: { name: string }) => project.name).sort()).toEqual([
      'Alder Bay Library & Makerspace',
      'Harbour Annex (engineer only)',
    ]);
  });

  it('needs a session', async () => {
    const response = await request(app).get('/api/projects');
    expect(response.status).toBe(401);
  });
});

describe('GET /api/projects/:projectId', () => {
  it('answers 404 to a signed-in user who is not a member, as for no such project', async () => {
    const { agent } = await signIn(app, 'reviewer@alderbay.example');
    const response = await agent.get(`/api/projects/${privateProjectId}`);
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('not_found');
  });

  it('shows the project to a member and to an administrator', async () => {
    const engineer = await signIn(app, 'engineer@alderbay.example');
    const admin = await signIn(app, 'admin@alderbay.example');
    expect((await engineer.agent.get(`/api/projects/${privateProjectId}`)).body).toMatchObject({
      id: privateProjectId,
      role: 'engineer',
      state: 'draft',
    });
    expect((await admin.agent.get(`/api/projects/${privateProjectId}`)).status).toBe(200);
  });

  it('answers 404 for a project that does not exist', async () => {
    const { agent } = await signIn(app, 'admin@alderbay.example');
    expect((await agent.get('/api/projects/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await agent.get('/api/projects/not-a-uuid')).status).toBe(404);
  });
});

describe('CSRF protection', () => {
  it('refuses a cookie-authenticated write without the X-CSRF-Token header', async () => {
    const { agent, csrfToken } = await signIn(app, 'engineer@alderbay.example');
    const without = await agent.post('/api/projects').send({});
    expect(without.status).toBe(403);
    expect(without.body.error.code).toBe('csrf_failed');
    const wrong = await agent.post('/api/projects').set('X-CSRF-Token', `${csrfToken}x`).send({});
    expect(wrong.status).toBe(403);
  });
});

describe('unknown API routes', () => {
  it('answer 404 in the error shape', async () => {
    const { agent } = await signIn(app, 'engineer@alderbay.example');
    const response = await agent.get('/api/no-such-thing');
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('not_found');
  });
});

describe('the verdict kept for the project list', () => {
  it('is not written by reading the results, and follows every design change', async () => {
    const engineer = await signIn(app, 'engineer@alderbay.example');
    const listed = async (id: string) =>
      (await engineer.agent.get('/api/projects')).body.find((project: { id: string }) => project.id === id).resultSummary;
    const results = async (id: string) => {
      const { body } = await engineer.agent.get(`/api/projects/${id}/results`).expect(200);
      return { complies: body.complies, verdict: body.verdict, marginPct: body.interior.marginPct, dataVersion: body.dataVersion };
    };
    const demo = (await engineer.agent.get('/api/projects')).body.find(
      (project: { name: string }) => project.name === 'Alder Bay Library & Makerspace',
    );
    expect(demo.resultSummary).toBeNull();

    // Reading the results stores nothing.
    const seeded = await results(demo.id);
    expect(await listed(demo.id)).toBeNull();

    const types = (await engineer.agent.get(`/api/projects/${demo.id}/luminaire-types`)).body;
    const type = types.find((candidate: { tag: string }) => candidate.tag === 'A');
    const putType = async (inputWatts: string, version: number) =>
      (
        await engineer.agent
          .put(`/api/projects/${demo.id}/luminaire-types/${type.id}`)
          .set('X-CSRF-Token', engineer.csrfToken)
          .send({ tag: type.tag, description: type.description, use: type.use, basis: type.basis, version, inputWatts })
          .expect(200)
      ).body.version as number;

    let version = await putType('34', type.version);
    const afterChange = await listed(demo.id);
    expect(afterChange).toEqual(await results(demo.id));
    expect(afterChange.marginPct).not.toBe(seeded.marginPct);

    // Far more watts than any allowance: the list says so without anyone opening the results.
    version = await putType('5000', version);
    expect(await listed(demo.id)).toMatchObject({ complies: false, verdict: 'does-not-comply' });
    expect(await listed(demo.id)).toEqual(await results(demo.id));

    await putType(type.inputWatts, version);
    expect(await listed(demo.id)).toEqual(seeded);

    // A delete and its restore are design changes too.
    const [space] = (await engineer.agent.get(`/api/projects/${demo.id}/spaces`)).body;
    await engineer.agent
      .delete(`/api/projects/${demo.id}/spaces/${space.id}?version=${space.version}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .expect(204);
    expect(await listed(demo.id)).toEqual(await results(demo.id));
    expect(await listed(demo.id)).not.toEqual(seeded);
    await engineer.agent.post(`/api/projects/${demo.id}/spaces/${space.id}/restore`).set('X-CSRF-Token', engineer.csrfToken).expect(201);
    expect(await listed(demo.id)).toEqual(seeded);

    // So is a change of the set-up (here of units, which converts the stored design), and a copy starts with its verdict.
    const detail = (await engineer.agent.get(`/api/projects/${demo.id}`)).body;
    await engineer.agent
      .patch(`/api/projects/${demo.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ version: detail.version, units: detail.units === 'ip' ? 'si' : 'ip' })
      .expect(200);
    expect(await listed(demo.id)).toEqual(await results(demo.id));
    const copy = await engineer.agent
      .post(`/api/projects/${demo.id}/copy`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ name: 'Alder Bay copy for the list' })
      .expect(201);
    expect(await listed(copy.body.id)).toEqual(await results(copy.body.id));
  });
});
