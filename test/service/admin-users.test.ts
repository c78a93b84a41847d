import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { simpleParser } from 'mailparser';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startMailCatcher, type MailCatcher } from '../../service/ops/mail-catcher.mjs';
import { createApp } from '../../service/src/app.js';
import { MailSender, mailSettingsFrom } from '../../service/src/mail/mail-sender.js';
import { signIn, testConfig, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let app: Express;
let catcher: MailCatcher;
let sender: MailSender;
let mailDir: string;
let admin: SignedInAgent;

interface UserView {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  disabled: boolean;
}

beforeAll(async () => {
  database = await freshDatabase();
  mailDir = mkdtempSync(path.join(tmpdir(), 'allowlight-mail-'));
  catcher = await startMailCatcher({ dir: mailDir });
  const config = testConfig(database.url, { SMTP_PORT: String(catcher.port), APP_URL: 'http://allowlight.localhost' });
  sender = new MailSender(database.db, mailSettingsFrom(config));
  app = createApp({ db: database.db, config, logger: pino({ level: 'silent' }) });
  admin = await signIn(app, 'admin@alderbay.example');
});

afterAll(async () => {
  await sender.stop();
  await catcher.close();
  rmSync(mailDir, { recursive: true, force: true });
  await database.drop();
});

const asAdmin = () => ({
  get: (url: string) => admin.agent.get(url),
  post: (url: string, body: object) => admin.agent.post(url).set('X-CSRF-Token', admin.csrfToken).send(body),
  patch: (url: string, body: object) => admin.agent.patch(url).set('X-CSRF-Token', admin.csrfToken).send(body),
});

describe('the administrator and the accounts', () => {
  it('creates an account whose owner chooses the password through the mailed link', async () => {
    const created = await asAdmin().post('/api/admin/users', { email: 'Surveyor@Alderbay.example', name: 'Noor Castellanos' }).expect(201);
    expect(created.body).toMatchObject({ email: 'Surveyor@Alderbay.example', name: 'Noor Castellanos', isAdmin: false, disabled: false });
    const again = await asAdmin().post('/api/admin/users', { email: 'surveyor@alderbay.example', name: 'Someone' }).expect(409);
    expect(again.body.error.details).toEqual([{ path: 'email', message: 'Already has an account.' }]);

    await sender.drain();
    const [file] = readdirSync(mailDir).filter((name) => name.endsWith('.eml'));
    const mail = await simpleParser(readFileSync(path.join(mailDir, file!)));
    expect(mail.subject).toBe('Your Allowlight account');
    expect(mail.text).toContain('7 days');
    const token = /reset-password\?token=([\w-]+)/.exec(mail.text ?? '')![1]!;
    await request(app).post('/api/auth/password-reset/complete').send({ token, password: 'slate window harbour 8' }).expect(204);
    await signIn(app, 'surveyor@alderbay.example', 'slate window harbour 8');

    const listed = (await asAdmin().get('/api/admin/users').expect(200)).body as UserView[];
    expect(listed.map((user) => user.email)).toContain('Surveyor@Alderbay.example');
    const history = await database.db('audit_log').where({ entity: 'user', action: 'create' }).first();
    expect(history).toMatchObject({ user_id: admin.user.id, entity_id: created.body.id });
  });

  it('disables an account: its sessions end and it cannot sign in; enabling it lets it back', async () => {
    const contractor = await signIn(app, 'contractor@alderbay.example');
    const id = contractor.user.id;
    const disabled = await asAdmin().patch(`/api/admin/users/${id}`, { disabled: true }).expect(200);
    expect(disabled.body.disabled).toBe(true);
    expect((await contractor.agent.get('/api/auth/me')).status).toBe(401);
    const refused = await request(app)
      .post('/api/auth/login')
      .send({ email: 'contractor@alderbay.example', password: inject('demoPassword') })
      .expect(403);
    expect(refused.body.error.code).toBe('account_disabled');
    // A wrong password still gets the plain refusal, so a guesser learns nothing.
    await request(app).post('/api/auth/login').send({ email: 'contractor@alderbay.example', password: 'not the password' }).expect(401);
    // No reset link goes to a disabled account.
    await request(app).post('/api/auth/password-reset').send({ email: 'contractor@alderbay.example' }).expect(202);
    expect(await database.db('password_resets').where({ user_id: id }).first()).toBeUndefined();

    await asAdmin().patch(`/api/admin/users/${id}`, { disabled: false }).expect(200);
    await signIn(app, 'contractor@alderbay.example');
    const audit = await database.db('audit_log').where({ entity: 'user', action: 'update', entity_id: id }).orderBy('id').pluck('detail');
    expect(audit.map((detail) => (typeof detail === 'string' ? JSON.parse(detail) : detail).after.disabled)).toEqual([true, false]);
  });

  it('makes an administrator, and keeps one enabled administrator and the asking one in place', async () => {
    const reviewer = await signIn(app, 'reviewer@alderbay.example');
    await asAdmin().patch(`/api/admin/users/${reviewer.user.id}`, { isAdmin: true }).expect(200);
    expect((await reviewer.agent.get('/api/admin/users')).status).toBe(200);

    const self = await asAdmin().patch(`/api/admin/users/${admin.user.id}`, { disabled: true }).expect(409);
    expect(self.body.error.message).toMatch(/your own account/);
    await asAdmin().patch(`/api/admin/users/${reviewer.user.id}`, { isAdmin: false }).expect(200);
    await asAdmin().patch(`/api/admin/users/${reviewer.user.id}`, { isAdmin: 'yes' }).expect(400);
    await asAdmin().patch(`/api/admin/users/${reviewer.user.id}`, {}).expect(400);
    await asAdmin().patch('/api/admin/users/not-an-id', { isAdmin: true }).expect(404);
    expect((await reviewer.agent.get('/api/admin/users')).status).toBe(403);
    await reviewer.agent
      .post('/api/admin/users')
      .set('X-CSRF-Token', reviewer.csrfToken)
      .send({ email: 'x@alderbay.example', name: 'X' })
      .expect(403);
  });

  it('lists the changes to accounts, newest first, for administrators only', async () => {
    const reviewer = await signIn(app, 'reviewer@alderbay.example');
    await asAdmin().patch(`/api/admin/users/${reviewer.user.id}`, { isAdmin: true }).expect(200);
    const changes = (await asAdmin().get('/api/admin/audit').expect(200)).body as {
      action: string;
      by: { name: string } | null;
      account: { email: string } | null;
      before: { isAdmin?: boolean } | null;
      after: { isAdmin?: boolean } | null;
    }[];
    expect(changes[0]).toMatchObject({
      action: 'update',
      by: { name: admin.user.name },
      account: { email: 'reviewer@alderbay.example' },
      before: { isAdmin: false },
      after: { isAdmin: true },
    });
    // Everything the tests above changed is there, and nothing else: no sign-ins, no passwords.
    expect(new Set(changes.map((change) => change.action))).toEqual(new Set(['create', 'update']));
    expect(changes.find((change) => change.action === 'create')?.account?.email).toBe('Surveyor@Alderbay.example');
    const paged = (await asAdmin().get('/api/admin/audit?limit=1').expect(200)).body as { id: string }[];
    expect(paged).toHaveLength(1);
    const older = (await asAdmin().get(`/api/admin/audit?before=${paged[0]!.id}`).expect(200)).body;
    expect(older).toEqual(changes.slice(1));
    await asAdmin().get('/api/admin/audit?limit=0').expect(400);
    await asAdmin().get('/api/admin/audit?before=drop').expect(400);

    // The last administrator cannot remove themself; once another is made, the guard is the own-account rule.
    await asAdmin().patch(`/api/admin/users/${reviewer.user.id}`, { isAdmin: false }).expect(200);
    const last = await asAdmin().patch(`/api/admin/users/${admin.user.id}`, { isAdmin: false }).expect(409);
    expect(last.body.error.message).toMatch(/administrator/);
    expect((await reviewer.agent.get('/api/admin/audit')).status).toBe(403);
  });
});
