import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';
import { pino } from 'pino';
import { startMailCatcher, type MailCatcher } from '../../service/ops/mail-catcher.mjs';
import { createApp } from '../../service/src/app.js';
import { MailSender, mailSettingsFrom } from '../../service/src/mail/mail-sender.js';
import { testApp, testConfig } from './app.js';
import { launchBrowser, requireBuiltWebApp, serve, webDist, type Browser, type Served } from './browser.js';
import { freshDatabase, type TestDatabase } from './database.js';
import { startTestS3, type TestS3 } from './s3.js';

export interface BrowserSuite {
  database: TestDatabase;
  served: Served;
  browser: Browser;
}

/** For one browser test file: a copy of the seeded database, the app serving the built web app on it, and Chromium. */
export async function openBrowserSuite(): Promise<BrowserSuite> {
  requireBuiltWebApp();
  const database = await freshDatabase();
  // Secure cookies, as in production: Chromium counts http://127.0.0.1 as a secure context and keeps them.
  const served = await serve(testApp(database.db, database.url, { WEB_DIST: webDist, COOKIE_SECURE: undefined }).app);
  const browser = await launchBrowser();
  return { database, served, browser };
}

/** A browser suite whose app keeps its files (packages, cut sheets, photos) in a local S3 server of its own. */
export interface StorageBrowserSuite extends BrowserSuite {
  s3: TestS3;
}

/** As {@link openBrowserSuite}, with the suite's own S3 server. */
export async function openStorageBrowserSuite(): Promise<StorageBrowserSuite> {
  requireBuiltWebApp();
  const database = await freshDatabase();
  const s3 = await startTestS3();
  const served = await serve(testApp(database.db, database.url, { WEB_DIST: webDist, COOKIE_SECURE: undefined, ...s3.settings }).app);
  const browser = await launchBrowser();
  return { database, served, browser, s3 };
}

export async function closeStorageBrowserSuite(suite: Partial<StorageBrowserSuite>): Promise<void> {
  try {
    await closeBrowserSuite(suite);
  } finally {
    await suite.s3?.stop();
  }
}

/** Closes everything; errors the page reported are thrown after the server and database are gone. */
export async function closeBrowserSuite(suite: Partial<BrowserSuite>): Promise<void> {
  try {
    await suite.browser?.close();
  } finally {
    await suite.served?.close();
    await suite.database?.drop();
  }
}

/** Signs a person in through the sign-in page, whoever was signed in before. */
export async function signInAs(suite: Pick<BrowserSuite, 'browser' | 'served'>, email: string, password: string): Promise<void> {
  const { page } = suite.browser;
  await page.context().clearCookies();
  await page.goto(`${suite.served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
}

/** Signs a demo person in through the sign-in page and answers the demo project's workspace address. */
export async function signInToDemo(suite: Pick<BrowserSuite, 'browser' | 'served'>, email: string, password: string): Promise<string> {
  const { page } = suite.browser;
  await signInAs(suite, email, password);
  const projects = await page.evaluate(async () => (await fetch('/api/projects')).json() as Promise<{ id: string; name: string }[]>);
  return `${suite.served.baseUrl}/projects/${projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id}`;
}

/** A browser suite whose app sends its mail to a local mail server of its own, kept as `.eml` files in `mailDir`. */
export interface MailBrowserSuite extends BrowserSuite {
  catcher: MailCatcher;
  sender: MailSender;
  mailDir: string;
  appUrl: string;
}

/** As {@link openBrowserSuite}, with the mail server and the sender that drains the outbox into it. */
export async function openMailBrowserSuite(appUrl = 'http://allowlight.localhost'): Promise<MailBrowserSuite> {
  requireBuiltWebApp();
  const database = await freshDatabase();
  const mailDir = mkdtempSync(path.join(tmpdir(), 'allowlight-mail-'));
  const catcher = await startMailCatcher({ dir: mailDir });
  const config = testConfig(database.url, {
    WEB_DIST: webDist,
    COOKIE_SECURE: undefined,
    SMTP_PORT: String(catcher.port),
    APP_URL: appUrl,
  });
  const sender = new MailSender(database.db, mailSettingsFrom(config));
  const served = await serve(createApp({ db: database.db, config, logger: pino({ level: 'silent' }) }));
  const browser = await launchBrowser();
  return { database, served, browser, catcher, sender, mailDir, appUrl };
}

export async function closeMailBrowserSuite(suite: Partial<MailBrowserSuite>): Promise<void> {
  try {
    await suite.browser?.close();
  } finally {
    await suite.served?.close();
    await suite.sender?.stop();
    await suite.catcher?.close();
    if (suite.mailDir) rmSync(suite.mailDir, { recursive: true, force: true });
    await suite.database?.drop();
  }
}

/** Every message the suite's mail server kept, oldest first. */
export async function keptMails(mailDir: string): Promise<ParsedMail[]> {
  const files = readdirSync(mailDir)
    .filter((name) => name.endsWith('.eml'))
    .sort();
  return Promise.all(files.map((name) => simpleParser(readFileSync(path.join(mailDir, name)))));
}
