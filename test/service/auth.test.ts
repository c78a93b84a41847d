import { randomUUID } from 'node:crypto';
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

/** The `name=value` pair a browser would send back. */
function cookiePair(response: request.Response): string {
  const cookie = sessionCookieOf(response);
  if (!cookie) throw new Error(`no session cookie in ${response.status} ${JSON.stringify(response.body)}`);
  return cookie.split(';')[0]!;
}

function claimsOf(response: request.Response): { sub: string; jti: string; csrf: string; exp: number } {
  return jwt.decode(cookiePair(response).slice('allowlight_session='.length)) as { sub: string; jti: string; csrf: string; exp: number };
}

const demoSignIn = (email = 'engineer@alderbay.example') => ({ email, password: inject('demoPassword') });
const wrongSignIn = (email = 'engineer@alderbay.example') => ({ email, password: 'not-the-password' });

describe('POST /api/auth/login', () => {
  it('signs in a demo user and sets an httpOnly, SameSite=Lax session cookie with an expiry', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app)
      .post('/api/auth/login')
      .send({ email: 'engineer@alderbay.example', password: inject('demoPassword') });

    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({
      email: 'engineer@alderbay.example',
      name: 'Ines Halvorsen',
      isAdmin: false,
      roles: ['engineer'],
    });
    expect(response.body.user).not.toHaveProperty('password_hash');
    expect(typeof response.body.csrfToken).toBe('string');
    const cookie = sessionCookieOf(response);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Expires=/i);
  });

  it('accepts the e-mail in any letter case', async () => {
    const { app } = testApp(database.db, database.url);
    const response = await request(app)
      .post('/api/auth/login')
      .send({ email: 'Engineer@AlderBay.example', password: inject('demoPassword') });
    expect(response.status).toBe(200);
  });

  it('gives the same generic error for a wrong password and for an unknown user', async () => {
    const { app } = testApp(database.db, database.url);
    const wrongPassword = await request(app)
      .post('/api/auth/login')
      .send({ email: 'engineer@alderbay.example', password: 'not-the-password' });
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

  it('marks the cookie Secure unless the service is told otherwise', async () => {
    const { app } = testApp(database.db, database.url, { COOKIE_SECURE: undefined });
    const response = await request(app).post('/api/auth/login').send(demoSignIn());
    expect(response.status).toBe(200);
    expect(sessionCookieOf(response)).toMatch(/;\s*Secure/i);
  });

  it('stores a session for the sign-in: the token names it, with the browser and address it came from', async () => {
    const { app } = testApp(database.db, database.url);
    const longAgent = `Tester/1.0 ${'x'.repeat(600)}`;
    const response = await request(app).post('/api/auth/login').set('User-Agent', longAgent).send(demoSignIn());
    const claims = claimsOf(response);
    const row = (await database.db('sessions').where({ id: claims.jti }).first())!;

    expect(row.user_id).toBe(claims.sub);
    expect(row.revoked_at).toBeNull();
    expect(row.user_agent).toBe(longAgent.slice(0, 512));
    expect(row.address).toBe('127.0.0.1');
    expect(Math.floor(row.expires_at.getTime() / 1000)).toBe(claims.exp);
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

describe('sign-in limits', () => {
  const statusesOf = async (attempts: (() => request.Test)[]) => {
    const statuses: number[] = [];
    for (const attempt of attempts) statuses.push((await attempt()).status);
    return statuses;
  };

  it('counts by the connecting address, so a client that invents X-Forwarded-For values is still stopped', async () => {
    const { app } = testApp(database.db, database.url, { LOGIN_RATE_LIMIT: '3' });
    // Addresses from the documentation range (RFC 5737, TEST-NET-3).
    const attempts = [1, 2, 3, 4, 5].map(
      (host) => () => request(app).post('/api/auth/login').set('X-Forwarded-For', `203.0.113.${host}`).send(wrongSignIn()),
    );
    expect(await statusesOf(attempts)).toEqual([401, 401, 401, 429, 429]);
  });

  it('believes X-Forwarded-For from a proxy named in TRUST_PROXY, and counts each forwarded client apart', async () => {
    const { app } = testApp(database.db, database.url, { LOGIN_RATE_LIMIT: '2', TRUST_PROXY: 'loopback' });
    const from = (address: string) => () => request(app).post('/api/auth/login').set('X-Forwarded-For', address).send(wrongSignIn());
    // Documentation addresses (RFC 5737, TEST-NET-3).
    expect(await statusesOf([from('203.0.113.7'), from('203.0.113.7'), from('203.0.113.7'), from('203.0.113.8')])).toEqual([
      401, 401, 429, 401,
    ]);
  });

  it('stops guesses at one account whatever the letter case, in the one error shape, while others still sign in', async () => {
    const { app } = testApp(database.db, database.url, { LOGIN_ACCOUNT_RATE_LIMIT: '2' });
    const attempts = [
      () => request(app).post('/api/auth/login').send(wrongSignIn('engineer@alderbay.example')),
      () => request(app).post('/api/auth/login').send(wrongSignIn('ENGINEER@alderbay.example')),
      () => request(app).post('/api/auth/login').send(demoSignIn('Engineer@AlderBay.example')),
    ];
    expect(await statusesOf(attempts)).toEqual([401, 401, 429]);
    const limited = await request(app).post('/api/auth/login').send(demoSignIn());
    expect(limited.body).toEqual({ error: { code: 'rate_limited', message: expect.any(String) } });
    expect((await request(app).post('/api/auth/login').send(demoSignIn('reviewer@alderbay.example'))).status).toBe(200);
  });

  it('does not count successful sign-ins against either limit', async () => {
    const { app } = testApp(database.db, database.url, { LOGIN_RATE_LIMIT: '2', LOGIN_ACCOUNT_RATE_LIMIT: '2' });
    const successes = Array.from({ length: 6 }, () => () => request(app).post('/api/auth/login').send(demoSignIn()));
    expect(await statusesOf(successes)).toEqual([200, 200, 200, 200, 200, 200]);
    const failures = Array.from({ length: 3 }, () => () => request(app).post('/api/auth/login').send(wrongSignIn()));
    expect(await statusesOf(failures)).toEqual([401, 401, 429]);
  });
});

describe('sign-in audit', () => {
  it('records a wrong password with the e-mail tried and the address, never the password', async () => {
    const { app } = testApp(database.db, database.url);
    const user = (await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id'))!;
    await request(app).post('/api/auth/login').send({ email: 'Engineer@AlderBay.example', password: 'a-guess-to-find' });
    const row = (await database.db('audit_log').where({ action: 'sign-in-failed' }).orderBy('id', 'desc').first())!;

    expect(row).toMatchObject({ user_id: user.id, entity: 'user', entity_id: user.id });
    expect(row.detail).toEqual({ email: 'Engineer@AlderBay.example', address: '127.0.0.1', reason: 'wrong-password' });
    expect(JSON.stringify(row)).not.toContain('a-guess-to-find');
  });

  it('records an unknown e-mail without a user', async () => {
    const { app } = testApp(database.db, database.url);
    await request(app).post('/api/auth/login').send({ email: 'nobody@alderbay.example', password: 'a-guess-to-find' });
    const row = await database.db('audit_log').where({ action: 'sign-in-failed' }).orderBy('id', 'desc').first();
    expect(row).toMatchObject({
      user_id: null,
      entity_id: null,
      detail: { email: 'nobody@alderbay.example', address: '127.0.0.1', reason: 'unknown-email' },
    });
  });

  it('records the sign-in and the sign-out against the session', async () => {
    const { app } = testApp(database.db, database.url);
    const login = await request(app).post('/api/auth/login').send(demoSignIn());
    const { sub, jti } = claimsOf(login);
    await request(app).post('/api/auth/logout').set('Cookie', cookiePair(login)).set('X-CSRF-Token', login.body.csrfToken);
    const rows = await database.db('audit_log').where({ entity: 'session', entity_id: jti }).orderBy('id');
    expect(rows.map((row) => [row.action, row.user_id])).toEqual([
      ['sign-in', sub],
      ['sign-out', sub],
    ]);
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
    const user = (await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id'))!;
    const expired = jwt.sign({ csrf: 'x', exp: Math.floor(Date.now() / 1000) - 60 }, config.JWT_SECRET, {
      subject: user.id,
      issuer: 'allowlight',
    });
    const response = await request(app).get('/api/auth/me').set('Cookie', `allowlight_session=${expired}`);
    expect(response.status).toBe(401);
  });

  it('touches the session on use at most about once a minute', async () => {
    const { app } = testApp(database.db, database.url);
    const login = await request(app).post('/api/auth/login').send(demoSignIn());
    const { jti } = claimsOf(login);
    const lastSeen = async (): Promise<Date> => (await database.db('sessions').where({ id: jti }).first('last_seen_at'))!.last_seen_at;
    const me = () => request(app).get('/api/auth/me').set('Cookie', cookiePair(login)).expect(200);

    const atSignIn = await lastSeen();
    await me();
    expect(await lastSeen()).toEqual(atSignIn);

    await database
      .db('sessions')
      .where({ id: jti })
      .update({ last_seen_at: database.db.raw("now() - interval '5 minutes'") });
    const stale = await lastSeen();
    await me();
    expect((await lastSeen()).getTime()).toBeGreaterThan(stale.getTime() + 4 * 60_000);
  });

  it('refuses a well-signed token once its session has expired on the server', async () => {
    const { app } = testApp(database.db, database.url);
    const login = await request(app).post('/api/auth/login').send(demoSignIn());
    await database
      .db('sessions')
      .where({ id: claimsOf(login).jti })
      .update({ expires_at: database.db.raw("now() - interval '1 second'") });
    expect((await request(app).get('/api/auth/me').set('Cookie', cookiePair(login))).status).toBe(401);
  });

  it('refuses a token without an expiry or without a session id, even for a live session', async () => {
    const { app, config } = testApp(database.db, database.url);
    const login = await request(app).post('/api/auth/login').send(demoSignIn());
    const { sub, jti, csrf, exp } = claimsOf(login);
    const forge = (payload: object) => `allowlight_session=${jwt.sign(payload, config.JWT_SECRET, { issuer: 'allowlight' })}`;

    expect((await request(app).get('/api/auth/me').set('Cookie', forge({ sub, jti, csrf, exp }))).status).toBe(200);
    expect((await request(app).get('/api/auth/me').set('Cookie', forge({ sub, jti, csrf }))).status).toBe(401);
    expect((await request(app).get('/api/auth/me').set('Cookie', forge({ sub, csrf, exp }))).status).toBe(401);
  });

  it('answers 401, not a database error, for a well-signed token whose subject is not a UUID', async () => {
    const { app, config } = testApp(database.db, database.url);
    for (const claims of [
      { sub: 'admin', jti: randomUUID() },
      { sub: randomUUID(), jti: 'first-session' },
    ]) {
      const token = jwt.sign({ csrf: 'x', jti: claims.jti }, config.JWT_SECRET, {
        subject: claims.sub,
        issuer: 'allowlight',
        expiresIn: 600,
      });
      const response = await request(app).get('/api/auth/me').set('Cookie', `allowlight_session=${token}`);
      expect(response.status).toBe(401);
      expect(response.body.error.code).toBe('unauthorized');
    }
  });

  it('refuses a token signed with another secret', async () => {
    const { app } = testApp(database.db, database.url);
    const user = (await database.db('users').where({ email: 'engineer@alderbay.example' }).first('id'))!;
    const forged = jwt.sign({ csrf: 'x' }, 'another-secret-that-is-long-enough-to-sign', {
      subject: user.id,
      issuer: 'allowlight',
      expiresIn: 600,
    });
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

  it('revokes the session on the server, so a copy of the cookie kept from before is refused', async () => {
    const { app } = testApp(database.db, database.url);
    const login = await request(app).post('/api/auth/login').send(demoSignIn());
    const kept = cookiePair(login);
    expect((await request(app).get('/api/auth/me').set('Cookie', kept)).status).toBe(200);

    expect((await request(app).post('/api/auth/logout').set('Cookie', kept).set('X-CSRF-Token', login.body.csrfToken)).status).toBe(204);

    const replayed = await request(app).get('/api/projects').set('Cookie', kept);
    expect(replayed.status).toBe(401);
    expect(replayed.body.error.code).toBe('unauthorized');
    const row = (await database
      .db('sessions')
      .where({ id: claimsOf(login).jti })
      .first('revoked_at'))!;
    expect(row.revoked_at).toBeInstanceOf(Date);
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
