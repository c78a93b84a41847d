import { pino } from 'pino';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import { createApp } from '../../service/src/app.js';
import { PackageJobs } from '../../service/src/package/package-jobs.js';
import { s3Storage } from '../../service/src/package/storage.js';
import { testConfig } from '../support/app.js';
import { launchBrowser, requireBuiltWebApp, serve, webDist, type Browser, type Served } from '../support/browser.js';
import { freshDatabase, type TestDatabase } from '../support/database.js';
import { startTestS3, type TestS3 } from '../support/s3.js';

let database: TestDatabase;
let s3: TestS3;
let jobs: PackageJobs;
let served: Served;
let browser: Browser;

beforeAll(async () => {
  requireBuiltWebApp();
  database = await freshDatabase();
  s3 = await startTestS3();
  // Every project of a space or more is made by a job here, so the demo shows the large-project path.
  const config = testConfig(database.url, { WEB_DIST: webDist, COOKIE_SECURE: undefined, ...s3.settings, PACKAGE_JOB_MIN_SPACES: '1' });
  const storage = s3Storage(config);
  const logger = pino({ level: 'silent' });
  jobs = new PackageJobs(
    database.db,
    storage,
    { databaseUrl: database.url, appUrl: config.APP_URL, mailQueued: () => {}, pollSeconds: 0.5 },
    logger,
  );
  await jobs.start();
  served = await serve(createApp({ db: database.db, config, logger, storage, packageJobs: jobs }));
  browser = await launchBrowser();
  browser.page.setDefaultTimeout(60_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail') await browser.screenshot('failed-package-job');
});

afterAll(async () => {
  try {
    await browser?.close();
  } finally {
    await served?.close();
    await jobs?.stop();
    await s3?.stop();
    await database?.drop();
  }
});

describe('a package made by a background job', { timeout: 120_000 }, () => {
  it('shows the job’s progress in words, then the revision it made', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();
    const project = await database.db('projects').where({ name: 'Alder Bay Library & Makerspace' }).first<{ id: string }>('id');
    await page.goto(`${served.baseUrl}/projects/${project!.id}/package`);
    await page.getByText('No package has been made yet.').waitFor();
    // Every progress sentence the page shows is kept as it appears, however briefly.
    await page.evaluate(() => {
      const seen: string[] = [];
      (window as unknown as { progressSeen: string[] }).progressSeen = seen;
      new MutationObserver(() => {
        const words = document.querySelector('[data-testid="package-progress-words"]')?.textContent?.trim();
        if (words && seen[seen.length - 1] !== words) seen.push(words);
      }).observe(document.body, { subtree: true, childList: true, characterData: true });
    });
    await page.getByRole('button', { name: 'Make a draft package' }).click();
    await page.getByTestId('package-revision').filter({ hasText: 'Revision 1 (draft)' }).waitFor();
    const seen = await page.evaluate(() => (window as unknown as { progressSeen: string[] }).progressSeen);
    expect(seen.length).toBeGreaterThan(0);
    expect(seen.join(' | ')).toMatch(/%/);
    const job = await database.db('package_jobs').where({ project_id: project!.id }).first('state', 'progress');
    expect(job).toMatchObject({ state: 'done', progress: 100 });
    expect(await page.getByTestId('package-failure').count()).toBe(0);
    await browser.screenshot('package-job-done');
  });
});
