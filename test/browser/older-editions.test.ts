/// <reference lib="dom" />
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl = '';

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(20_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail') await browser.screenshot(`failed-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(async () => {
  await closeBrowserSuite({ browser, served, database });
});

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
}

/** Waits until the dialog has moved focus into itself, so typing goes where the test means. */
async function openedDialog(page: Page, firstField: string) {
  const dialog = page.getByRole('dialog');
  await expect.poll(() => dialog.getByLabel(firstField, { exact: true }).evaluate((field) => field === document.activeElement)).toBe(true);
  return dialog;
}

/** Waits until a message beside a field has finished appearing: Material fades errors in. */
async function shownError(scope: ReturnType<Page['getByRole']>, text: string): Promise<void> {
  const error = scope.locator('mat-error', { hasText: text });
  await error.waitFor();
  await expect
    .poll(() => error.evaluate((node) => getComputedStyle(node.closest('.mat-mdc-form-field-error-wrapper') ?? node).opacity))
    .toBe('1');
}

describe('a project under an older code edition', { timeout: 60_000 }, () => {
  it('offers the seven editions in the set-up and names the project’s by its short name', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@alderbay.example');
    const session = (await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string };
    // An invented project for the test.
    const created = await page.request.post(`${served.baseUrl}/api/projects`, {
      headers: { 'X-CSRF-Token': session.csrfToken },
      data: { name: 'Heron Hall', edition: 'ashrae-90.1-2016', method: 'space-by-space', units: 'ip', lightingZone: 2 },
    });
    expect(created.status()).toBe(201);
    projectUrl = `${served.baseUrl}/projects/${((await created.json()) as { id: string }).id}`;

    await page.goto(`${served.baseUrl}/projects`);
    const row = page.getByRole('row', { name: /Heron Hall/ });
    await row.waitFor();
    expect(await row.textContent()).toContain('90.1-2016');

    await page.goto(`${projectUrl}/setup`);
    const edition = page.getByRole('combobox', { name: 'Code edition' });
    await expect.poll(() => edition.textContent()).toContain('ANSI/ASHRAE/IES Standard 90.1-2016');
    await edition.click();
    const options = page.getByRole('option');
    await expect.poll(() => options.count()).toBe(7);
    expect(await options.allTextContents()).toEqual([
      'ANSI/ASHRAE/IES Standard 90.1-2013',
      'ANSI/ASHRAE/IES Standard 90.1-2016',
      'ANSI/ASHRAE/IES Standard 90.1-2019',
      'ANSI/ASHRAE/IES Standard 90.1-2022',
      'International Energy Conservation Code 2018 (commercial)',
      'International Energy Conservation Code 2021 (commercial)',
      'International Energy Conservation Code 2024 (commercial)',
    ]);
    await browser.screenshot('older-editions-setup');
    await page.keyboard.press('Escape');
  });

  it('shows an atrium row’s allowance per foot of height and asks for the height before saving', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/spaces`);
    await page.getByRole('button', { name: 'Add space' }).click();
    const dialog = await openedDialog(page, 'Name');
    await dialog.getByLabel('Name').fill('Atrium');
    await dialog.getByLabel(/Floor area/).fill('1000');
    await dialog.getByRole('combobox', { name: 'Space type' }).fill('atrium');
    // ASHRAE 90.1-2016 Table 9.6.1, via PNNL building-energy-standards-data: 0.03 W/ft² per ft of total height up to 40 ft,
    // 0.4 + 0.02 per ft above (the row notes of shared/reference-data/ashrae901-2016-sbs.csv; from memory).
    const tall = page.getByRole('option', { name: /> 40 ft in height/ });
    await expect.poll(() => tall.textContent()).toContain('0.40 W/ft² + 0.02 W/ft² per ft of height');
    expect(await page.getByRole('option', { name: /< 20 ft in height/ }).textContent()).toContain('0.03 W/ft² per ft of height');
    await browser.screenshot('older-editions-atrium-options');
    await tall.click();

    const ceiling = dialog.getByLabel(/Ceiling height/);
    await shownError(dialog, "The atrium's allowance depends on its height: give the ceiling height.");
    expect(await dialog.getByRole('button', { name: 'Add space' }).isEnabled()).toBe(true);
    await browser.screenshot('older-editions-atrium-needs-height');

    // 30 ft is not a height the > 40 ft row is for: the service says so beside the field.
    await ceiling.fill('30');
    await dialog.getByRole('button', { name: 'Add space' }).click();
    await shownError(dialog, 'This space type is for atria more than 40 ft high; choose the atrium row for a height of 30 ft.');
    await browser.screenshot('older-editions-atrium-wrong-row');

    await ceiling.fill('50');
    await dialog.getByRole('button', { name: 'Add space' }).click();
    await dialog.waitFor({ state: 'detached' });
    // The allowance the table shows comes from the height: (0.4 + 0.02 × 50) W/ft² × 1,000 ft² = 1,400 W (the row notes; from memory).
    const row = page.getByRole('row', { name: /Atrium/ });
    await expect.poll(() => row.textContent()).toContain('1,400');
    await browser.screenshot('older-editions-spaces');
  });
});
