import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startMailCatcher } from '../../service/ops/mail-catcher.mjs';
import { createApp } from '../../service/src/app.js';
import type { Config } from '../../service/src/config.js';
import { MailSender, mailSettingsFrom } from '../../service/src/mail/mail-sender.js';
import { signIn, testConfig } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let config: Config;
let app: Express;
let sender: MailSender;
let catcher: Awaited<ReturnType<typeof startMailCatcher>>;
let mailDir: string;

const strongPassword = 'violet harbour kettle 42';

async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return typeof address === 'object' && address ? address.port : 0;
}

/** Every message the local server kept, parsed, oldest first. */
async function received(): Promise<ParsedMail[]> {
  const files = readdirSync(mailDir)
    .filter((name) => name.endsWith('.eml'))
    .sort();
  return Promise.all(files.map((name) => simpleParser(readFileSync(path.join(mailDir, name)))));
}

const recipients = (mail: ParsedMail): string[] =>
  [mail.to ?? []].flat().flatMap((to: AddressObject) => to.value.map((entry) => entry.address ?? ''));
const tokenIn = (mail: ParsedMail): string => /reset-password\?token=([\w-]+)/.exec(mail.text ?? '')?.[1] ?? '';

beforeAll(async () => {
  database = await freshDatabase();
  mailDir = mkdtempSync(path.join(tmpdir(), 'allowlight-mail-'));
  catcher = await startMailCatcher({ dir: mailDir, port: await freePort() });
  config = testConfig(database.url, {
    SMTP_PORT: String(catcher.port),
    APP_URL: 'http://127.0.0.1:4300',
    MAIL_RETRY_SECONDS: '0.01',
    MAIL_MAX_ATTEMPTS: '3',
    PASSWORD_RESET_MINUTES: '30',
  });
  sender = new MailSender(database.db, mailSettingsFrom(config));
  app = createApp({ db: database.db, config, logger: pino({ level: 'silent' }) });
});

afterAll(async () => {
  await sender.stop();
  await catcher.close();
  rmSync(mailDir, { recursive: true, force: true });
  await database.drop();
});

describe('a forgotten password', () => {
  it('sends a single-use link by mail; the new password ends every session and signs in', async () => {
    const before = await signIn(app, 'reviewer@alderbay.example');
    const asked = await request(app).post('/api/auth/password-reset').send({ email: 'Reviewer@Alderbay.example' }).expect(202);
    const unknown = await request(app).post('/api/auth/password-reset').send({ email: 'nobody@alderbay.example' }).expect(202);
    // The same answer for an address with no account, so the route cannot be used to find accounts.
    expect(unknown.body).toEqual(asked.body);

    await sender.drain();
    const mails = await received();
    expect(mails).toHaveLength(1);
    const mail = mails[0]!;
    expect(recipients(mail)).toEqual(['reviewer@alderbay.example']);
    expect(mail.subject).toBe('Choose a new Allowlight password');
    expect(mail.text).toContain('http://127.0.0.1:4300/reset-password?token=');
    expect(mail.html).toContain('href="http://127.0.0.1:4300/reset-password?token=');
    expect(mail.text).toContain('30 minutes');
    const token = tokenIn(mail);
    expect(token.length).toBeGreaterThan(30);

    const weak = await request(app).post('/api/auth/password-reset/complete').send({ token, password: 'password1234' }).expect(400);
    expect(weak.body.error.message).toMatch(/too easy to guess/);
    const short = await request(app).post('/api/auth/password-reset/complete').send({ token, password: 'short' }).expect(400);
    expect(short.body.error.message).toBe('Use at least 12 characters.');

    // A refused password leaves the link usable.
    await request(app).post('/api/auth/password-reset/complete').send({ token, password: strongPassword }).expect(204);
    expect((await before.agent.get('/api/auth/me')).status).toBe(401);
    await signIn(app, 'reviewer@alderbay.example', strongPassword);
    await request(app).post('/api/auth/login').send({ email: 'reviewer@alderbay.example', password: 'wrong password here' }).expect(401);

    const again = await request(app)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'another violet harbour 7' })
      .expect(400);
    expect(again.body.error.code).toBe('invalid_token');
    const made = await request(app)
      .post('/api/auth/password-reset/complete')
      .send({ token: 'made-up-token', password: strongPassword })
      .expect(400);
    expect(made.body.error.code).toBe('invalid_token');

    await sender.drain();
    const notice = (await received()).at(-1)!;
    expect(notice.subject).toBe('Your Allowlight password was changed');
    expect(recipients(notice)).toEqual(['reviewer@alderbay.example']);

    const audit = await database
      .db('audit_log')
      .whereIn('action', ['password-reset-requested', 'password-reset'])
      .orderBy('id')
      .pluck('action');
    expect(audit).toEqual(['password-reset-requested', 'password-reset']);
    // Only the token's digest is stored.
    expect(await database.db('password_resets').where({ token_hash: token }).first()).toBeUndefined();
  });

  it('refuses a link past its time', async () => {
    await request(app).post('/api/auth/password-reset').send({ email: 'admin@alderbay.example' }).expect(202);
    await sender.drain();
    const token = tokenIn((await received()).at(-1)!);
    await database.db('password_resets').update({ expires_at: database.db.raw("now() - interval '1 second'") });
    const late = await request(app).post('/api/auth/password-reset/complete').send({ token, password: strongPassword }).expect(400);
    expect(late.body.error.message).toMatch(/expired or was already used/);
  });
});

describe('POST /api/auth/password', () => {
  it('changes the password with the current one, keeps this session and ends the others', async () => {
    const here = await signIn(app, 'engineer@alderbay.example');
    const elsewhere = await signIn(app, 'engineer@alderbay.example');
    const change = (body: object) => here.agent.post('/api/auth/password').set('X-CSRF-Token', here.csrfToken).send(body);

    const wrong = await change({ currentPassword: 'not the password', newPassword: strongPassword }).expect(400);
    expect(wrong.body.error.details).toEqual([{ path: 'currentPassword', message: 'The current password is not correct.' }]);
    // A password built from the person's own address is refused.
    const own = await change({ currentPassword: inject('demoPassword'), newPassword: 'Alderbay12345' }).expect(400);
    expect(own.body.error.details[0].path).toBe('newPassword');

    const done = await change({ currentPassword: inject('demoPassword'), newPassword: strongPassword }).expect(200);
    expect(done.body).toEqual({ endedSessions: 1 });
    expect((await here.agent.get('/api/auth/me')).status).toBe(200);
    expect((await elsewhere.agent.get('/api/auth/me')).status).toBe(401);
    await signIn(app, 'engineer@alderbay.example', strongPassword);
    await request(app).post('/api/auth/password').send({ currentPassword: strongPassword, newPassword: strongPassword }).expect(401);
  });
});

describe('the outbox', () => {
  it('commits the change while SMTP is down and sends the mail once when it is back', async () => {
    const port = await freePort();
    const down = new MailSender(database.db, { ...mailSettingsFrom(config), port });
    try {
      await sender.drain(); // what the earlier tests queued
      const count = (await received()).length;
      await request(app).post('/api/auth/password-reset').send({ email: 'contractor@alderbay.example' }).expect(202);
      await down.drain();
      const queued = await database.db('mail_outbox').where({ status: 'queued' }).first();
      expect(queued).toMatchObject({ recipients: ['contractor@alderbay.example'], attempts: 1 });
      expect(queued.last_error).toMatch(/ECONNREFUSED|connect/i);
      // The reset itself was committed: its token is live although no mail went out.
      const contractor = await database.db('users').where({ email: 'contractor@alderbay.example' }).first('id');
      expect(await database.db('password_resets').where({ user_id: contractor!.id }).whereNull('used_at').count({ n: '*' })).toEqual([
        { n: '1' },
      ]);

      const back = await startMailCatcher({ dir: mailDir, port });
      try {
        await new Promise((resolve) => setTimeout(resolve, 20)); // past the 10 ms retry delay set above
        await down.drain();
        await down.drain();
      } finally {
        await back.close();
      }
      const after = await received();
      expect(after).toHaveLength(count + 1);
      expect(recipients(after.at(-1)!)).toEqual(['contractor@alderbay.example']);
      expect(await database.db('mail_outbox').where({ id: queued.id }).first()).toMatchObject({
        status: 'sent',
        attempts: 2,
        last_error: null,
      });
    } finally {
      await down.stop();
    }
  });

  it('shows a message that keeps failing as failed, to administrators only', async () => {
    const down = new MailSender(database.db, { ...mailSettingsFrom(config), port: await freePort(), retryBaseMs: 1 });
    try {
      await database.db('mail_outbox').insert({
        kind: 'password-changed',
        recipients: ['someone@alderbay.example'],
        subject: 'Undeliverable',
        text_body: 'Text',
        html_body: '<p>Text</p>',
      });
      for (let attempt = 0; attempt < 3; attempt += 1) {
        await new Promise((resolve) => setTimeout(resolve, 5));
        await down.drain();
      }
    } finally {
      await down.stop();
    }
    const admin = await signIn(app, 'admin@alderbay.example');
    const list = (await admin.agent.get('/api/admin/outbox').expect(200)).body as {
      id: string;
      subject: string;
      status: string;
      attempts: number;
      lastError: string | null;
    }[];
    const failed = list.find((entry) => entry.subject === 'Undeliverable')!;
    expect(failed).toMatchObject({ status: 'failed', attempts: 3 });
    expect(failed.lastError).toBeTruthy();
    expect(list.filter((entry) => entry.status === 'sent').length).toBeGreaterThanOrEqual(3);
    const detail = (await admin.agent.get(`/api/admin/outbox/${failed.id}`).expect(200)).body;
    expect(detail).toMatchObject({ text: 'Text', html: '<p>Text</p>', to: ['someone@alderbay.example'] });
    await admin.agent.get('/api/admin/outbox/not-an-id').expect(404);
    // A reset link acts for its recipient: the administrator sees the message without it.
    const reset = list.find((entry) => entry.subject === 'Choose a new Allowlight password')!;
    const shown = (await admin.agent.get(`/api/admin/outbox/${reset.id}`).expect(200)).body as { text: string; html: string };
    expect(shown.text).toContain('/reset-password?token=(hidden)');
    expect(shown.html).toContain('/reset-password?token=(hidden)');
    expect(shown.text).not.toMatch(/token=[\w-]{20,}/);

    const reviewer = await signIn(app, 'reviewer@alderbay.example', strongPassword);
    await reviewer.agent.get('/api/admin/outbox').expect(403);
  });
});
