import { existsSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('signing in with a real browser', () => {
  it('sends a visitor to the sign-in page, and a wrong password gets the generic message', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toContain('The e-mail or password is not correct.');
    await browser.screenshot('sign-in-failed');
  });

  it('signs in as the demo engineer and shows the shell with the name and role', async () => {
    const { page } = browser;
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    const who = page.getByTestId('signed-in-user');
    await who.waitFor();
    expect(await who.textContent()).toContain('Ines Halvorsen');
    expect(await who.textContent()).toContain('Engineer');
    await page.getByText('Alder Bay Library & Makerspace').waitFor();
    const file = await browser.screenshot('shell-signed-in');
    expect(existsSync(file)).toBe(true);
  });

  it('keeps the session across a reload and ends it on sign-out', async () => {
    const { page } = browser;
    await page.reload();
    await page.getByTestId('signed-in-user').waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${served.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
  });
});
