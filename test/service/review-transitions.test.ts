import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ProjectState } from '../../contract/review.js';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let contractor: SignedInAgent;
let admin: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  const { app } = testApp(database.db, database.url);
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  admin = await signIn(app, 'admin@alderbay.example');
  // An invented project.
  const created = await engineer.agent
    .post('/api/projects')
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: 'Harbour Ferry Terminal', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' });
  projectId = created.body.id;
  for (const [who, role] of [
    ['reviewer@alderbay.example', 'reviewer'],
    ['contractor@alderbay.example', 'contractor'],
  ])
    await engineer.agent
      .post(`/api/projects/${projectId}/members`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ email: who, role })
      .expect(200);
  // A submission freezes the design's evaluation, which needs at least one space.
  await engineer.agent
    .post(`/api/projects/${projectId}/spaces`)
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: 'Waiting room', level: '1', spaceType: 'lobby-otherwise', area: '800' })
    .expect(201);
});

afterAll(async () => {
  await database.drop();
});

async function current(): Promise<{ state: ProjectState; version: number; revision: number }> {
  return database.db('projects').where({ id: projectId }).first('state', 'version', 'revision');
}

async function putInState(state: ProjectState): Promise<void> {
  await database.db('projects').where({ id: projectId }).update({ state });
}

async function move(who: SignedInAgent, to: ProjectState, comment?: string, version?: number) {
  const project = await current();
  return who.agent
    .post(`/api/projects/${projectId}/transitions`)
    .set('X-CSRF-Token', who.csrfToken)
    .send({ to, version: version ?? project.version, ...(comment ? { comment } : {}) });
}

const people = () => ({ engineer, reviewer, contractor });

// The moves of the review loop as the product defines them (issue: Draft → In review → Returned or
// Accepted → Issued; Returned → In review; Accepted/Issued → Draft with a new revision).
const allowed: { from: ProjectState; to: ProjectState; by: 'engineer' | 'reviewer' }[] = [
  { from: 'draft', to: 'in-review', by: 'engineer' },
  { from: 'returned', to: 'in-review', by: 'engineer' },
  { from: 'in-review', to: 'returned', by: 'reviewer' },
  { from: 'in-review', to: 'accepted', by: 'reviewer' },
  { from: 'accepted', to: 'draft', by: 'engineer' },
  { from: 'issued', to: 'draft', by: 'engineer' },
];
const states: ProjectState[] = ['draft', 'in-review', 'returned', 'accepted', 'issued'];

describe('the review state machine', () => {
  it.each(allowed)('lets the $by move a project from $from to $to, and no other role', async ({ from, to, by }) => {
    for (const [name, who] of Object.entries(people())) {
      if (name === by) continue;
      await putInState(from);
      const refused = await move(who, to, 'Checked.');
      expect(refused.status, `${name} moving ${from} → ${to}`).toBe(403);
      expect(refused.body.error.message).toMatch(/^Only /);
      expect((await current()).state).toBe(from);
    }
    await putInState(from);
    const before = await current();
    const done = await move(people()[by], to, 'Checked.');
    expect(done.status).toBe(200);
    expect(done.body.state).toBe(to);
    expect(done.body.version).toBe(before.version + 1);
    expect(done.body.revision).toBe(to === 'draft' ? before.revision + 1 : before.revision);
  });

  it('refuses every other move from each state with 409 and the state as it is', async () => {
    for (const from of states) {
      for (const to of states) {
        if (allowed.some((entry) => entry.from === from && entry.to === to)) continue;
        await putInState(from);
        const refused = await move(admin, to, 'Checked.');
        expect(refused.status, `${from} → ${to}`).toBe(409);
        expect(refused.body.error.details).toContainEqual({ path: 'state', message: from });
        expect(refused.body.error.message).not.toMatch(/in-review|[a-z]+-[a-z]+/);
      }
    }
  });

  it('answers a stale version with 409 and the current state and version', async () => {
    await putInState('draft');
    const { version } = await current();
    const stale = await move(engineer, 'in-review', undefined, version - 1);
    expect(stale.status).toBe(409);
    expect(stale.body.error.details).toEqual([
      { path: 'state', message: 'draft' },
      { path: 'version', message: String(version) },
    ]);
    expect((await current()).state).toBe('draft');
  });

  it('needs a comment to return a design, and keeps it in the history with the move in words', async () => {
    await putInState('in-review');
    expect((await move(reviewer, 'returned')).status).toBe(409);
    expect((await move(reviewer, 'returned', 'Corridor 1 needs its occupant sensors.')).status).toBe(200);
    const history = (await engineer.agent.get(`/api/projects/${projectId}/history`)).body as {
      entries: { action: string; transition?: { words: string; comment?: string } }[];
    };
    const last = history.entries.find((entry) => entry.action === 'transition')!;
    expect(last.transition).toMatchObject({ words: 'Returned to the engineer', comment: 'Corridor 1 needs its occupant sensors.' });
  });

  it('refuses to issue until a final submittal package of the design exists, in words; a draft package does not count', async () => {
    await putInState('accepted');
    const refused = await move(engineer, 'issued');
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/final submittal package/);

    const { revision } = await current();
    const packageRow = (number: number, draft: boolean) => ({
      project_id: projectId,
      number,
      draft,
      project_name: 'Harbour Ferry Terminal',
      design_revision: revision,
      fingerprint: 'a'.repeat(64),
      document: '{}',
      result: '{}',
      files: '[]',
    });
    await database.db('package_revisions').insert(packageRow(1, true));
    expect((await move(engineer, 'issued')).status).toBe(409);
    await database.db('package_revisions').insert(packageRow(2, false));
    const issued = await move(engineer, 'issued');
    expect(issued.status, JSON.stringify(issued.body)).toBe(200);
    expect(issued.body.state).toBe('issued');
  });
});

describe('the design lock', () => {
  const writes = (who: SignedInAgent) => [
    () =>
      who.agent
        .post(`/api/projects/${projectId}/spaces`)
        .set('X-CSRF-Token', who.csrfToken)
        .send({ name: 'Ticket hall', level: '1', spaceType: 'lobby-otherwise', area: '1200' }),
    () =>
      who.agent
        .post(`/api/projects/${projectId}/luminaire-types`)
        .set('X-CSRF-Token', who.csrfToken)
        .send({ tag: 'Z9', inputWatts: '20', use: 'general' }),
  ];

  it('refuses design writes in review, accepted and issued, and takes them in a draft or a returned design', async () => {
    for (const state of states) {
      await putInState(state);
      const editable = state === 'draft' || state === 'returned';
      const project = await current();
      const setup = await engineer.agent
        .patch(`/api/projects/${projectId}`)
        .set('X-CSRF-Token', engineer.csrfToken)
        .send({ version: project.version, jurisdiction: `City of ${state}` });
      expect(setup.status, `set-up in ${state}`).toBe(editable ? 200 : 409);
      for (const write of writes(engineer)) {
        const answer = await write();
        if (editable) {
          expect(answer.status, `${state}: ${answer.text}`).toBe(201);
        } else {
          expect(answer.status, state).toBe(409);
          expect(answer.body.error.code).toBe('locked');
          expect(answer.body.error.message).toMatch(state === 'in-review' ? /in review/ : /reopen it as a draft/);
        }
      }
      if (editable) {
        // Take back what was added so the next state's writes are new again.
        await database.db('spaces').where({ project_id: projectId, name: 'Ticket hall' }).delete();
        await database.db('luminaire_types').where({ project_id: projectId, tag: 'Z9' }).delete();
      }
      // Reads stay open to everyone on the team.
      expect((await reviewer.agent.get(`/api/projects/${projectId}/spaces`)).status).toBe(200);
    }
  });

  it('keeps the team open to change in every state', async () => {
    await putInState('in-review');
    const answer = await engineer.agent
      .post(`/api/projects/${projectId}/members`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ email: 'contractor@alderbay.example', role: 'contractor' });
    expect(answer.status).toBe(200);
  });
});
