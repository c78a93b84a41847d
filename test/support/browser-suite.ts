import { testApp } from './app.js';
import { launchBrowser, requireBuiltWebApp, serve, webDist, type Browser, type Served } from './browser.js';
import { freshDatabase, type TestDatabase } from './database.js';

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

/** Closes everything; errors the page reported are thrown after the server and database are gone. */
export async function closeBrowserSuite(suite: Partial<BrowserSuite>): Promise<void> {
  try {
    await suite.browser?.close();
  } finally {
    await suite.served?.close();
    await suite.database?.drop();
  }
}

/** Signs a demo person in through the sign-in page and answers the demo project's workspace address. */
export async function signInToDemo(suite: Pick<BrowserSuite, 'browser' | 'served'>, email: string, password: string): Promise<string> {
  const { page } = suite.browser;
  await page.goto(`${suite.served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
  const projects = await page.evaluate(async () => (await fetch('/api/projects')).json() as Promise<{ id: string; name: string }[]>);
  return `${suite.served.baseUrl}/projects/${projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id}`;
}
