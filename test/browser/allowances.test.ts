/// <reference lib="dom" />
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let shopUrl = '';
let officeUrl = '';

/** Writes through the API as the signed-in engineer, as the set-up a test stands on (the page under test is Allowances). */
async function post(page: Page, url: string, data: unknown): Promise<{ id: string }> {
  const csrf = ((await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string }).csrfToken;
  const response = await page.request.post(`${served.baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data });
  expect(response.status(), url).toBe(201);
  return (await response.json()) as { id: string };
}

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  const { page } = browser;
  page.setDefaultTimeout(20_000);
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('engineer@alderbay.example');
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();

  // An invented outfitter's shop: one sales floor of 2,000 ft² with thirty 40 W general luminaires and
  // forty 25 W display luminaires (invented wattages), and a stockroom.
  const shop = await post(page, '/api/projects', {
    name: 'Harbour Outfitters',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  await post(page, `/api/projects/${shop.id}/luminaire-types`, {
    tag: 'A',
    description: '2×4 LED troffer',
    inputWatts: '40',
    use: 'general',
    basis: 'rated',
  });
  await post(page, `/api/projects/${shop.id}/luminaire-types`, {
    tag: 'D',
    description: 'Track head over the display tables',
    inputWatts: '25',
    use: 'display',
    basis: 'rated',
  });
  const openings = { controls: [], windows: [], skylights: [] };
  await post(page, `/api/projects/${shop.id}/spaces`, {
    name: 'Sales floor',
    level: 'Ground',
    spaceType: 'sales-area',
    area: '2000',
    luminaires: [
      { tag: 'A', count: '30' },
      { tag: 'D', count: '40' },
    ],
    ...openings,
  });
  await post(page, `/api/projects/${shop.id}/spaces`, {
    name: 'Stockroom',
    level: 'Ground',
    spaceType: 'storage-room',
    area: '400',
    luminaires: [{ tag: 'A', count: '4' }],
    ...openings,
  });
  shopUrl = `${served.baseUrl}/projects/${shop.id}`;

  const office = await post(page, '/api/projects', {
    name: 'Harbour Outfitters offices',
    edition: 'iecc-2021',
    method: 'building-area',
    units: 'ip',
  });
  officeUrl = `${served.baseUrl}/projects/${office.id}`;
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-allowances-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

const floorStatus = (page: Page) => page.getByTestId('space-usage');

/** The shop's claims as the service keeps them. */
function storedClaims(page: Page): Promise<{ id: string; area: string }[]> {
  return page.evaluate(
    async (url) => (await fetch(url)).json() as Promise<{ id: string; area: string }[]>,
    `${shopUrl.replace('/projects/', '/api/projects/')}/additional-allowances`,
  );
}

describe('additional allowances per sales floor', { timeout: 60_000 }, () => {
  it('lists the sales floors and the space over its allowance before any claim', async () => {
    const { page } = browser;
    await page.goto(`${shopUrl}/allowances`);
    await page.getByRole('heading', { name: 'Sales floor' }).waitFor();
    // Only the sales floor is listed: the stockroom is no sales area.
    const floors = page.getByRole('navigation', { name: 'Sales floors' });
    await floors.getByText('No claim · 2,000 ft²').waitFor();
    expect(await floors.getByText('Stockroom').count()).toBe(0);
    // IECC 2021 Table C405.3.2(2) (via PNNL building-energy-standards-data): sales area 1.05 W/ft² × 2,000 ft² = 2,100 W;
    // installed 30 × 40 W + 40 × 25 W = 2,200 W: 100 W over.
    await expect.poll(() => floorStatus(page).textContent()).toContain('Over allowance, 100 W over');
    await page.getByText('Nothing claimed yet.').waitFor();
  });

  it('claims retail area 3 on part of the floor, with the rate, the source and what the display lighting uses', async () => {
    const { page } = browser;
    const form = page.getByRole('form', { name: 'Add a claim' });
    await form.getByRole('combobox', { name: 'Allowance' }).click();
    // The IECC 2021 retail area 3 rate, 1.05 W/ft², is from memory in the reference data (reference/iecc-2021/additional-allowances.json).
    await page.getByRole('option', { name: 'Retail display, retail area 3 · 1.05 W/ft²' }).click();
    await form.getByLabel('Area claimed (ft²)').fill('2500');
    await form.getByRole('button', { name: 'Claim' }).click();
    await form.getByText('At most 2,000 ft², the space’s floor area.').waitFor();
    await form.getByLabel('Area claimed (ft²)').fill('800');
    await form.getByRole('button', { name: 'Claim' }).click();

    const row = page.locator('tr[data-claim="retail-area-3"]');
    await row.waitFor();
    expect(await row.locator('td').nth(0).textContent()).toContain('1.05');
    expect(await row.locator('td').nth(1).textContent()).toContain('800');
    const source = row.getByTestId('claim-source');
    // The rate's source as a short citation, in words that it is not yet checked, with the verify mark.
    expect(await source.textContent()).toContain('IECC 2021 Section C405.3.2.2.1');
    expect(await source.textContent()).toContain('not yet checked against the printed code');
    expect(await source.getByText('verify', { exact: true }).count()).toBe(1);
    // A fresh form for the next claim, without messages for fields not touched yet.
    expect(await page.getByText('Choose an allowance.').count()).toBe(0);
    // 1.05 W/ft² × 800 ft² = 840 W, all of it used by the 1,000 W of display lighting: 2,100 + 840 = 2,940 W against 2,200 W.
    await expect.poll(() => row.locator('td').nth(2).textContent()).toContain('840');
    await expect.poll(() => page.getByTestId('used').textContent()).toContain('840');
    await expect.poll(() => floorStatus(page).textContent()).toContain('Within allowance, 740 W');
    await page.getByText('All 840 W claimed is used, against 1,000 W of display lighting.').waitFor();
    await page.getByRole('navigation', { name: 'Sales floors' }).getByText('1 claim · 2,000 ft²').waitFor();
    await browser.screenshot('allowances-claim');
  });

  it('changes the area, and says what the display lighting cannot use', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Change the claim on Retail display, retail area 3' }).click();
    const form = page.getByRole('form', { name: 'Change the claim' });
    await expect.poll(() => form.getByLabel('Area claimed (ft²)').inputValue()).toBe('800');
    await form.getByLabel('Area claimed (ft²)').fill('1000');
    await form.getByRole('button', { name: 'Save the claim' }).click();
    // 1.05 W/ft² × 1,000 ft² = 1,050 W claimed; the 1,000 W of display lighting caps it (use it or lose it).
    await expect.poll(() => page.getByTestId('used').textContent()).toContain('1,000');
    await page
      .getByText(
        '1,000 W of the 1,050 W claimed is used: the display lighting here is 1,000 W, and the allowance covers display lighting only.',
      )
      .waitFor();
    await expect.poll(() => floorStatus(page).textContent()).toContain('Within allowance, 900 W');
    // Each allowance once per space: retail area 3 is no longer offered.
    await page.getByRole('form', { name: 'Add a claim' }).getByRole('combobox', { name: 'Allowance' }).click();
    await page.getByRole('option', { name: /retail area 1/ }).waitFor();
    expect(await page.getByRole('option', { name: /retail area 3/ }).count()).toBe(0);
    await page.keyboard.press('Escape');
  });

  it('removes the claim, and brings it back with its id on Undo', async () => {
    const { page } = browser;
    const [kept] = await storedClaims(page);
    await page.getByRole('button', { name: 'Remove the claim on Retail display, retail area 3' }).click();
    await page.getByText('No claim on this space yet.').waitFor();
    expect(await storedClaims(page)).toEqual([]);
    await page
      .locator('.mat-mdc-snack-bar-container', { hasText: 'Claim on “Retail display, retail area 3” removed' })
      .getByRole('button', { name: 'Undo' })
      .click();
    const row = page.locator('tr[data-claim="retail-area-3"]');
    await row.waitFor();
    expect(await row.locator('td').nth(1).textContent()).toContain('1,000');
    // As before the removal: 1,000 W of the 1,050 W claimed is used, 900 W within.
    await expect.poll(() => floorStatus(page).textContent()).toContain('Within allowance, 900 W');
    expect((await storedClaims(page)).map((claim) => [claim.id, claim.area])).toEqual([[kept!.id, '1000']]);
    await browser.screenshot('allowances-undo');
  });

  it('removes the claim again, and the space is over its allowance', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Remove the claim on Retail display, retail area 3' }).click();
    await page.getByText('No claim on this space yet.').waitFor();
    await expect.poll(() => floorStatus(page).textContent()).toContain('Over allowance, 100 W over');
    expect(await storedClaims(page)).toEqual([]);
  });

  it('says why there is nothing to claim under the building area method', async () => {
    const { page } = browser;
    await page.goto(`${officeUrl}/allowances`);
    const note = page.getByTestId('method-note');
    await note.waitFor();
    expect(await note.textContent()).toContain('Additional allowances belong to the space-by-space method');
    expect(await page.getByRole('form', { name: 'Add a claim' }).count()).toBe(0);
    await browser.screenshot('allowances-building-area');
  });
});
