import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { testApp } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;

beforeAll(async () => {
  database = await freshDatabase();
});

afterAll(async () => {
  await database.drop();
});

function sessionCookieOf(response: request.Response): string | undefined {
  const cookies = response.headers['set-cookie'] as unknown as string[] | undefined;
  return cookies?.find((cookie) => cookie.startsWith('allowlight_session='));
}

describe('POST /api/auth/login', () => {
  it('signs in a demo user and sets an httpOnly, SameSite=Lax session cookie with an expiry', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app).post('/api/auth/login').send({ email: 'engineer@alderbay.example', password: inject('demoPassword') });

    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({ email: 'engineer@alderbay.example', name: 'Ines Halvorsen', isAdmin: false, roles: ['engineer'] });
    expect(response.body.user).not.toHaveProperty('password_hash');
    expect(typeof response.body.csrfToken).toBe('string');
    const cookie = sessionCookieOf(response);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Expires=/i);
  });

  it('accepts the e-mail in any letter case', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app).post('/api/auth/login').send({ email: 'Engineer@AlderBay.example', password: inject('demoPassword') });
    expect(response.status).toBe(200);
  });

  it('gives the same generic error for a wrong password and for an unknown user', async () => {
    const { app } = testApp(database.db, database.url);
    const wrongPassword = await request(app).post('/api/auth/login').send({ email: 'engineer@alderbay.example', password: 'not-the-password' });
    const unknownUser = await request(app).post('/api/auth/login').send({ email: 'nobody@alderbay.example', password: 'not-the-password' });

    expect(wrongPassword.status).toBe(401);
    expect(unknownUser.status).toBe(401);
    expect(wrongPassword.body).toEqual(unknownUser.body);
    expect(wrongPassword.body.error.code).toBe('invalid_credentials');
    expect(sessionCookieOf(wrongPassword)).toBeUndefined();
  });

  it('rejects a malformed body with the path of each problem', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app).post('/api/auth/login').send({ email: 'not-an-email' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(response.body.error.details.map((detail: { path: string }) => detail.path).sort()).toEqual(['email', 'password']);
  });

  it('limits the rate of sign-in attempts', async () => {
    const { app } = testApp(database.db, database.url, { LOGIN_RATE_LIMIT: '3' });
    const attempt = () => request(app).post('/api/auth/login').send({ email: 'engineer@alderbay.example', password: 'guess' });
    const statuses = [];
    for (let index = 0; index < 4; index += 1) {
      statuses.push((await attempt()).status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    const limited = await attempt();
    expect(limited.body.error.code).toBe('rate_limited');
  });
});

describe('GET /api/auth/me', () => {
  it('returns the user and the CSRF token of a signed-in session', async () => {
    const { app } = testApp(database.db, database.url);
    const agent = request.agent(app);
    const login = await agent.post('/api/auth/login').send({ email: 'reviewer@alderbay.example', password: inject('demoPassword') });
    const me = await agent.get('/api/auth/me');

    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('reviewer@alderbay.example');
    expect(me.body.csrfToken).toBe(login.body.csrfToken);
  });

  it('answers 401 in the error shape without a cookie', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app).get('/api/auth/me');
    expect(response.status).toBe(401);
    expect(response.body).toEqual({ error: { code: 'unauthorized', message: expect.any(String) } });
  });

  it('refuses an expired token', async () => {
    const { app, config } = testApp(database.db, database.url);
    const user = await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id');
    const expired = jwt.sign({ csrf: 'x', exp: Math.floor(Date.now() / 1000) - 60 }, config.JWT_SECRET, { subject: user.id, issuer: 'allowlight' });
    const response = await request(app).get('/api/auth/me').set('Cookie', `allowlight_session=${expired}`);
    expect(response.status).toBe(401);
  });

  it('refuses a token signed with another secret', async () => {
    const { app } = testApp(database.db, database.url);
    const user = await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id');
    const forged = jwt.sign({ csrf: 'x' }, 'another-secret-that-is-long-enough-to-sign', { subject: user.id, issuer: 'allowlight', expiresIn: 600 });
    const response = await request(app).get('/api/auth/me').set('Cookie', `allowlight_session=${forged}`);
    expect(response.status).toBe(401);
  });
});

describe('POST /api/auth/logout', () => {
  it('needs the CSRF header, then clears the cookie so the session ends', async () => {
    const { app } = testApp(database.db, database.url);
    const agent = request.agent(app);
    const login = await agent.post('/api/auth/login').send({ email: 'engineer@alderbay.example', password: inject('demoPassword') });

    const withoutHeader = await agent.post('/api/auth/logout');
    expect(withoutHeader.status).toBe(403);
    expect(withoutHeader.body.error.code).toBe('csrf_failed');

    const logout = await agent.post('/api/auth/logout').set('X-CSRF-Token', login.body.csrfToken);
    expect(logout.status).toBe(204);
    expect(sessionCookieOf(logout)).toMatch(/allowlight_session=;/);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});

describe('GET /api/health', () => {
  it('is open without sign-in and reports the database', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app).get('/api/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: 'ok', db: 'up' });
  });
});
