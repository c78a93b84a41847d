import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ProjectState } from '../../contract/review.js';
import { startMailCatcher } from '../../service/ops/mail-catcher.mjs';
import { createApp } from '../../service/src/app.js';
import type { Config } from '../../service/src/config.js';
import { ReviewDigest, digestSettingsFrom } from '../../service/src/mail/digest.js';
import { MailSender, mailSettingsFrom } from '../../service/src/mail/mail-sender.js';
import { queueTransitionMail } from '../../service/src/review/transition-mail.js';
import { signIn, testConfig, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;
let config: Config;
let app: Express;
let sender: MailSender;
let catcher: Awaited<ReturnType<typeof startMailCatcher>>;
let mailDir: string;
let engineer: SignedInAgent;
let reviewer: SignedInAgent;
let projectId: string;
let kicks = 0;

const appUrl = 'http://127.0.0.1:4300';
// An invented project whose name and comments carry the characters HTML must escape.
const projectName = 'Pier 4 <Annex> & "Shed"';
const people = {
  engineer: 'engineer@alderbay.example',
  reviewer: 'reviewer@alderbay.example',
  contractor: 'contractor@alderbay.example',
  secondEngineer: 'second.engineer@alderbay.example',
  secondReviewer: 'second.reviewer@alderbay.example',
  disabledReviewer: 'gone.reviewer@alderbay.example',
};
const reviewers = [people.reviewer, people.secondReviewer].sort();
const engineersAndContractors = [people.contractor, people.engineer, people.secondEngineer].sort();

async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return typeof address === 'object' && address ? address.port : 0;
}

/** The messages the local server kept since the last call, parsed, in recipient order; the folder is emptied. */
async function takeReceived(): Promise<ParsedMail[]> {
  const files = readdirSync(mailDir).filter((name) => name.endsWith('.eml'));
  const mails = await Promise.all(files.map((name) => simpleParser(readFileSync(path.join(mailDir, name)))));
  for (const name of files) rmSync(path.join(mailDir, name));
  return mails.sort((a, b) => recipients(a).join().localeCompare(recipients(b).join()));
}

const recipients = (mail: ParsedMail): string[] =>
  [mail.to ?? []].flat().flatMap((to: AddressObject) => to.value.map((entry) => entry.address ?? ''));
const allRecipients = (mails: ParsedMail[]) => mails.flatMap(recipients).sort();

async function state(): Promise<{ state: ProjectState; version: number; revision: number }> {
  return database.db('projects').where({ id: projectId }).first('state', 'version', 'revision');
}

/** Makes a move through the route and checks its answer's status. */
async function move(who: SignedInAgent, to: ProjectState, comment?: string, status = 200) {
  const { version } = await state();
  return who.agent
    .post(`/api/projects/${projectId}/transitions`)
    .set('X-CSRF-Token', who.csrfToken)
    .send({ to, version, ...(comment ? { comment } : {}) })
    .expect(status);
}

async function addUser(email: string, name: string, disabled = false): Promise<string> {
  const [row] = await database
    .db('users')
    .insert({ email, name, password_hash: 'not a hash: this account never signs in', disabled_at: disabled ? new Date() : null })
    .returning('id');
  return (row as { id: string }).id;
}

beforeAll(async () => {
  database = await freshDatabase();
  mailDir = mkdtempSync(path.join(tmpdir(), 'allowlight-review-mail-'));
  catcher = await startMailCatcher({ dir: mailDir, port: await freePort() });
  config = testConfig(database.url, {
    SMTP_PORT: String(catcher.port),
    APP_URL: appUrl,
    MAIL_RETRY_SECONDS: '0.01',
    MAIL_MAX_ATTEMPTS: '3',
  });
  sender = new MailSender(database.db, mailSettingsFrom(config));
  app = createApp({ db: database.db, config, logger: pino({ level: 'silent' }), mailQueued: () => (kicks += 1) });
  engineer = await signIn(app, people.engineer);
  reviewer = await signIn(app, people.reviewer);
  const created = await engineer.agent
    .post('/api/projects')
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: projectName, edition: 'iecc-2021', method: 'space-by-space', units: 'ip' })
    .expect(201);
  projectId = created.body.id;
  await addUser(people.secondEngineer, 'Lena <Marsh>');
  await addUser(people.secondReviewer, 'Tomas Reyes');
  const goneId = await addUser(people.disabledReviewer, 'Old Reviewer', true);
  for (const [email, role] of [
    [people.reviewer, 'reviewer'],
    [people.contractor, 'contractor'],
    [people.secondEngineer, 'engineer'],
    [people.secondReviewer, 'reviewer'],
  ]) {
    await engineer.agent
      .post(`/api/projects/${projectId}/members`)
      .set('X-CSRF-Token', engineer.csrfToken)
      .send({ email, role })
      .expect(200);
  }
  // A submission freezes the design's evaluation, which needs at least one space.
  await engineer.agent
    .post(`/api/projects/${projectId}/spaces`)
    .set('X-CSRF-Token', engineer.csrfToken)
    .send({ name: 'Net store', level: '1', spaceType: 'lobby-otherwise', area: '800' })
    .expect(201);
  // A reviewer whose account was disabled after joining the team.
  await database.db('project_members').insert({ project_id: projectId, user_id: goneId, role: 'reviewer' });
  await sender.drain();
  await takeReceived();
});

afterAll(async () => {
  await sender.stop();
  await catcher.close();
  rmSync(mailDir, { recursive: true, force: true });
  await database.drop();
});

describe('the mail of each review move', () => {
  it('tells the reviewers of a submission, each in a message of their own, with the review page', async () => {
    const before = kicks;
    await move(engineer, 'in-review');
    expect(kicks).toBe(before + 1);
    await sender.drain();
    const mails = await takeReceived();
    // Each reviewer once, never the disabled one, never the engineer who submitted.
    expect(mails.map(recipients)).toEqual(reviewers.map((address) => [address]));
    for (const mail of mails) {
      expect(mail.subject).toBe(`Ready for your review: ${projectName}`);
      expect(mail.text).toContain(`Ines Halvorsen submitted ${projectName} (revision 1) for review.`);
      expect(mail.text).toContain(`Open the review: ${appUrl}/projects/${projectId}/review`);
      expect(mail.html).toContain(`href="${appUrl}/projects/${projectId}/review"`);
      expect(mail.html).toContain('Pier 4 &lt;Annex&gt; &amp; &quot;Shed&quot;');
      expect(mail.html).not.toContain('<Annex>');
    }
    expect(mails[0]!.text).toMatch(/^Hello Dario Quint,/);
    const queued = await database.db('mail_outbox').where({ project_id: projectId, kind: 'review-submitted' });
    expect(queued).toHaveLength(2);
  });

  it("tells the engineers and the contractor of a return, with the reviewer's comment escaped in the HTML", async () => {
    const comment = 'Corridor 1 needs <b>occupant</b> sensors & a "manual-on" switch.\nThe hose store too.';
    await move(reviewer, 'returned', comment);
    await sender.drain();
    const mails = await takeReceived();
    expect(allRecipients(mails)).toEqual(engineersAndContractors);
    expect(mails.every((mail) => recipients(mail).length === 1)).toBe(true);
    for (const mail of mails) {
      expect(mail.subject).toBe(`Returned for changes: ${projectName}`);
      expect(mail.text).toContain('Dario Quint reviewed');
      expect(mail.text).toContain(comment);
      expect(mail.text).toContain(`Open the project: ${appUrl}/projects/${projectId}\n`);
      expect(mail.text).not.toContain('/review');
      expect(mail.html).toContain(
        'Corridor 1 needs &lt;b&gt;occupant&lt;/b&gt; sensors &amp; a &quot;manual-on&quot; switch.<br>The hose store too.',
      );
      expect(mail.html).not.toContain('<b>occupant');
      expect(mail.html).toContain(`href="${appUrl}/projects/${projectId}"`);
    }
    // A name is escaped as well as a comment.
    const second = mails.find((mail) => recipients(mail)[0] === people.secondEngineer)!;
    expect(second.text).toMatch(/^Hello Lena <Marsh>,/);
    expect(second.html).toContain('Hello Lena &lt;Marsh&gt;,');
  });

  it('tells the reviewers of a submission after a return as a second look', async () => {
    await move(engineer, 'in-review');
    await sender.drain();
    const mails = await takeReceived();
    expect(allRecipients(mails)).toEqual(reviewers);
    expect(mails[0]!.text).toContain(
      `Ines Halvorsen submitted ${projectName} (revision 1) for review again, after it was returned for changes.`,
    );
  });

  it('tells the engineers and the contractor of an acceptance', async () => {
    // Acceptance needs a verdict on every check item: the reviewer confirms them all at once.
    await reviewer.agent
      .post(`/api/projects/${projectId}/review-items/bulk`)
      .set('X-CSRF-Token', reviewer.csrfToken)
      .send({ confirm: { unchanged: true } })
      .expect(200);
    await move(reviewer, 'accepted');
    await sender.drain();
    const mails = await takeReceived();
    expect(allRecipients(mails)).toEqual(engineersAndContractors);
    expect(mails.map((mail) => mail.subject)).toEqual(mails.map(() => `Accepted: ${projectName}`));
    expect(mails[0]!.text).toContain(`Dario Quint reviewed ${projectName} (revision 1) and accepted it.`);
  });

  it('tells every member but the one who issued it of an issue', async () => {
    // Issuing through the route waits for submittal packages, so the mail of the move is queued as the move would.
    await database.db.transaction((trx) =>
      queueTransitionMail(trx, { projectId, from: 'accepted', to: 'issued', revision: 1, actorId: engineer.user.id }, { appUrl }),
    );
    await sender.drain();
    const mails = await takeReceived();
    expect(allRecipients(mails)).toEqual([people.contractor, ...reviewers, people.secondEngineer].sort());
    expect(allRecipients(mails)).not.toContain(people.engineer);
    for (const mail of mails) {
      expect(mail.subject).toBe(`Issued: ${projectName}`);
      const reviewing = reviewers.includes(recipients(mail)[0]!);
      expect(mail.text).toContain(`${appUrl}/projects/${projectId}${reviewing ? '/review' : ''}\n`);
    }
  });

  it('tells the reviewers of a reopening, with the new revision', async () => {
    await move(engineer, 'draft');
    await sender.drain();
    const mails = await takeReceived();
    expect(allRecipients(mails)).toEqual(reviewers);
    expect(mails[0]!.subject).toBe(`Reopened as a draft: ${projectName}`);
    expect(mails[0]!.text).toContain(`Ines Halvorsen reopened ${projectName} as a draft. It is now revision 2`);
  });

  it('queues nothing for a refused move, and nothing for the mover when nobody else is concerned', async () => {
    await move(reviewer, 'accepted', undefined, 409);
    await sender.drain();
    expect(await takeReceived()).toHaveLength(0);
    // A move that concerns nobody but the one who made it sends nothing, not even to them.
    const trx = await database.db.transaction();
    try {
      await trx('project_members').where({ project_id: projectId }).whereNot({ user_id: engineer.user.id }).delete();
      const count = await queueTransitionMail(
        trx,
        { projectId, from: 'accepted', to: 'issued', revision: 2, actorId: engineer.user.id },
        { appUrl },
      );
      expect(count).toBe(0);
      expect(await trx('mail_outbox').where({ kind: 'project-issued', project_id: projectId }).count({ n: '*' })).toEqual([{ n: '4' }]); // the four of the earlier issue
    } finally {
      await trx.rollback();
    }
  });
});

describe('while the mail server is down', () => {
  it('commits the move, sends nothing, and sends each message exactly once when the server is back', async () => {
    const port = await freePort();
    const down = new MailSender(database.db, { ...mailSettingsFrom(config), port });
    try {
      const response = await move(engineer, 'in-review');
      expect(response.body.state).toBe('in-review');
      await down.drain();
      expect((await state()).state).toBe('in-review');
      const queued = await database.db('mail_outbox').where({ project_id: projectId, status: 'queued' });
      expect(queued.map((row: { recipients: string[] }) => row.recipients[0]).sort()).toEqual(reviewers);
      for (const row of queued) {
        expect(row.attempts).toBe(1);
        expect(row.last_error).toMatch(/ECONNREFUSED|connect/i);
      }
      expect(await takeReceived()).toHaveLength(0);

      const back = await startMailCatcher({ dir: mailDir, port });
      try {
        await new Promise((resolve) => setTimeout(resolve, 20)); // past the 10 ms retry delay set above
        await down.drain();
        await down.drain();
        await sender.drain();
      } finally {
        await back.close();
      }
      const mails = await takeReceived();
      expect(mails.map(recipients)).toEqual(reviewers.map((address) => [address]));
      expect(mails.every((mail) => mail.subject === `Ready for your review: ${projectName}`)).toBe(true);
      const rows = await database.db('mail_outbox').whereIn(
        'id',
        queued.map((row: { id: string }) => row.id),
      );
      expect(rows.map((row: { status: string; attempts: number }) => [row.status, row.attempts])).toEqual([
        ['sent', 2],
        ['sent', 2],
      ]);
    } finally {
      await down.stop();
    }
  });
});

describe('the daily review digest', () => {
  // America/Chicago is six hours behind UTC in December (IANA time zone database, Central Standard Time).
  const timeZone = 'America/Chicago';
  let clock = new Date('2026-12-03T12:00:00Z');
  const digest = () => new ReviewDigest(database.db, { ...digestSettingsFrom(config), timeZone, hour: 7, now: () => clock });

  it("is each person's own choice, off until chosen", async () => {
    const settings = () => reviewer.agent.get('/api/auth/mail-settings').expect(200);
    expect((await settings()).body).toEqual({ reviewDigest: false });
    await reviewer.agent.patch('/api/auth/mail-settings').send({ reviewDigest: true }).expect(403);
    const refused = await reviewer.agent
      .patch('/api/auth/mail-settings')
      .set('X-CSRF-Token', reviewer.csrfToken)
      .send({ reviewDigest: 'yes' })
      .expect(400);
    expect(refused.body.error.details[0].path).toBe('reviewDigest');
    await reviewer.agent
      .patch('/api/auth/mail-settings')
      .set('X-CSRF-Token', reviewer.csrfToken)
      .send({ reviewDigest: true })
      .expect(200, { reviewDigest: true });
    expect((await settings()).body).toEqual({ reviewDigest: true });
    expect(await database.db('audit_log').where({ action: 'mail-settings', user_id: reviewer.user.id }).count({ n: '*' })).toEqual([
      { n: '1' },
    ]);
  });

  it('lists the waiting projects once a day from the set hour, only to the reviewers who chose it', async () => {
    // The project has waited since 09:00 on 30 November in Chicago.
    const submitted = await database
      .db('audit_log')
      .where({ project_id: projectId, action: 'transition' })
      .whereRaw("detail -> 'transition' ->> 'to' = 'in-review'")
      .update({ at: new Date('2026-11-30T15:00:00Z') });
    expect(submitted).toBeGreaterThan(0);
    // The open round's items carried over from the accepted round with their verdicts; the reviewer
    // marks one as needing revision, and the digest says so.
    const items = (await reviewer.agent.get(`/api/projects/${projectId}/review-items`).expect(200)).body as {
      id: string;
      verdict: string | null;
    }[];
    expect(items.length).toBeGreaterThan(0);
    expect(items.every((item) => item.verdict === 'confirmed')).toBe(true);
    await reviewer.agent
      .patch(`/api/projects/${projectId}/review-items/${items[0]!.id}`)
      .set('X-CSRF-Token', reviewer.csrfToken)
      .send({ verdict: 'needs-revision', comment: 'Show the sensor on the plan.' })
      .expect(200);
    const toCheck = 'every check item has a verdict, 1 check item needs revision';
    // The engineer chose it too, but reviews nothing: no digest.
    await database.db('users').where({ email: people.engineer }).update({ review_digest: true });

    clock = new Date('2026-12-03T12:30:00Z'); // 06:30 in Chicago, before the hour
    expect(await digest().run()).toBe(0);

    clock = new Date('2026-12-03T13:05:00Z'); // 07:05 in Chicago
    expect(await digest().run()).toBe(1);
    await sender.drain();
    const [mail, ...more] = await takeReceived();
    expect(more).toHaveLength(0);
    expect(recipients(mail!)).toEqual([people.reviewer]);
    expect(mail!.subject).toBe('One project waits for your review');
    expect(mail!.text).toContain(`- ${projectName}, waiting for 3 days; ${toCheck}: ${appUrl}/projects/${projectId}/review`);
    expect(mail!.html).toContain(
      `<a href="${appUrl}/projects/${projectId}/review">Pier 4 &lt;Annex&gt; &amp; &quot;Shed&quot;</a>, waiting for 3 days; ${toCheck}`,
    );
    expect(mail!.text).toContain(`${appUrl}/account`);

    // Later the same day, or from a second server, nothing more.
    clock = new Date('2026-12-03T23:00:00Z');
    expect(await digest().run()).toBe(0);
    expect(await Promise.all([digest().run(), digest().run()])).toEqual([0, 0]);
    await sender.drain();
    expect(await takeReceived()).toHaveLength(0);

    // The next day: one again, even with two servers looking at once.
    clock = new Date('2026-12-04T14:00:00Z');
    const both = await Promise.all([digest().run(), digest().run()]);
    expect(both.sort()).toEqual([0, 1]);
    await sender.drain();
    const next = await takeReceived();
    expect(next.map(recipients)).toEqual([[people.reviewer]]);
    expect(next[0]!.text).toContain('waiting for 4 days');
  });

  it('sends nothing on a day when nothing waits', async () => {
    await database.db('projects').where({ id: projectId }).update({ state: 'accepted' });
    clock = new Date('2026-12-05T14:00:00Z');
    expect(await digest().run()).toBe(0);
    await sender.drain();
    expect(await takeReceived()).toHaveLength(0);
    // The day is claimed all the same: a project submitted later that day has had its own message.
    const day = await database.db('review_digests').where({ day: '2026-12-05' }).select('mail_id');
    expect(day.length).toBeGreaterThan(0);
    expect(day.every((row: { mail_id: string | null }) => row.mail_id === null)).toBe(true);
  });
});
