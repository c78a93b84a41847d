import { gzipSync } from 'node:zlib';
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDatabase } from '../../service/src/db/database.js';
import { freePort } from '../../service/ops/postgres.mjs';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let engineer: SignedInAgent;
let projectId: string;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  engineer = await signIn(app, 'engineer@alderbay.example');
  const created = await write('post', '/api/projects').send({
    name: 'Bad requests',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  projectId = created.body.id;
  expect(
    (await write('post', `/api/projects/${projectId}/spaces`).send({ name: 'Lobby', spaceType: 'lobby-otherwise', area: '400' })).status,
  ).toBe(201);
});

afterAll(async () => {
  await database.drop();
});

function write(method: 'post' | 'put' | 'patch' | 'delete', url: string) {
  return engineer.agent[method](url).set('X-CSRF-Token', engineer.csrfToken);
}

function expectErrorShape(response: request.Response, status: number): void {
  expect(response.status).toBe(status);
  expect(response.body.error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
  expect(JSON.stringify(response.body)).not.toMatch(/stack|at [A-Za-z]+ \(/);
}

describe('child ids that are not UUIDs', () => {
  it('answer 404 on every space, luminaire type, exterior application, claim restore and member route', async () => {
    const base = `/api/projects/${projectId}`;
    const calls = [
      engineer.agent.get(`${base}/spaces/not-a-uuid`),
      write('put', `${base}/spaces/12`).send({ name: 'x', spaceType: 'office-enclosed', area: '1', version: 1 }),
      write('patch', `${base}/spaces/12`).send({ version: 1 }),
      write('delete', `${base}/spaces/12?version=1`),
      write('post', `${base}/spaces/12/restore`),
      write('put', `${base}/luminaire-types/x`).send({ tag: 'A', inputWatts: '1', use: 'general', version: 1 }),
      write('delete', `${base}/luminaire-types/x?version=1`),
      write('put', `${base}/exterior-applications/x`).send({
        key: 'parking-lots-and-drives',
        quantity: '1',
        installedWatts: '1',
        version: 1,
      }),
      write('delete', `${base}/exterior-applications/x?version=1`),
      write('post', `${base}/additional-allowances/x/restore`),
      write('delete', `${base}/members/not-a-user`),
    ];
    for (const response of await Promise.all(calls)) expectErrorShape(response, 404);
  });
});

describe('bodies the parser cannot read', () => {
  it('answers a body in ISO-8859-1 with 415', async () => {
    const response = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json; charset=iso-8859-1')
      .send('{"name":"Caf\u00e9"}');
    expectErrorShape(response, 415);
  });

  it('answers a broken gzip body with 400 and an unknown encoding with 415', async () => {
    const broken = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send('this is not gzip');
    expectErrorShape(broken, 400);
    const compress = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'compress')
      .send('{}');
    expectErrorShape(compress, 415);
  });

  it('still reads a well-formed gzip body', async () => {
    const body = gzipSync(JSON.stringify({ name: 'Gzipped room', spaceType: 'office-enclosed', area: '120' }));
    // superagent serialises a Buffer under a JSON content type, so this one goes through its raw serializer.
    const response = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .serialize((raw: unknown) => raw as string)
      .send(body as unknown as string);
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ name: 'Gzipped room' });
  });
});

describe('writers racing each other', () => {
  it('ten parallel creates of one luminaire tag: one 201, nine 409', async () => {
    const responses = await Promise.all(
      Array.from({ length: 10 }, () =>
        write('post', `/api/projects/${projectId}/luminaire-types`).send({ tag: 'R1', inputWatts: '20', use: 'general' }),
      ),
    );
    const statuses = responses.map((response) => response.status).sort();
    expect(statuses).toEqual([201, ...Array(9).fill(409)]);
    for (const response of responses.filter((candidate) => candidate.status === 409)) expect(response.body.error.message).toContain('R1');
  });

  it('ten parallel posts of one exterior application: one 201, nine 409, and the project still evaluates', async () => {
    const post = () =>
      write('post', `/api/projects/${projectId}/exterior-applications`).send({
        key: 'parking-lots-and-drives',
        quantity: '1000',
        installedWatts: '40',
      });
    const statuses = (await Promise.all(Array.from({ length: 10 }, post))).map((response) => response.status).sort();
    expect(statuses).toEqual([201, ...Array(9).fill(409)]);
    expect((await engineer.agent.get(`/api/projects/${projectId}/results`)).status).toBe(200);
  });

  it('refuses an exterior application the edition does not have, and the base site allowance', async () => {
    const unknown = await write('post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'moon-base-landing-pad',
      quantity: '1',
      installedWatts: '1',
    });
    expectErrorShape(unknown, 400);
    expect(unknown.body.error.details[0].path).toBe('key');
    expect(JSON.stringify(unknown.body)).not.toContain('moon-base-landing-pad');
    const base = await write('post', `/api/projects/${projectId}/exterior-applications`).send({
      key: 'base-site-allowance',
      quantity: '1',
      installedWatts: '1',
    });
    expectErrorShape(base, 400);
  });

  it('keeps space positions unique and in order under parallel creates and imports', async () => {
    const single = (index: number) =>
      write('post', `/api/projects/${projectId}/spaces`).send({ name: `Parallel ${index}`, spaceType: 'office-enclosed', area: '100' });
    const bulk = (index: number) =>
      write('post', `/api/projects/${projectId}/spaces/bulk`).send({
        spaces: [1, 2, 3].map((n) => ({ name: `Batch ${index}.${n}`, spaceType: 'office-enclosed', area: '100' })),
      });
    const responses = await Promise.all([single(1), bulk(1), single(2), bulk(2), single(3), bulk(3)]);
    expect(responses.map((response) => response.status)).toEqual(Array(6).fill(201));
    const positions = (
      await database
        .db('spaces')
        .where({ project_id: projectId })
        .orderBy('position')
        .select<{ position: number; name: string }[]>('position', 'name')
    ).map((row) => row.position);
    expect(new Set(positions).size).toBe(positions.length);
    // Each import's three rows sit together, in the order they were sent.
    const names = (await engineer.agent.get(`/api/projects/${projectId}/spaces`)).body.map((row: { name: string }) => row.name);
    for (const index of [1, 2, 3]) {
      const first = names.indexOf(`Batch ${index}.1`);
      expect(names.slice(first, first + 3)).toEqual([`Batch ${index}.1`, `Batch ${index}.2`, `Batch ${index}.3`]);
    }
  });
});

describe('while PostgreSQL is unreachable', () => {
  it('answers 503 with Retry-After, not 500', async () => {
    const nowhere = new URL(database.url);
    nowhere.port = String(await freePort());
    const closed = createDatabase(nowhere.toString(), 1);
    try {
      const { app: cut } = testApp(closed, database.url);
      const login = await request(cut).post('/api/auth/login').send({ email: 'engineer@alderbay.example', password: 'whatever-it-is' });
      expectErrorShape(login, 503);
      expect(login.headers['retry-after']).toMatch(/^\d+$/);
      const health = await request(cut).get('/api/health');
      expect(health.status).toBe(503);
    } finally {
      await closed.destroy();
    }
  });
});

describe('numbers in a JSON body', () => {
  it('are read as written, not through a binary float', async () => {
    // 1.0000000000000001 is 1 as a double (IEEE 754 binary64: 53-bit significand); the bounds keep 20 decimal places.
    const area = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json')
      .send('{"name": "Exact room", "spaceType": "office-enclosed", "area": 120.0000000000000001}');
    expect(area.status).toBe(201);
    expect(area.body.area).toBe('120.0000000000000001');
    // 9007199254740993 = 2^53 + 1, which a double rounds to 2^53: the count's range message is about the number sent.
    const count = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json')
      .send('{"name": "Big count", "spaceType": "office-enclosed", "area": 100, "luminaires": [{"tag": "R1", "count": 9007199254740993}]}');
    expect(count.status).toBe(400);
    expect(count.body.error.details[0]).toMatchObject({
      path: 'luminaires.0.count',
      message: expect.stringContaining('whole number from 0 to 1,000,000'),
    });
  });

  it('still refuses a body that is not JSON, and one with a key twice', async () => {
    const broken = await write('post', `/api/projects/${projectId}/spaces`).set('Content-Type', 'application/json').send('{"name": ');
    expectErrorShape(broken, 400);
    expect(broken.body.error.code).toBe('malformed_json');
    const twice = await write('post', `/api/projects/${projectId}/spaces`)
      .set('Content-Type', 'application/json')
      .send('{"name": "A", "name": "B", "spaceType": "office-enclosed", "area": 10}');
    expectErrorShape(twice, 400);
  });
});
