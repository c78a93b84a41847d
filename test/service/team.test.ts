import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let admin: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  admin = await signIn(app, 'admin@alderbay.example');
  const created = await engineer.agent
    .post('/api/projects')
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: 'Tidewater Pavilion', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
  projectId = created.body.id;
});

afterAll(async () => {
  await database.drop();
});

const post = (who: SignedInAgent, body: object) =>
  who.agent.post(`/api/projects/${projectId}/members`).set('X-CSRF-Token', who.csrfToken).send(body);

describe('project team', () => {
  it('lets the engineer add a reviewer by e-mail, who then sees the project', async () => {
    expect((await reviewer.agent.get(`/api/projects/${projectId}`)).status).toBe(404);
    const response = await post(engineer, { email: 'Reviewer@AlderBay.example', role: 'reviewer' });
    expect(response.status).toBe(200);
    expect(response.body.map((member: { role: string }) => member.role).sort()).toEqual(['engineer', 'reviewer']);
    expect((await reviewer.agent.get(`/api/projects/${projectId}`)).body.role).toBe('reviewer');
    const audit = (await database.db('audit_log').where({ project_id: projectId, action: 'add-member' }).first())!;
    expect(audit.user_id).toBe(engineer.user.id);
  });

  it('refuses team changes from a reviewer, and adds no one for an address without an account', async () => {
    expect((await post(reviewer, { email: 'contractor@alderbay.example', role: 'contractor' })).status).toBe(403);
    const before = (await engineer.agent.get(`/api/projects/${projectId}/members`)).body;
    const unknown = await post(engineer, { email: 'stranger@elsewhere.example', role: 'contractor' });
    // The answer does not say whether the address has an account: the same status and the team as it is.
    expect(unknown.status).toBe(200);
    expect(unknown.body).toEqual(before);
    expect(JSON.stringify(unknown.body)).not.toMatch(/account/i);
  });

  it('keeps at least one engineer of record', async () => {
    const demote = await post(engineer, { email: 'engineer@alderbay.example', role: 'reviewer' });
    expect(demote.status).toBe(409);
    const remove = await engineer.agent
      .delete(`/api/projects/${projectId}/members/${engineer.user.id}`)
      .set('X-CSRF-Token', engineer.csrfToken);
    expect(remove.status).toBe(409);
  });

  it('lets an administrator change roles and remove members', async () => {
    const changed = await post(admin, { email: 'reviewer@alderbay.example', role: 'contractor' });
    expect(changed.body.find((member: { email: string }) => member.email === 'reviewer@alderbay.example').role).toBe('contractor');
    const removed = await admin.agent.delete(`/api/projects/${projectId}/members/${reviewer.user.id}`).set('X-CSRF-Token', admin.csrfToken);
    expect(removed.status).toBe(200);
    expect((await reviewer.agent.get(`/api/projects/${projectId}`)).status).toBe(404);
  });
});
