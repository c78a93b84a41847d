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
