import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, testApp } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;

beforeAll(async () => {
  database = await freshDatabase();
});

afterAll(async () => {
  await database.drop();
});

describe('API caching', () => {
  it('answers every /api request with Cache-Control: no-store, errors included', async () => {
    const { app } = testApp(database.db, database.url);
    const engineer = await signIn(app, 'engineer@alderbay.example');
    const responses = [
      await request(app).get('/api/health'),
      await request(app).get('/api/auth/me'),
      await request(app).post('/api/auth/login').send({ email: 'engineer@alderbay.example', password: 'not-the-password' }),
      await engineer.agent.get('/api/auth/me'),
      await engineer.agent.get('/api/projects'),
      await engineer.agent.get('/api/no-such-route'),
    ];
    expect(responses.map((response) => response.status)).toEqual([200, 401, 401, 200, 200, 404]);
    expect(responses.map((response) => response.headers['cache-control'])).toEqual(Array(responses.length).fill('no-store'));
  });
});

describe('Permissions-Policy', () => {
  it('denies the device and payment features the app never uses', async () => {
    const { app } = testApp(database.db, database.url);
    const policy = (await request(app).get('/api/health')).headers['permissions-policy'];
    for (const feature of ['camera', 'microphone', 'geolocation', 'payment', 'usb', 'serial', 'hid', 'display-capture']) {
      expect(policy, feature).toMatch(new RegExp(`(^|, )${feature}=\\(\\)(,|$)`));
    }
  });
});

describe('Strict-Transport-Security', () => {
  it('is not sent over plain http', async () => {
    const { app } = testApp(database.db, database.url);
    expect((await request(app).get('/api/health')).headers['strict-transport-security']).toBeUndefined();
  });

  it('is not sent when an untrusted client merely claims https', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app).get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(response.headers['strict-transport-security']).toBeUndefined();
  });

  it('is sent when a trusted proxy says the request came over https', async () => {
    const { app } = testApp(database.db, database.url, { TRUST_PROXY: 'loopback' });
    const response = await request(app).get('/api/health').set('X-Forwarded-Proto', 'https');
    // helmet's default policy: a year, subdomains included.
    expect(response.headers['strict-transport-security']).toBe('max-age=31536000; includeSubDomains');
  });
});
