import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite, signInToDemo } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

/** Edits not saved are never lost without a question, and the question is the app's own dialog. */
let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl: string;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  const { page } = browser;
  // A native confirm() would hang the page here: fail loudly instead.
  page.on('dialog', (dialog) => {
    void dialog.dismiss();
    throw new Error(`a native "${dialog.type()}" dialog appeared: ${dialog.message()}`);
  });
  projectUrl = await signInToDemo({ browser, served }, 'engineer@alderbay.example', inject('demoPassword'));
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('leaving unsaved edits', () => {
  it('asks before leaving the Set-up page with edits, and keeps them when the engineer keeps editing', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/setup`);
    const name = page.getByLabel('Project name', { exact: true });
    await expect.poll(() => name.inputValue()).toBe('Alder Bay Library & Makerspace');
    await name.fill('Alder Bay Library, renamed but not saved');
    await page.getByRole('link', { name: 'Spaces' }).click();
    const question = page.getByRole('alertdialog', { name: 'Discard your changes?' });
    await question.waitFor();
    await question.getByRole('button', { name: 'Keep editing' }).click();
    await question.waitFor({ state: 'detached' });
    expect(page.url()).toMatch(/\/setup$/);
    expect(await name.inputValue()).toBe('Alder Bay Library, renamed but not saved');

    await page.getByRole('link', { name: 'Spaces' }).click();
    await question.getByRole('button', { name: 'Discard changes' }).click();
    await page.waitForURL(/\/spaces$/);
  });

  it('asks before closing the space editor with edits', async () => {
    const { page } = browser;
    await page
      .getByRole('button', { name: /^Edit / })
      .first()
      .click();
    const editor = page.getByRole('dialog').filter({ has: page.getByLabel('Name', { exact: true }) });
    await editor.waitFor();
    await editor.getByLabel('Name', { exact: true }).fill('A name not saved');
    await editor.getByRole('button', { name: 'Cancel' }).click();
    const question = page.getByRole('alertdialog', { name: 'Discard your changes?' });
    await question.getByRole('button', { name: 'Keep editing' }).click();
    await question.waitFor({ state: 'detached' });
    expect(await editor.getByLabel('Name', { exact: true }).inputValue()).toBe('A name not saved');
    await editor.getByRole('button', { name: 'Cancel' }).click();
    await question.getByRole('button', { name: 'Discard changes' }).click();
    await editor.waitFor({ state: 'detached' });
    expect(await page.getByText('A name not saved').count()).toBe(0);
  });
});
