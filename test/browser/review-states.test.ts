import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite, signInToDemo } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl = '';

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-review-states-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function signIn(email: string): Promise<void> {
  projectUrl = await signInToDemo({ browser, served }, email, inject('demoPassword'));
}

async function signOut(): Promise<void> {
  await browser.page.getByRole('button', { name: 'Sign out' }).click();
  await browser.page.waitForURL(/\/sign-in/);
}

const stateBar = () => browser.page.getByTestId('review-state');

describe('the review states in the workspace', () => {
  it('lets the engineer submit the draft, then locks the design with a banner and disabled editing', async () => {
    await signIn('engineer@alderbay.example');
    const { page } = browser;
    await page.goto(`${projectUrl}/spaces`);
    await page.getByRole('heading', { name: 'Spaces', level: 2 }).waitFor();
    expect(await stateBar().textContent()).toContain('Draft');
    const add = page.getByRole('button', { name: 'Add space' });
    await expect.poll(() => add.isEnabled()).toBe(true);
    expect(await page.getByRole('button', { name: /^Edit 102 Main reading room/ }).count()).toBe(1);
    expect(await page.getByTestId('locked-banner').count()).toBe(0);

    await stateBar().getByRole('button', { name: 'Submit for review' }).click();
    await expect.poll(() => stateBar().textContent()).toContain('In review');
    await page.getByTestId('locked-banner').waitFor();
    expect(await page.getByTestId('locked-banner').textContent()).toContain('cannot be changed until the reviewer returns it');
    expect(await add.isDisabled()).toBe(true);
    expect(await page.getByRole('button', { name: 'Import spreadsheet' }).isDisabled()).toBe(true);
    // The row actions (edit, duplicate, delete) are gone, not merely refused.
    expect(await page.getByRole('button', { name: /^(Edit|More for) / }).count()).toBe(0);
    expect(await stateBar().getByRole('button').count()).toBe(0);
    await browser.screenshot('review-states-engineer-in-review');
    await signOut();
  }, 60_000);

  it('lets the reviewer return the design, with the comment the dialog asks for', async () => {
    await signIn('reviewer@alderbay.example');
    const { page } = browser;
    await page.goto(`${projectUrl}/spaces`);
    await expect.poll(() => stateBar().textContent()).toContain('In review');
    expect(await stateBar().getByRole('button', { name: 'Accept' }).count()).toBe(1);
    await stateBar().getByRole('button', { name: 'Return to the engineer' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    // Without a comment the return is not sent: the dialog says what is missing.
    await dialog.getByRole('button', { name: 'Return to the engineer' }).click();
    await dialog.getByText('Write what needs revision: a return needs a comment.').waitFor();
    await dialog.getByLabel('What needs revision').fill('The main reading room needs its daylight control described.');
    await browser.screenshot('review-states-return-dialog');
    await dialog.getByRole('button', { name: 'Return to the engineer' }).click();
    await dialog.waitFor({ state: 'detached' });
    await expect.poll(() => stateBar().textContent()).toContain('Returned');
    expect(await stateBar().getByRole('button').count()).toBe(0);
    await signOut();
  }, 60_000);

  it('shows the engineer the returned design, editable again, with the move to submit it again', async () => {
    await signIn('engineer@alderbay.example');
    const { page } = browser;
    await page.goto(`${projectUrl}/spaces`);
    await expect.poll(() => stateBar().textContent()).toContain('Returned');
    expect(await page.getByTestId('locked-banner').count()).toBe(0);
    await expect.poll(() => page.getByRole('button', { name: 'Add space' }).isEnabled()).toBe(true);
    expect(await stateBar().getByRole('button', { name: 'Submit again' }).count()).toBe(1);
    const note = page.getByTestId('return-note');
    await note.waitFor();
    expect(await note.textContent()).toContain('Returned by Dario Quint');
    expect(await note.textContent()).toContain('The main reading room needs its daylight control described.');
    await browser.screenshot('review-states-engineer-returned');
    await page.getByRole('button', { name: 'Add space' }).click();
    await page.getByRole('dialog').waitFor();
  }, 60_000);
});
