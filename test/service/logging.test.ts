import { Writable } from 'node:stream';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createApp } from '../../service/src/app.js';
import { testConfig } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;

beforeAll(async () => {
  database = await freshDatabase();
});

afterAll(async () => {
  await database.drop();
});

/** The app with its request log going to memory, one parsed JSON object a line. */
function appWithCapturedLog() {
  const lines: Record<string, unknown>[] = [];
  const destination = new Writable({
    write(chunk: Buffer, _encoding, done) {
      for (const line of chunk.toString('utf8').split('\n').filter(Boolean)) lines.push(JSON.parse(line) as Record<string, unknown>);
      done();
    },
  });
  const app = createApp({ db: database.db, config: testConfig(database.url), logger: pino({ level: 'info' }, destination) });
  return { app, lines };
}

interface LoggedRequest {
  req?: { url?: string; headers?: Record<string, string> };
  res?: { statusCode?: number; headers?: Record<string, string> };
}

describe('request log', () => {
  it('keeps session cookies, CSRF tokens and authorization headers out of the lines of a failing request', async () => {
    const { app, lines } = appWithCapturedLog();
    const login = await request(app)
      .post('/api/auth/login')
      .send({ email: 'engineer@alderbay.example', password: inject('demoPassword') });
    const cookie = (login.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
    const token = cookie.slice('allowlight_session='.length);
    const csrf: string = login.body.csrfToken;

    const failing = await request(app)
      .get('/api/projects/not-a-project')
      .set('Cookie', cookie)
      .set('X-CSRF-Token', csrf)
      .set('Authorization', 'Bearer a-bearer-credential');
    expect(failing.status).toBe(404);

    const logged = () => lines as LoggedRequest[];
    await expect.poll(() => logged().find((line) => line.res?.statusCode === 404)).toBeDefined();
    const failedLine = logged().find((line) => line.res?.statusCode === 404)!;
    expect(failedLine.req?.headers).toMatchObject({ cookie: '[Redacted]', 'x-csrf-token': '[Redacted]', authorization: '[Redacted]' });
    const loginLine = logged().find((line) => line.req?.url === '/api/auth/login')!;
    expect(loginLine.res?.headers?.['set-cookie']).toBe('[Redacted]');

    const everything = JSON.stringify(lines);
    expect(everything).not.toContain(token);
    expect(everything).not.toContain(csrf);
    expect(everything).not.toContain('a-bearer-credential');
  });
});
