import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { signIn, testApp, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;

beforeAll(async () => {
  database = await freshDatabase();
  ({ app } = testApp(database.db, database.url));
});

afterAll(async () => {
  await database.drop();
});

interface ListedSession {
  id: string;
  createdAt: string;
  lastSeenAt: string;
  expiresAt: string;
  userAgent: string | null;
  address: string | null;
  current: boolean;
}

const list = async (who: SignedInAgent): Promise<ListedSession[]> => (await who.agent.get('/api/auth/sessions').expect(200)).body;
const currentId = async (who: SignedInAgent): Promise<string> => (await list(who)).find((session) => session.current)!.id;
const stillSignedIn = async (who: SignedInAgent): Promise<boolean> => (await who.agent.get('/api/auth/me')).status === 200;

describe('GET /api/auth/sessions', () => {
  beforeEach(async () => {
    await database.db('sessions').delete();
  });

  it("lists the person's live sessions, newest activity first, marking the one asking", async () => {
    const laptop = await signIn(app, 'engineer@alderbay.example');
    const phone = await signIn(app, 'engineer@alderbay.example');
    await signIn(app, 'reviewer@alderbay.example');
    const signedOut = await signIn(app, 'engineer@alderbay.example');
    await signedOut.agent.post('/api/auth/logout').set('X-CSRF-Token', signedOut.csrfToken).expect(204);

    const fromLaptop = await list(laptop);
    expect(fromLaptop).toHaveLength(2);
    expect(Object.keys(fromLaptop[0]!).sort()).toEqual(['address', 'createdAt', 'current', 'expiresAt', 'id', 'lastSeenAt', 'userAgent']);
    expect(fromLaptop.filter((session) => session.current)).toHaveLength(1);
    expect(fromLaptop.every((session) => session.address === '127.0.0.1')).toBe(true);
    expect(Date.parse(fromLaptop[0]!.expiresAt)).toBeGreaterThan(Date.now());

    const laptopId = fromLaptop.find((session) => session.current)!.id;
    await database
      .db('sessions')
      .where({ id: laptopId })
      .update({ last_seen_at: database.db.raw("now() - interval '10 minutes'") });
    const fromPhone = await list(phone);
    const phoneId = fromPhone.find((session) => session.current)!.id;
    expect(phoneId).not.toBe(laptopId);
    expect(fromPhone.map((session) => session.id)).toEqual([phoneId, laptopId]);
  });

  it('needs a session', async () => {
    const response = await request(app).get('/api/auth/sessions');
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthorized');
  });
});

describe('DELETE /api/auth/sessions/:id', () => {
  it('ends another session of the same person, which is refused from then on', async () => {
    const laptop = await signIn(app, 'engineer@alderbay.example');
    const phone = await signIn(app, 'engineer@alderbay.example');
    const phoneId = await currentId(phone);

    const withoutHeader = await laptop.agent.delete(`/api/auth/sessions/${phoneId}`);
    expect(withoutHeader.status).toBe(403);
    expect(withoutHeader.body.error.code).toBe('csrf_failed');

    expect((await laptop.agent.delete(`/api/auth/sessions/${phoneId}`).set('X-CSRF-Token', laptop.csrfToken)).status).toBe(204);
    expect(await stillSignedIn(phone)).toBe(false);
    expect(await stillSignedIn(laptop)).toBe(true);
    expect((await list(laptop)).map((session) => session.id)).not.toContain(phoneId);
    const audit = (await database.db('audit_log').where({ action: 'end-session', entity_id: phoneId }).first())!;
    expect(audit.user_id).toBe(laptop.user.id);
  });

  it("answers 404 in the error shape for someone else's session, an ended one, or an id that is not a UUID", async () => {
    const engineer = await signIn(app, 'engineer@alderbay.example');
    const reviewer = await signIn(app, 'reviewer@alderbay.example');
    const reviewerId = await currentId(reviewer);
    const ended = await signIn(app, 'engineer@alderbay.example');
    const endedId = await currentId(ended);
    await ended.agent.post('/api/auth/logout').set('X-CSRF-Token', ended.csrfToken).expect(204);

    for (const id of [reviewerId, endedId, 'not-a-session', '1']) {
      const response = await engineer.agent.delete(`/api/auth/sessions/${id}`).set('X-CSRF-Token', engineer.csrfToken);
      expect(response.status, id).toBe(404);
      expect(response.body, id).toEqual({ error: { code: 'not_found', message: 'No such session.' } });
    }
    expect(await stillSignedIn(reviewer)).toBe(true);
  });

  it('ends the asking session itself, and clears its cookie', async () => {
    const laptop = await signIn(app, 'engineer@alderbay.example');
    const response = await laptop.agent.delete(`/api/auth/sessions/${await currentId(laptop)}`).set('X-CSRF-Token', laptop.csrfToken);
    expect(response.status).toBe(204);
    expect(String(response.headers['set-cookie'])).toMatch(/allowlight_session=;/);
    expect(await stillSignedIn(laptop)).toBe(false);
  });
});

describe('POST /api/auth/sessions/end-others', () => {
  it("ends every other session of the person and keeps this one and other people's", async () => {
    const laptop = await signIn(app, 'engineer@alderbay.example');
    const phone = await signIn(app, 'engineer@alderbay.example');
    const tablet = await signIn(app, 'engineer@alderbay.example');
    const reviewer = await signIn(app, 'reviewer@alderbay.example');
    const before = (await list(laptop)).length;

    expect((await laptop.agent.post('/api/auth/sessions/end-others')).status).toBe(403);
    const response = await laptop.agent.post('/api/auth/sessions/end-others').set('X-CSRF-Token', laptop.csrfToken);

    expect(response.status).toBe(200);
    expect(response.body).toEqual({ ended: before - 1 });
    expect(await stillSignedIn(phone)).toBe(false);
    expect(await stillSignedIn(tablet)).toBe(false);
    expect(await stillSignedIn(laptop)).toBe(true);
    expect(await stillSignedIn(reviewer)).toBe(true);
    expect((await list(laptop)).map((session) => session.current)).toEqual([true]);
  });
});
