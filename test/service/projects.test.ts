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
  const engineer = await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id');
  const [project] = await database.db('projects').insert({ name: 'Harbour Annex (engineer only)', created_by: engineer.id }).returning('id');
  privateProjectId = project.id;
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
    expect(response.body.map((project: { name: string }) => project.name).sort()).toEqual(['Alder Bay Library & Makerspace', 'Harbour Annex (engineer only)']);
  });

  it('needs a session', async () => {
    const response = await request(app).get('/api/projects');
    expect(response.status).toBe(401);
  });
});

describe('GET /api/projects/:projectId', () => {
  it('answers 403 to a signed-in user who is not a member', async () => {
    const { agent } = await signIn(app, 'reviewer@alderbay.example');
    const response = await agent.get(`/api/projects/${privateProjectId}`);
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('forbidden');
  });

  it('shows the project to a member and to an administrator', async () => {
    const engineer = await signIn(app, 'engineer@alderbay.example');
    const admin = await signIn(app, 'admin@alderbay.example');
    expect((await engineer.agent.get(`/api/projects/${privateProjectId}`)).body).toMatchObject({ id: privateProjectId, role: 'engineer', state: 'draft' });
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
  it('appears after an evaluation and is cleared by the next design change', async () => {
    const engineer = await signIn(app, 'engineer@alderbay.example');
    const demo = (await engineer.agent.get('/api/projects')).body.find((project: { name: string }) => project.name === 'Alder Bay Library & Makerspace');
    expect(demo.resultSummary).toBeNull();

    const results = await engineer.agent.get(`/api/projects/${demo.id}/results`);
    const listed = (await engineer.agent.get('/api/projects')).body.find((project: { id: string }) => project.id === demo.id);
    expect(listed.resultSummary).toEqual({ complies: results.body.complies, verdict: results.body.verdict, marginPct: results.body.interior.marginPct, dataVersion: results.body.dataVersion });

    const types = (await engineer.agent.get(`/api/projects/${demo.id}/luminaire-types`)).body;
    const type = types.find((candidate: { tag: string }) => candidate.tag === 'A');
    await engineer.agent
      .put(`/api/projects/${demo.id}/luminaire-types/${type.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ tag: type.tag, description: type.description, use: type.use, basis: type.basis, version: type.version, inputWatts: '34' });
    const afterChange = (await engineer.agent.get('/api/projects')).body.find((project: { id: string }) => project.id === demo.id);
    expect(afterChange.resultSummary).toBeNull();
  });
});
