import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { simpleParser, type ParsedMail } from 'mailparser';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let projectId: string;

const strongPassword = 'harbour lantern thistle 42';

beforeAll(async () => {
  database = await freshDatabase();
  mailDir = mkdtempSync(path.join(tmpdir(), 'allowlight-mail-'));
  catcher = await startMailCatcher({ dir: mailDir });
  const config = testConfig(database.url, { SMTP_PORT: String(catcher.port), APP_URL: 'http://allowlight.localhost' });
  sender = new MailSender(database.db, mailSettingsFrom(config));
  app = createApp({ db: database.db, config, logger: pino({ level: 'silent' }) });
  engineer = await signIn(app, 'engineer@alderbay.example');
  reviewer = await signIn(app, 'reviewer@alderbay.example');
  const created = await engineer.agent
    .post('/api/projects')
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: 'Tidewater Pavilion', edition: 'iecc-2021', method: 'space-by-space', units: 'ip' })
    .expect(201);
  projectId = created.body.id;
  await engineer.agent
    .post(`/api/projects/${projectId}/members`)
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ email: 'reviewer@alderbay.example', role: 'reviewer' })
    .expect(200);
});

afterAll(async () => {
  await sender.stop();
  await catcher.close();
  rmSync(mailDir, { recursive: true, force: true });
  await database.drop();
});

const inviteAs = (who: SignedInAgent, body: object) =>
  who.agent.post(`/api/projects/${projectId}/invitations`).set('X-CSRF-Token', who.csrfToken).send(body);

/** The message the local mail server kept for an address (the newest when several). */
async function mailTo(address: string): Promise<ParsedMail> {
  await sender.drain();
  const mails = await Promise.all(
    readdirSync(mailDir)
      .filter((name) => name.endsWith('.eml'))
      .sort()
      .map((name) => simpleParser(readFileSync(path.join(mailDir, name)))),
  );
  const mine = mails.filter((mail) =>
    (Array.isArray(mail.to) ? mail.to : [mail.to]).some((to) => to?.text.toLowerCase().includes(address.toLowerCase())),
  );
  if (mine.length === 0) throw new Error(`no mail to ${address}`);
  return mine.at(-1)!;
}

function tokenIn(mail: ParsedMail): string {
  const match = /http:\/\/allowlight\.localhost\/invitation\?token=([\w-]+)/.exec(mail.text ?? '');
  if (!match) throw new Error(`no invitation link in: ${mail.text}`);
  return match[1]!;
}

async function invited(address: string, role = 'contractor'): Promise<string> {
  const response = await inviteAs(engineer, { email: address, role }).expect(201);
  expect(response.body.outcome).toBe('invited');
  return tokenIn(await mailTo(address));
}

describe('invitations to a project', () => {
  it('mails the invited address a link, lists the invitation, and keeps only the token’s hash', async () => {
    const response = await inviteAs(engineer, { email: 'Surveyor@Elsewhere.example', role: 'contractor' }).expect(201);
    expect(response.body.invitation).toMatchObject({
      email: 'Surveyor@Elsewhere.example',
      role: 'contractor',
      invitedBy: engineer.user.name,
      expired: false,
    });
    const days = (new Date(response.body.invitation.expiresAt).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.9);
    expect(days).toBeLessThanOrEqual(7);

    const mail = await mailTo('Surveyor@Elsewhere.example');
    expect(mail.subject).toBe(`${engineer.user.name} invites you to Tidewater Pavilion on Allowlight`);
    expect(mail.text).toContain('as a contractor');
    expect(mail.text).toContain('7 days');
    const token = tokenIn(mail);
    expect(mail.html).toContain(`href="http://allowlight.localhost/invitation?token=${token}"`);
    const stored = (await database.db('invitations').where({ project_id: projectId }).first())!;
    expect(stored.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(stored)).not.toContain(token);

    const listed = await reviewer.agent.get(`/api/projects/${projectId}/invitations`).expect(200);
    expect(listed.body.map((entry: { email: string }) => entry.email)).toEqual(['Surveyor@Elsewhere.example']);

    // A second invitation to the same address while one waits is refused in words.
    const again = await inviteAs(engineer, { email: 'surveyor@elsewhere.example', role: 'reviewer' }).expect(409);
    expect(again.body.error.message).toMatch(/waiting already/);
  });

  it('shows who invites to what, then accepts once: the account, the membership and a session', async () => {
    const token = tokenIn(await mailTo('Surveyor@Elsewhere.example'));
    const preview = await request(app).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body).toMatchObject({
      email: 'Surveyor@Elsewhere.example',
      role: 'contractor',
      projectName: 'Tidewater Pavilion',
      invitedBy: engineer.user.name,
    });

    // The password rules apply (zxcvbn refuses a common password; the length rule a short one).
    const weak = await request(app).post(`/api/invitations/${token}/accept`).send({ name: 'Noor Castellanos', password: 'password1234' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.details).toEqual([{ path: 'password', message: expect.stringMatching(/too easy to guess/) }]);
    await request(app).post(`/api/invitations/${token}/accept`).send({ name: '', password: strongPassword }).expect(400);

    const visitor = request.agent(app);
    const accepted = await visitor.post(`/api/invitations/${token}/accept`).send({ name: 'Noor Castellanos', password: strongPassword });
    expect(accepted.status).toBe(201);
    expect(accepted.body).toMatchObject({
      projectId,
      user: { email: 'Surveyor@Elsewhere.example', name: 'Noor Castellanos', roles: ['contractor'] },
    });
    expect(accepted.headers['set-cookie']?.[0]).toMatch(/^allowlight_session=/);
    const project = await visitor.get(`/api/projects/${projectId}`).expect(200);
    expect(project.body.role).toBe('contractor');
    await signIn(app, 'surveyor@elsewhere.example', strongPassword);

    // Single use: the link is spent, in words.
    const reused = await request(app).post(`/api/invitations/${token}/accept`).send({ name: 'Someone Else', password: strongPassword });
    expect(reused.status).toBe(410);
    expect(reused.body.error).toMatchObject({ code: 'invitation_used', message: expect.stringMatching(/used already/) });
    expect((await request(app).get(`/api/invitations/${token}`)).status).toBe(410);
    expect(await database.db('users').whereRaw('lower(email) = ?', ['surveyor@elsewhere.example']).count({ n: '*' })).toEqual([{ n: '1' }]);

    // The team panel no longer lists it.
    expect((await engineer.agent.get(`/api/projects/${projectId}/invitations`)).body).toEqual([]);
    const history = await engineer.agent.get(`/api/projects/${projectId}/history`).expect(200);
    const actions = history.body.entries.map((entry: { action: string; entity: string }) => `${entry.entity}:${entry.action}`);
    expect(actions).toEqual(expect.arrayContaining(['invitation:invite', 'invitation:accept-invitation']));
    const acceptance = history.body.entries.find((entry: { action: string }) => entry.action === 'accept-invitation');
    expect(acceptance).toMatchObject({
      user: { name: 'Noor Castellanos' },
      name: 'Surveyor@Elsewhere.example',
      after: { role: 'contractor' },
    });

    // The administrator's list of changes to accounts counts the new account.
    const admin = await signIn(app, 'admin@alderbay.example');
    const changes = (await admin.agent.get('/api/admin/audit').expect(200)).body;
    expect(changes[0]).toMatchObject({
      action: 'accept-invitation',
      by: { name: 'Noor Castellanos' },
      account: { name: 'Noor Castellanos', email: 'Surveyor@Elsewhere.example' },
      after: { role: 'contractor' },
      projectName: 'Tidewater Pavilion',
    });
  });

  it('refuses an expired link (its expiry back-dated), and a new invitation replaces the expired one', async () => {
    const token = await invited('late@elsewhere.example');
    await database
      .db('invitations')
      .whereRaw('lower(email) = ?', ['late@elsewhere.example'])
      .update({ expires_at: new Date(Date.now() - 60_000) });
    const preview = await request(app).get(`/api/invitations/${token}`);
    expect(preview.status).toBe(410);
    expect(preview.body.error).toMatchObject({ code: 'invitation_expired', message: expect.stringMatching(/expired/) });
    const accept = await request(app).post(`/api/invitations/${token}/accept`).send({ name: 'Late Comer', password: strongPassword });
    expect(accept.status).toBe(410);
    expect(await database.db('users').where({ email: 'late@elsewhere.example' }).first()).toBeUndefined();

    const listed = (await engineer.agent.get(`/api/projects/${projectId}/invitations`)).body;
    expect(listed).toEqual([expect.objectContaining({ email: 'late@elsewhere.example', expired: true })]);
    const fresh = await invited('late@elsewhere.example');
    expect(fresh).not.toBe(token);
    const after = (await engineer.agent.get(`/api/projects/${projectId}/invitations`)).body;
    expect(after).toEqual([expect.objectContaining({ email: 'late@elsewhere.example', expired: false })]);
    expect((await request(app).get(`/api/invitations/${token}`)).status).toBe(410);
    expect((await request(app).get(`/api/invitations/${fresh}`)).status).toBe(200);
  });

  it('refuses a withdrawn link, and a token that was never sent', async () => {
    const token = await invited('changed-mind@elsewhere.example', 'reviewer');
    const [entry] = ((await engineer.agent.get(`/api/projects/${projectId}/invitations`)).body as { id: string; email: string }[]).filter(
      (invitation) => invitation.email === 'changed-mind@elsewhere.example',
    );
    // A reviewer cannot withdraw.
    await reviewer.agent.delete(`/api/projects/${projectId}/invitations/${entry!.id}`).set('X-CSRF-Token', reviewer.csrfToken).expect(403);
    const left = await engineer.agent
      .delete(`/api/projects/${projectId}/invitations/${entry!.id}`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .expect(200);
    expect(left.body.map((invitation: { email: string }) => invitation.email)).not.toContain('changed-mind@elsewhere.example');
    const refused = await request(app).post(`/api/invitations/${token}/accept`).send({ name: 'Changed Mind', password: strongPassword });
    expect(refused.status).toBe(410);
    expect(refused.body.error).toMatchObject({ code: 'invitation_withdrawn', message: expect.stringMatching(/withdrawn/) });
    await engineer.agent.delete(`/api/projects/${projectId}/invitations/not-an-id`).set('X-CSRF-Token', engineer.csrfToken).expect(404);

    const wrong = await request(app).get(`/api/invitations/${token.slice(0, -2)}xx`);
    expect(wrong.status).toBe(404);
    expect(wrong.body.error).toMatchObject({ code: 'invitation_not_found', message: expect.stringMatching(/not one we sent/) });
    expect((await request(app).get(`/api/invitations/${'a'.repeat(300)}`)).status).toBe(404);
    const withdrawal = await database.db('audit_log').where({ project_id: projectId, action: 'withdraw-invitation' }).first();
    expect(withdrawal).toMatchObject({ user_id: engineer.user.id, entity: 'invitation', entity_id: entry!.id });
  });

  it('is the engineer’s to send: a reviewer cannot invite, and bad bodies are refused', async () => {
    const refused = await inviteAs(reviewer, { email: 'friend@elsewhere.example', role: 'engineer' });
    expect(refused.status).toBe(403);
    expect(await database.db('invitations').where({ email: 'friend@elsewhere.example' }).first()).toBeUndefined();
    await inviteAs(engineer, { email: 'not an address', role: 'reviewer' }).expect(400);
    await inviteAs(engineer, { email: 'friend@elsewhere.example', role: 'owner' }).expect(400);
    await inviteAs(engineer, { email: `${'x'.repeat(320)}@elsewhere.example`, role: 'reviewer' }).expect(400);
  });

  it('adds an address that has an account straight to the team, tells them by mail, and refuses a member', async () => {
    const added = await inviteAs(engineer, { email: 'Contractor@AlderBay.example', role: 'contractor' }).expect(200);
    expect(added.body).toMatchObject({ outcome: 'added', email: 'contractor@alderbay.example', role: 'contractor' });
    const contractor = await signIn(app, 'contractor@alderbay.example');
    expect((await contractor.agent.get(`/api/projects/${projectId}`)).body.role).toBe('contractor');
    const mail = await mailTo('contractor@alderbay.example');
    expect(mail.subject).toBe('You are on the team of Tidewater Pavilion');
    expect(mail.text).toContain(`http://allowlight.localhost/projects/${projectId}`);
    expect(await database.db('invitations').where({ email: 'contractor@alderbay.example' }).first()).toBeUndefined();

    const member = await inviteAs(engineer, { email: 'reviewer@alderbay.example', role: 'engineer' }).expect(409);
    expect(member.body.error.message).toMatch(/on the team already, as reviewer/);
  });
});
