import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let contractor: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  contractor = await signIn(app, 'contractor@alderbay.example');
  const created = await write(engineer, 'post', '/api/projects').send({
    name: 'Tidewater Clinic',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  projectId = created.body.id;
  await write(engineer, 'post', `/api/projects/${projectId}/members`).send({ email: 'reviewer@alderbay.example', role: 'reviewer' });
});

afterAll(async () => {
  await database.drop();
});

function write(who: SignedInAgent, method: 'post' | 'put' | 'patch' | 'delete', url: string) {
  return who.agent[method](url).set('X-CSRF-Token', who.csrfToken);
}

interface Entry {
  id: string;
  at: string;
  user: { id: string; name: string } | null;
  action: string;
  entity: string;
  entityId: string | null;
  name: string | null;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
  restorable: boolean;
}

async function history(query = '', who = engineer): Promise<{ entries: Entry[]; more: boolean; people: { id: string; name: string }[] }> {
  const response = await who.agent.get(`/api/projects/${projectId}/history${query}`);
  expect(response.status).toBe(200);
  return response.body;
}

const exam = {
  name: 'Exam 1',
  level: 'Level 1',
  spaceType: 'office-enclosed',
  area: '120',
  luminaires: [{ tag: 'A', count: 3 }],
  windows: [],
};

describe('the audit trail', () => {
  let spaceId: string;

  it('records every design write with who, when, and the values before and after', async () => {
    const type = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'A',
      inputWatts: '30',
      use: 'general',
    });
    const space = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send(exam);
    spaceId = space.body.id;
    const updated = await write(engineer, 'put', `/api/projects/${projectId}/spaces/${spaceId}`).send({ ...exam, area: '150', version: 1 });
    expect(updated.status).toBe(200);
    await write(engineer, 'put', `/api/projects/${projectId}/luminaire-types/${type.body.id}`).send({
      tag: 'A',
      inputWatts: '28',
      use: 'general',
      version: 1,
    });
    const exterior = await write(engineer, 'post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'parking-lots-and-drives',
      quantity: '4000',
      installedWatts: '150',
    });
    await write(engineer, 'delete', `/api/projects/${projectId}/exterior-applications/${exterior.body.id}?version=1`);

    const { entries } = await history();
    expect(entries.map((entry) => `${entry.action} ${entry.entity}`).slice(0, 6)).toEqual([
      'delete exterior-application',
      'create exterior-application',
      'update luminaire-type',
      'update space',
      'create space',
      'create luminaire-type',
    ]);
    const spaceUpdate = entries.find((entry) => entry.action === 'update' && entry.entity === 'space')!;
    expect(spaceUpdate).toMatchObject({ user: { id: engineer.user.id, name: 'Ines Halvorsen' }, entityId: spaceId, name: 'Exam 1' });
    expect(spaceUpdate.before).toMatchObject({ area: '120', version: 1 });
    expect(spaceUpdate.after).toMatchObject({ area: '150', version: 2 });
    expect(entries.find((entry) => entry.action === 'update' && entry.entity === 'luminaire-type')).toMatchObject({
      before: { inputWatts: '30' },
      after: { inputWatts: '28' },
    });
    expect(entries[0]).toMatchObject({ restorable: true, before: { key: 'parking-lots-and-drives', quantity: '4000' } });
  });

  it('records set-up, unit and team changes too', async () => {
    const detail = (await engineer.agent.get(`/api/projects/${projectId}`)).body;
    await write(engineer, 'patch', `/api/projects/${projectId}`).send({ version: detail.version, jurisdiction: 'Tidewater County' });
    await write(engineer, 'patch', `/api/projects/${projectId}`).send({ version: detail.version + 1, units: 'si' });
    await write(engineer, 'post', `/api/projects/${projectId}/members`).send({ email: 'contractor@alderbay.example', role: 'contractor' });
    const { entries } = await history();
    expect(entries[0]).toMatchObject({
      action: 'add-member',
      entity: 'project_member',
      name: 'contractor@alderbay.example',
      after: { role: 'contractor' },
    });
    expect(entries[1]).toMatchObject({ action: 'convert-units', entity: 'project', before: { units: 'ip' }, after: { units: 'si' } });
    expect(entries[2]).toMatchObject({
      action: 'update',
      entity: 'project',
      before: { jurisdiction: null },
      after: { jurisdiction: 'Tidewater County' },
    });
  });

  it('names the project a copy was made from', async () => {
    const copied = await write(reviewer, 'post', `/api/projects/${projectId}/copy`).send({ name: 'Tidewater Clinic, option B' });
    expect(copied.status).toBe(201);
    const response = await reviewer.agent.get(`/api/projects/${copied.body.id}/history`);
    expect(response.body.entries).toEqual([
      expect.objectContaining({
        action: 'copy',
        entity: 'project',
        name: 'Tidewater Clinic, option B',
        copiedFrom: { id: projectId, name: 'Tidewater Clinic' },
      }),
    ]);
  });

  it('writes nothing for a write that was refused', async () => {
    const count = async () =>
      Number((await database.db('audit_log').where({ project_id: projectId }).count<{ count: string }[]>('* as count'))[0]!.count);
    const before = await count();
    const stale = await write(engineer, 'put', `/api/projects/${projectId}/spaces/${spaceId}`).send({ ...exam, version: 1 });
    expect(stale.status).toBe(409);
    const unknownTag = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      ...exam,
      luminaires: [{ tag: 'Z', count: 1 }],
    });
    expect(unknownTag.status).toBe(400);
    expect(await count()).toBe(before);
  });

  it('filters by space, by person and by date, newest first, a page at a time', async () => {
    const forSpace = await history(`?spaceId=${spaceId}`);
    expect(forSpace.entries.map((entry) => entry.action)).toEqual(['update', 'create']);
    expect(forSpace.entries.every((entry) => entry.entityId === spaceId)).toBe(true);
    const byEngineer = await history(`?userId=${engineer.user.id}`);
    expect(byEngineer.entries.length).toBeGreaterThan(5);
    expect((await history(`?userId=${reviewer.user.id}`)).entries).toEqual([]);
    expect((await history('?since=2999-01-01')).entries).toEqual([]);
    expect((await history('?since=2020-01-01')).entries.length).toBe(byEngineer.entries.length);
    const first = await history('?limit=2');
    expect(first.entries).toHaveLength(2);
    expect(first.more).toBe(true);
    const second = await history(`?limit=2&before=${first.entries[1]!.id}`);
    expect(Number(second.entries[0]!.id)).toBeLessThan(Number(first.entries[1]!.id));
    expect(first.people.map((person) => person.name)).toContain('Ines Halvorsen');
  });

  it('lets every member read it, and no one else; bad filters are a 400', async () => {
    expect((await reviewer.agent.get(`/api/projects/${projectId}/history`)).status).toBe(200);
    expect((await engineer.agent.get(`/api/projects/${projectId}/history?spaceId=nope`)).status).toBe(400);
    expect((await engineer.agent.get(`/api/projects/${projectId}/history?since=yesterday`)).status).toBe(400);
    const stranger = await signIn(app, 'admin@alderbay.example');
    expect((await stranger.agent.get(`/api/projects/${projectId}/history`)).status).toBe(200);
    const outsider = await write(engineer, 'post', '/api/projects').send({
      name: 'Other',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
    });
    expect((await reviewer.agent.get(`/api/projects/${outsider.body.id}/history`)).status).toBe(404);
  });
});

describe('restoring what was deleted', () => {
  it('brings a deleted space back with its id, values and children, once', async () => {
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({
      ...exam,
      name: 'Exam 2',
      area: '12',
      length: '4',
      width: '3',
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', autoOn: 'manual', device: 'Wall sensor' }],
      windows: [{ width: '1.5', headHeight: '2.2', wall: 'east' }],
    });
    expect(created.status).toBe(201);
    const position = created.body.position;
    expect((await write(engineer, 'delete', `/api/projects/${projectId}/spaces/${created.body.id}?version=1`)).status).toBe(204);
    expect((await history(`?spaceId=${created.body.id}`)).entries[0]).toMatchObject({ action: 'delete', restorable: true });

    expect((await write(reviewer, 'post', `/api/projects/${projectId}/spaces/${created.body.id}/restore`)).status).toBe(403);
    const restored = await write(engineer, 'post', `/api/projects/${projectId}/spaces/${created.body.id}/restore`);
    expect(restored.status).toBe(201);
    expect(restored.body).toMatchObject({ id: created.body.id, position, name: 'Exam 2', area: '12', version: 1 });
    expect(restored.body.controls).toEqual(created.body.controls);
    expect(restored.body.windows).toEqual(created.body.windows);
    expect(restored.body.luminaires.map((group: { tag: string; count: string }) => [group.tag, group.count])).toEqual([['A', '3']]);

    const after = (await history(`?spaceId=${created.body.id}`)).entries;
    expect(after.map((entry) => entry.action)).toEqual(['restore', 'delete', 'create']);
    expect(after[1]!.restorable).toBe(false);
    expect((await write(engineer, 'post', `/api/projects/${projectId}/spaces/${created.body.id}/restore`)).status).toBe(404);
  });

  it('refuses to bring back a luminaire type whose tag has been taken since', async () => {
    const type = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({
      tag: 'Q',
      inputWatts: '12',
      use: 'general',
    });
    await write(engineer, 'delete', `/api/projects/${projectId}/luminaire-types/${type.body.id}?version=1`);
    await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'Q', inputWatts: '14', use: 'general' });
    const restored = await write(engineer, 'post', `/api/projects/${projectId}/luminaire-types/${type.body.id}/restore`);
    expect(restored.status).toBe(409);
    expect(restored.body.error.message).toContain('"Q"');
  });

  it('refuses a delete older than 30 days', async () => {
    const created = await write(engineer, 'post', `/api/projects/${projectId}/spaces`).send({ ...exam, name: 'Old room' });
    await write(engineer, 'delete', `/api/projects/${projectId}/spaces/${created.body.id}?version=1`);
    await database
      .db('audit_log')
      .where({ entity_id: created.body.id, action: 'delete' })
      .update({ at: database.db.raw("now() - interval '31 days'") });
    expect((await history(`?spaceId=${created.body.id}`)).entries[0]!.restorable).toBe(false);
    const restored = await write(engineer, 'post', `/api/projects/${projectId}/spaces/${created.body.id}/restore`);
    expect(restored.status).toBe(409);
    expect(restored.body.error.code).toBe('not_restorable');
  });
});

describe('archiving a project', () => {
  it('keeps it out of the list, read-only, until it is brought back', async () => {
    const target = await write(engineer, 'post', '/api/projects').send({
      name: 'Boathouse',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
    });
    const id = target.body.id;
    expect((await write(contractor, 'post', `/api/projects/${id}/archive`)).status).toBe(404);
    const archived = await write(engineer, 'post', `/api/projects/${id}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.archivedAt).toEqual(expect.any(String));
    const names = async (query: string) =>
      (await engineer.agent.get(`/api/projects${query}`)).body.map((project: { name: string }) => project.name);
    expect(await names('')).not.toContain('Boathouse');
    expect(await names('?archived=true')).toEqual(['Boathouse']);
    const refused = await write(engineer, 'post', `/api/projects/${id}/spaces`).send({ ...exam, luminaires: [] });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('archived');
    expect((await write(engineer, 'patch', `/api/projects/${id}`).send({ version: 1, name: 'Boathouse 2' })).status).toBe(409);
    expect((await engineer.agent.get(`/api/projects/${id}`)).status).toBe(200);

    expect((await write(engineer, 'post', `/api/projects/${id}/unarchive`)).status).toBe(200);
    expect(await names('')).toContain('Boathouse');
    expect((await write(engineer, 'post', `/api/projects/${id}/spaces`).send({ ...exam, luminaires: [] })).status).toBe(201);
    const actions = (await engineer.agent.get(`/api/projects/${id}/history`)).body.entries.map((entry: Entry) => entry.action);
    expect(actions.slice(0, 3)).toEqual(['create', 'unarchive', 'archive']);
  });
});
