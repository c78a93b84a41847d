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
let apiUrl = '';

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(20_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-history-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
}

/** A write through the API as the signed-in person, with the session's CSRF token. */
async function apiWrite(page: Page, method: 'post' | 'delete', url: string, data?: unknown): Promise<{ status: number; body: unknown }> {
  const session = (await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string };
  const response = await page.request[method](`${served.baseUrl}${url}`, {
    headers: { 'X-CSRF-Token': session.csrfToken },
    ...(data === undefined ? {} : { data }),
  });
  return { status: response.status(), body: response.status() === 204 ? null : await response.json() };
}

const verdict = (page: Page) => page.getByTestId('workspace-verdict');
const entry = (page: Page, text: string) => page.locator('.entry', { hasText: text });
const spaceRow = (page: Page, name: string) => page.locator('[data-space-id]', { hasText: name });

describe('the project history', { timeout: 60_000 }, () => {
  it('records a change made in the Spaces editor and a delete undone from the snackbar', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@alderbay.example');
    const projects = (await (await page.request.get(`${served.baseUrl}/api/projects`)).json()) as { id: string; name: string }[];
    const demo = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!;
    projectUrl = `${served.baseUrl}/projects/${demo.id}`;
    apiUrl = `/api/projects/${demo.id}`;

    await page.goto(`${projectUrl}/spaces`);
    await expect.poll(() => verdict(page).textContent(), { timeout: 20_000 }).toContain('Complies');
    await page.getByRole('button', { name: 'Edit 114 Storage' }).click();
    const dialog = page.getByRole('dialog');
    // Typing waits until the dialog has moved focus into itself, so it goes where the test means.
    await expect.poll(() => dialog.getByLabel('Name', { exact: true }).evaluate((field) => field === document.activeElement)).toBe(true);
    await expect.poll(() => dialog.getByLabel(/Floor area/).inputValue()).toBe('320');
    await dialog.getByLabel(/Floor area/).fill('340');
    await dialog.getByRole('button', { name: 'Save space' }).click();
    await dialog.waitFor({ state: 'detached' });
    await expect.poll(() => spaceRow(page, '114 Storage').textContent()).toContain('340');

    const closet = spaceRow(page, '115 Custodial closet');
    const closetId = await closet.getAttribute('data-space-id');
    await page.getByRole('button', { name: 'More for 115 Custodial closet' }).click();
    await page.getByRole('menuitem', { name: 'Delete' }).click();
    await closet.waitFor({ state: 'detached' });
    await page.getByText('Space “115 Custodial closet” deleted').waitFor();
    await page.getByRole('button', { name: 'Undo' }).click();
    // Back with the same id, so its history carries on.
    await page.locator(`[data-space-id="${closetId}"]`, { hasText: '115 Custodial closet' }).waitFor();

    await page.getByRole('link', { name: 'History' }).click();
    await page.getByRole('heading', { name: 'History' }).waitFor();
    await entry(page, 'Ines Halvorsen changed space “114 Storage”: floor area 320 → 340 ft²').waitFor();
    await entry(page, 'Ines Halvorsen deleted space “115 Custodial closet” (Level 1, 60 ft², Storage Room)').waitFor();
    await entry(page, 'Ines Halvorsen restored space “115 Custodial closet”').waitFor();
    // Brought back already: nothing left to restore from that delete.
    expect(await page.getByRole('button', { name: /^Restore / }).count()).toBe(0);
    const texts = await page.locator('.entry').allTextContents();
    for (const text of texts) expect(text).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-|spaces\.\d|ceilingHeight|spaceType|luminaire-type/);
    await browser.screenshot('history');

    await page.getByRole('link', { name: 'Spaces' }).click();
    await spaceRow(page, '115 Custodial closet').waitFor();
  });

  it('filters by a space and shows only its entries', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'History' }).click();
    await entry(page, 'changed space “114 Storage”').waitFor();
    await page.getByRole('combobox', { name: 'Space' }).fill('Custodial');
    await page.getByRole('option', { name: '115 Custodial closet' }).click();
    // The demo project's spaces came in by one import; then the delete and its undo.
    await expect.poll(() => page.locator('.entry').count()).toBe(3);
    const texts = await page.locator('.entry').allTextContents();
    expect(texts.every((text) => text.includes('“115 Custodial closet”'))).toBe(true);
    expect(texts[0]).toContain('restored space');
    expect(texts[1]).toContain('deleted space');
    expect(texts[2]).toContain('imported space “115 Custodial closet” from a spreadsheet (Level 1, 60 ft², Storage Room)');
    await browser.screenshot('history-filtered');
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await entry(page, 'changed space “114 Storage”').waitFor();
  });

  it('restores a deleted space from its History entry', async () => {
    const { page } = browser;
    const spaces = (await (await page.request.get(`${served.baseUrl}${apiUrl}/spaces`)).json()) as {
      id: string;
      name: string;
      version: number;
    }[];
    const copyRoom = spaces.find((space) => space.name === '209 Copy and print')!;
    expect((await apiWrite(page, 'delete', `${apiUrl}/spaces/${copyRoom.id}?version=${copyRoom.version}`)).status).toBe(204);

    await page.goto(`${projectUrl}/history`);
    await entry(page, 'deleted space “209 Copy and print”').waitFor();
    await page.getByRole('button', { name: 'Restore space “209 Copy and print”' }).click();
    await page.getByText('Space “209 Copy and print” restored').waitFor();
    await entry(page, 'Ines Halvorsen restored space “209 Copy and print”').waitFor();
    expect(await page.getByRole('button', { name: 'Restore space “209 Copy and print”' }).count()).toBe(0);
    await page.getByRole('link', { name: 'Spaces' }).click();
    await page.locator(`[data-space-id="${copyRoom.id}"]`).waitFor();
  });

  it('archives a project from the projects list and brings it back', async () => {
    const { page } = browser;
    const created = await apiWrite(page, 'post', '/api/projects', {
      name: 'Boathouse scratch',
      edition: 'iecc-2021',
      method: 'space-by-space',
      units: 'ip',
    });
    expect(created.status).toBe(201);
    const row = (name: string) => page.getByRole('row').filter({ has: page.getByRole('link', { name, exact: true }) });
    const scratchUrl = `${served.baseUrl}/projects/${(created.body as { id: string }).id}`;

    // An address the team does not take: the service does not say why, and the page says no more.
    await page.goto(`${scratchUrl}/setup`);
    await page.getByLabel('E-mail address', { exact: true }).fill('nobody@alderbay.example');
    await page.getByRole('button', { name: 'Add to the team' }).click();
    await page
      .getByText(
        'No one was added for that address. Check it, or invite the person by e-mail on the Set-up page: the invitation makes their account.',
      )
      .waitFor();
    expect(await page.getByLabel('E-mail address', { exact: true }).inputValue()).toBe('nobody@alderbay.example');
    await browser.screenshot('team-not-added');

    await page.goto(served.baseUrl);
    await row('Boathouse scratch').waitFor();
    await page.getByRole('button', { name: 'Archive Boathouse scratch' }).click();
    const dialog = page.getByRole('alertdialog', { name: 'Archive “Boathouse scratch”?' });
    await dialog.getByText('Archive “Boathouse scratch”?').waitFor();
    // Focus lands on the confirming button once the dialog has opened.
    await expect
      .poll(() => dialog.getByRole('button', { name: 'Archive' }).evaluate((button) => button === document.activeElement))
      .toBe(true);
    await browser.screenshot('archive-dialog');
    await dialog.getByRole('button', { name: 'Archive' }).click();
    await page.getByText('“Boathouse scratch” archived').waitFor();
    await row('Boathouse scratch').waitFor({ state: 'detached' });
    await row('Alder Bay Library & Makerspace').waitFor();

    await page.getByRole('switch', { name: 'Show archived projects' }).click();
    await page.getByRole('table', { name: 'Your archived projects' }).waitFor();
    await row('Boathouse scratch').waitFor();
    expect(await row('Alder Bay Library & Makerspace').count()).toBe(0);
    await browser.screenshot('projects-archived');

    // Opened from the archive, it reads but does not change.
    await page.getByRole('link', { name: 'Boathouse scratch', exact: true }).click();
    await page.getByText('This project is archived: it can be read but not changed. Unarchive it from the projects list.').waitFor();
    expect(await page.getByRole('button', { name: 'Add space' }).count()).toBe(0);
    await browser.screenshot('archived-project');
    await page.goBack();

    // The list opens on the current projects again.
    await page.getByRole('table', { name: 'Your projects' }).waitFor();
    await page.getByRole('switch', { name: 'Show archived projects' }).click();
    await page.getByRole('button', { name: 'Unarchive Boathouse scratch' }).click();
    await page.getByText('“Boathouse scratch” is back among the current projects').waitFor();
    await row('Boathouse scratch').waitFor({ state: 'detached' });
    await page.getByRole('switch', { name: 'Show archived projects' }).click();
    await page.getByRole('table', { name: 'Your projects' }).waitFor();
    await row('Boathouse scratch').waitFor();

    await page.goto(`${scratchUrl}/history`);
    await entry(page, 'Ines Halvorsen unarchived the project').waitFor();
    await entry(page, 'Ines Halvorsen asked to add nobody@alderbay.example to the team; no one was added').waitFor();
    await entry(page, 'Ines Halvorsen archived the project').waitFor();
    await entry(page, 'Ines Halvorsen created the project “Boathouse scratch”').waitFor();
  });

  it('is read by a reviewer too, without Restore', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await signIn(page, 'reviewer@alderbay.example');
    await page.goto(`${projectUrl}/history`);
    await entry(page, 'Ines Halvorsen changed space “114 Storage”').waitFor();
    await page.getByText('You are reading this project').waitFor();
    expect(await page.getByRole('button', { name: /^Restore / }).count()).toBe(0);
    await browser.screenshot('history-reviewer');
  });
});
