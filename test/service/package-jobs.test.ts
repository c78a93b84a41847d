import { createHash } from 'node:crypto';
import type { Express } from 'express';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { packageStepStart, type PackageJobAnswer } from '../../contract/package.js';
import { freePort } from '../../service/ops/postgres.mjs';
import { createApp } from '../../service/src/app.js';
import { PackageJobs } from '../../service/src/package/package-jobs.js';
import { s3Storage } from '../../service/src/package/storage.js';
import { signIn, testConfig, type SignedInAgent } from '../support/app.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { startTestS3, type TestS3 } from '../support/s3.js';

let database: TestDatabase;
let s3: TestS3;
let projectId: string;
const running: PackageJobs[] = [];

/** The app with its package jobs started, as `main.ts` starts them; every project of a space or more goes to a job. */
async function appWithJobs(overrides: Record<string, string> = {}): Promise<{ app: Express; engineer: SignedInAgent }> {
  const config = testConfig(database.url, { ...s3.settings, PACKAGE_JOB_MIN_SPACES: '1', ...overrides });
  const storage = s3Storage(config);
  const logger = pino({ level: process.env['TEST_LOG_LEVEL'] ?? 'silent' });
  const jobs = new PackageJobs(
    database.db,
    storage,
    { databaseUrl: database.url, appUrl: config.APP_URL, mailQueued: () => {}, pollSeconds: 0.5 },
    logger,
  );
  await jobs.start();
  running.push(jobs);
  const app = createApp({ db: database.db, config, logger, storage, packageJobs: jobs });
  return { app, engineer: await signIn(app, 'engineer@alderbay.example') };
}

async function stopJobs(): Promise<void> {
  await Promise.all(running.splice(0).map((jobs) => jobs.stop()));
}

beforeAll(async () => {
  database = await freshDatabase();
  s3 = await startTestS3();
  const row = await database.db('projects').where({ name: 'Alder Bay Library & Makerspace' }).first<{ id: string }>('id');
  projectId = row!.id;
});

afterAll(async () => {
  await stopJobs();
  await s3?.stop();
  await database?.drop();
});

function post(who: SignedInAgent) {
  return who.agent.post(`/api/projects/${projectId}/packages`).set('X-CSRF-Token', who.csrfToken);
}

/** Follows the job until it ends, keeping every progress figure seen on the way. */
async function follow(who: SignedInAgent, jobId: string, seen: number[] = []): Promise<PackageJobAnswer['job']> {
  let last: PackageJobAnswer['job'] | undefined;
  await expect
    .poll(
      async () => {
        const response = await who.agent.get(`/api/projects/${projectId}/packages/jobs/${jobId}`);
        expect(response.status).toBe(200);
        last = (response.body as PackageJobAnswer).job;
        seen.push(last.progress);
        return last.state;
      },
      { timeout: 90_000, interval: 200 },
    )
    .toMatch(/^(done|failed)$/);
  return last!;
}

describe('package jobs', () => {
  let engineer: SignedInAgent;
  let app: Express;

  beforeAll(async () => {
    ({ app, engineer } = await appWithJobs());
  });

  it(
    'answers 202 with the job at once, the same job to a second request, and ends done with the package',
    { timeout: 120_000 },
    async () => {
      const first = await post(engineer);
      expect(first.status, JSON.stringify(first.body)).toBe(202);
      const job = (first.body as PackageJobAnswer).job;
      expect(job.id).toMatch(/^[0-9a-f-]{36}$/);
      expect(['queued', 'running']).toContain(job.state);
      expect(job.progress).toBeGreaterThanOrEqual(0);
      expect(job.progress).toBeLessThan(100);
      const second = await post(engineer);
      expect(second.status).toBe(202);
      expect((second.body as PackageJobAnswer).job.id).toBe(job.id);

      const seen: number[] = [];
      const ended = await follow(engineer, job.id, seen);
      expect(ended.state, ended.error).toBe('done');
      expect(ended.progress).toBe(100);
      expect(ended.error).toBeUndefined();
      // Every figure seen is the start of a step or the end, never going back.
      const allowed = [...Object.values(packageStepStart), 100];
      for (const figure of seen) expect(allowed).toContain(figure);
      expect([...seen].sort((a, b) => a - b)).toEqual(seen);

      const made = ended.package!;
      expect(made).toMatchObject({ revision: 1, draft: true });
      expect(made.files.map((file) => file.format).sort()).toEqual(['docx', 'pdf', 'xlsx']);
      const row = await database.db('package_revisions').where({ id: made.id }).first();
      expect(row!.fingerprint).toBe(made.fingerprint);
      for (const file of made.files) {
        const response = await engineer.agent.get(file.url).responseType('blob');
        expect(response.status).toBe(200);
        const body = response.body as Buffer;
        expect(createHash('sha256').update(body).digest('hex')).toBe(row!.files.find((entry) => entry.format === file.format)!.sha256);
      }
      // A new request once the job is done is a new job, for the next revision.
      const next = await post(engineer);
      expect(next.status).toBe(202);
      expect((next.body as PackageJobAnswer).job.id).not.toBe(job.id);
      const nextEnded = await follow(engineer, (next.body as PackageJobAnswer).job.id);
      expect(nextEnded.package?.revision).toBe(2);
    },
  );

  it('makes a project below the threshold at once, as before', { timeout: 120_000 }, async () => {
    const small = createApp({
      db: database.db,
      config: testConfig(database.url, { ...s3.settings, PACKAGE_JOB_MIN_SPACES: '100000' }),
      logger: pino({ level: 'silent' }),
      packageJobs: running[0]!,
    });
    const signedIn = await signIn(small, 'engineer@alderbay.example');
    const response = await post(signedIn);
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    expect(response.body).toMatchObject({ revision: 3, draft: true });
  });

  it('lets only the engineer follow a job, and answers an unknown job 404 in words', async () => {
    const reviewer = await signIn(app, 'reviewer@alderbay.example');
    const [job] = await database.db('package_jobs').where({ project_id: projectId }).select('id');
    expect((await reviewer.agent.get(`/api/projects/${projectId}/packages/jobs/${job!.id}`)).status).toBe(403);
    const unknown = await engineer.agent.get(`/api/projects/${projectId}/packages/jobs/00000000-0000-4000-8000-000000000000`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toBe('That package job does not exist.');
  });
});

describe('a package job that fails', () => {
  it('ends failed, saying why in words, records no revision, and lets the engineer ask again', { timeout: 120_000 }, async () => {
    await stopJobs();
    const { engineer } = await appWithJobs({ S3_ENDPOINT: `http://127.0.0.1:${await freePort()}` });
    const before = await database.db('package_revisions').where({ project_id: projectId }).count<{ count: string }[]>('id as count');
    const response = await post(engineer);
    expect(response.status).toBe(202);
    const ended = await follow(engineer, (response.body as PackageJobAnswer).job.id);
    expect(ended.state).toBe('failed');
    expect(ended.package).toBeUndefined();
    expect(ended.error).toMatch(/file store/);
    // Words for people: no stack, no field path, no address.
    expect(ended.error).not.toMatch(/ at |Error:|http:\/\/|\.ts\b/);
    expect(await database.db('package_revisions').where({ project_id: projectId }).count<{ count: string }[]>('id as count')).toEqual(
      before,
    );
    const again = await post(engineer);
    expect(again.status).toBe(202);
    expect((again.body as PackageJobAnswer).job.id).not.toBe((response.body as PackageJobAnswer).job.id);
    await follow(engineer, (again.body as PackageJobAnswer).job.id);
  });

  it('fails, in words, a job a stopped server left running, so the project may ask again', { timeout: 60_000 }, async () => {
    await stopJobs();
    const left = '11111111-1111-4111-8111-111111111111';
    await database.db('package_jobs').insert({ id: left, project_id: projectId, state: 'running', step: 'pdf', progress: 70 });
    const { engineer } = await appWithJobs();
    const answer = await engineer.agent.get(`/api/projects/${projectId}/packages/jobs/${left}`);
    expect(answer.body.job).toMatchObject({
      state: 'failed',
      error: 'The server stopped while the package was being made. Make the package again.',
    });
  });
});
