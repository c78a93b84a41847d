/// <reference lib="dom" />
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectUrl = '';
/** The demo's 29 spaces and the 60 this file adds: more than a virtual scroll keeps in its window. */
const spaceCount = 89;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  const { page } = browser;
  page.setDefaultTimeout(20_000);
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('engineer@alderbay.example');
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
  const projects = await page.evaluate(async () => (await fetch('/api/projects')).json() as Promise<{ id: string; name: string }[]>);
  const projectId = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id;
  projectUrl = `${served.baseUrl}/projects/${projectId}`;
  // Invented storerooms on a third level, confirmed unlit; "storage-room" is an IECC 2021 Table C405.3.2(2) row
  // (via PNNL building-energy-standards-data).
  const csrf = ((await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string }).csrfToken;
  const spaces = Array.from({ length: 60 }, (_, index) => ({
    name: `Store ${301 + index}`,
    level: 'Level 3',
    spaceType: 'storage-room',
    area: '40',
    unlit: true,
  }));
  const imported = await page.request.post(`${served.baseUrl}/api/projects/${projectId}/spaces/bulk`, {
    headers: { 'X-CSRF-Token': csrf, 'Idempotency-Key': 'print-test-storerooms' },
    data: { spaces },
  });
  expect(imported.status()).toBe(201);
});

afterEach(async (context) => {
  await browser.page.emulateMedia({ media: 'screen' });
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-print-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

const navigation = () => browser.page.getByRole('navigation', { name: 'Project areas' });

describe('printing a page of the workspace', { timeout: 60_000 }, () => {
  it('prints every space, not only the rows a virtual scroll keeps, and no navigation or toolbar', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/spaces`);
    await page.getByText(`${spaceCount} spaces`).waitFor();
    const rows = page.locator('[data-space-id]');
    await rows.first().waitFor();
    // On screen the list keeps a window of rows: the print has to do better than that.
    expect(await rows.count()).toBeLessThan(spaceCount);
    expect(await navigation().isVisible()).toBe(true);

    await page.emulateMedia({ media: 'print' });
    await expect.poll(() => rows.count()).toBe(spaceCount);
    await expect.poll(() => navigation().isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Add space' }).isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Project areas' }).isVisible()).toBe(false);
    expect(await rows.last().isVisible()).toBe(true);
    expect(await rows.last().textContent()).toContain('Store 360');
    // A sheet of A4 at 96 px to the inch, less the page margins: what the print lays out.
    await page.setViewportSize({ width: 704, height: 1030 });
    await browser.screenshot('print-spaces');
    await page.setViewportSize({ width: 1280, height: 800 });
  });

  it('prints the results whole, with their cautions, each section from a new page', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/results`);
    const table = page.getByRole('table', { name: 'Results by space' });
    await table.locator('tbody tr').first().waitFor();
    const scroller = page.locator('.scroller');
    const clipped = () => scroller.evaluate((element) => element.scrollHeight > element.clientHeight + 1);
    // On screen the table scrolls inside its frame.
    expect(await clipped()).toBe(true);

    await page.emulateMedia({ media: 'print' });
    await expect.poll(clipped).toBe(false);
    expect(await table.locator('tbody tr').count()).toBe(spaceCount);
    expect(await navigation().isVisible()).toBe(false);
    expect(await page.getByRole('note', { name: 'Cautions' }).isVisible()).toBe(true);
    expect(await page.getByLabel('Find a space').isVisible()).toBe(false);
    const breaks = await page
      .locator('section[aria-labelledby="spaces-heading"], section[aria-labelledby="chart-heading"]')
      .evaluateAll((sections) => sections.map((section) => getComputedStyle(section).breakBefore));
    expect(breaks).toEqual(['page', 'page']);
    await page.setViewportSize({ width: 704, height: 1030 });
    // Every column on the sheet.
    expect(await table.evaluate((element) => element.getBoundingClientRect().right)).toBeLessThanOrEqual(704);
    await browser.screenshot('print-results');
    await page.setViewportSize({ width: 1280, height: 800 });

    const pdf = await page.pdf({ format: 'A4' });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // Pages of the document's page tree: the summary, the chart and the table at least.
    const pages = pdf.toString('latin1').match(/\/Type\s*\/Page\b/g) ?? [];
    expect(pages.length).toBeGreaterThanOrEqual(3);
  });

  for (const area of ['setup', 'luminaires', 'allowances', 'controls', 'daylight', 'exterior', 'compare', 'history']) {
    it(`prints ${area} without the navigation`, async () => {
      const { page } = browser;
      await page.goto(`${projectUrl}/${area}`);
      const heading = page.locator('h2').first();
      await heading.waitFor();
      // The comparison arrives apart from the design: print it once it is there.
      if (area === 'compare') await page.getByTestId('edition-column').first().waitFor();
      await page.emulateMedia({ media: 'print' });
      await expect.poll(() => navigation().isVisible()).toBe(false);
      expect(await page.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(false);
      expect(await heading.isVisible()).toBe(true);
      // The page's own lists of spaces pick what to show on screen; on paper the chosen space is shown.
      expect(
        await page.locator('nav').evaluateAll((lists) => lists.filter((list) => getComputedStyle(list).display !== 'none').length),
      ).toBe(0);
    });
  }
});
