import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type { Express, Response as ExpressResponse } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { ProjectChanges } from '../../service/src/live/project-changes.js';
import { testApp } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

/** The change stream over a real socket: supertest waits for a response's end, which a stream never reaches. */
let database: TestDatabase;
let app: Express;
let server: Server;
let base: string;
let projectId: string;

interface Session {
  cookie: string;
  csrf: string;
}

async function signIn(email: string): Promise<Session> {
  const response = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: inject('demoPassword') }),
  });
  expect(response.status).toBe(200);
  const body = (await response.json()) as { csrfToken: string };
  return {
    cookie: response.headers
      .getSetCookie()
      .map((line) => line.split(';')[0])
      .join('; '),
    csrf: body.csrfToken,
  };
}

async function call(who: Session, method: string, path: string, body?: unknown): Promise<Response> {
  return fetch(`${base}${path}`, {
    method,
    headers: { Cookie: who.cookie, 'X-CSRF-Token': who.csrf, 'Content-Type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

/** Reads a stream's events as they come; `next(name)` waits for the next event of that name. */
function events(response: Response) {
  const reader = response.body!.pipeThrough(new TextDecoderStream()).getReader();
  let buffer = '';
  const seen: { event: string; data: string }[] = [];
  // One read at a time: a read left waiting when a wait gives up keeps its chunk for the next wait.
  let pending: ReturnType<typeof reader.read> | null = null;
  async function next(name: string, withinMs = 10_000): Promise<{ event: string; data: string }> {
    const until = Date.now() + withinMs;
    for (;;) {
      const index = seen.findIndex((entry) => entry.event === name);
      if (index !== -1) return seen.splice(index, 1)[0]!;
      if (Date.now() > until) throw new Error(`no "${name}" event within ${withinMs} ms`);
      pending ??= reader.read();
      const chunk = await Promise.race([pending, new Promise<null>((resolve) => setTimeout(() => resolve(null), until - Date.now()))]);
      if (chunk === null) continue;
      pending = null;
      if (chunk.done) throw new Error('the stream ended');
      buffer += chunk.value;
      let end: number;
      while ((end = buffer.indexOf('\n\n')) !== -1) {
        const block = buffer.slice(0, end);
        buffer = buffer.slice(end + 2);
        const fields = Object.fromEntries(
          block
            .split('\n')
            .filter((line) => !line.startsWith(':'))
            .map((line) => [line.slice(0, line.indexOf(':')), line.slice(line.indexOf(':') + 1).trim()]),
        );
        if (fields['event']) seen.push({ event: fields['event'], data: fields['data'] ?? '' });
      }
    }
  }
  return { next, cancel: () => reader.cancel() };
}

let engineer: Session;
let reviewer: Session;
let contractor: Session;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
  server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  engineer = await signIn('engineer@alderbay.example');
  reviewer = await signIn('reviewer@alderbay.example');
  contractor = await signIn('contractor@alderbay.example');
  const created = await call(engineer, 'POST', '/api/projects', {
    name: 'Harbour Depot',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  projectId = ((await created.json()) as { id: string }).id;
  expect(
    (await call(engineer, 'POST', `/api/projects/${projectId}/members`, { email: 'reviewer@alderbay.example', role: 'reviewer' })).status,
  ).toBeLessThan(300);
});

afterAll(async () => {
  await (app.locals['changes'] as ProjectChanges).close();
  await new Promise((resolve) => server.close(resolve));
  await database.drop();
});

describe('the project change stream', () => {
  it('tells a watching member of each committed write by someone else, with no design data in it', async () => {
    const response = await fetch(`${base}/api/projects/${projectId}/events`, {
      headers: { Cookie: reviewer.cookie, Accept: 'text/event-stream' },
    });
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/event-stream/);
    const stream = events(response);
    await stream.next('ready');

    const type = await call(engineer, 'POST', `/api/projects/${projectId}/luminaire-types`, {
      tag: 'HB',
      inputWatts: '150',
      use: 'general',
    });
    expect(type.status).toBe(201);
    const change = await stream.next('change');
    expect(JSON.parse(change.data)).toEqual({ entity: 'luminaire-type', action: expect.any(String) });

    const space = await call(engineer, 'POST', `/api/projects/${projectId}/spaces`, {
      name: 'Bay 1',
      level: 'Ground',
      spaceType: 'office-enclosed',
      area: '200',
      luminaires: [{ tag: 'HB', count: 1 }],
      windows: [],
    });
    expect(space.status).toBe(201);
    expect(JSON.parse((await stream.next('change')).data).entity).toBe('space');
    await stream.cancel();
    await expect.poll(() => (app.locals['changes'] as ProjectChanges).open).toBe(0);
  });

  it('says nothing of a write that failed', async () => {
    const response = await fetch(`${base}/api/projects/${projectId}/events`, { headers: { Cookie: engineer.cookie } });
    const stream = events(response);
    await stream.next('ready');
    // A space type the edition does not have: refused before anything is written.
    const refused = await call(engineer, 'POST', `/api/projects/${projectId}/spaces`, {
      name: 'Bay 2',
      level: 'Ground',
      spaceType: 'no-such-type',
      area: '200',
      luminaires: [],
      windows: [],
    });
    expect(refused.status).toBe(400);
    await expect(stream.next('change', 1_500)).rejects.toThrow(/no "change" event/);
    // The next good write is the next event.
    expect(
      (await call(engineer, 'POST', `/api/projects/${projectId}/luminaire-types`, { tag: 'LB', inputWatts: '40', use: 'general' })).status,
    ).toBe(201);
    expect(JSON.parse((await stream.next('change')).data).entity).toBe('luminaire-type');
    await stream.cancel();
  });

  it('does not count a client that left while the listener was connecting, and closes the listener after it', async () => {
    const changes = new ProjectChanges(database.url);
    // What Express hands over for a request whose socket has already closed.
    const gone = { destroyed: true, writableEnded: false } as unknown as ExpressResponse;
    await changes.watch(projectId, gone);
    expect(changes.open).toBe(0);
    expect(changes.listening).toBe(false);
    await changes.close();
  });

  it('is for members only', async () => {
    const outsider = await fetch(`${base}/api/projects/${projectId}/events`, { headers: { Cookie: contractor.cookie } });
    expect(outsider.status).toBe(404);
    const nobody = await fetch(`${base}/api/projects/${projectId}/events`);
    expect(nobody.status).toBe(401);
  });
});
