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

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
}

async function choose(page: Page, label: string, option: string | RegExp): Promise<void> {
  await page.getByRole('combobox', { name: label }).click();
  await page.getByRole('option', { name: option }).click();
}

/** The Next button of one step: the stepper keeps every step's content in the page, the others hidden. */
const next = (page: Page, step: string) => page.getByRole('region', { name: step }).getByRole('button', { name: 'Next' });

describe('a new project with its permit details and location', { timeout: 60_000 }, () => {
  it('says beside the field what the wizard’s Next is missing', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@alderbay.example');
    await page.getByRole('link', { name: 'New project' }).click();
    await page.waitForURL(/\/projects\/new/);
    await next(page, 'Project and permit').click();
    await page.getByText('Project name is required.').waitFor();
    await browser.screenshot('wizard-missing-name');

    // An invented fire station, its permit and its owner.
    await page.getByLabel('Project name', { exact: true }).fill('Alder Bay Fire Station 2');
    await page.getByLabel('Permit or application number').fill('BP-2026-0417');
    await page.getByLabel('Owner').fill('Town of Alder Bay');
    await next(page, 'Project and permit').click();
    await page.getByLabel('Time zone', { exact: true }).waitFor();
  });

  it('finds the time zone by words and reads coordinates in degrees and minutes, warning of a flipped longitude', async () => {
    const { page } = browser;
    await page.getByLabel('Time zone', { exact: true }).fill('pacific');
    await page.getByRole('option', { name: /^Los Angeles \(America\) — Pacific Time/ }).click();
    // Worked by hand (common practice): 47° 02′ 24″ N = 47.04°; 122° 54′ = 122.9°, the demo's invented site (NAMES.md).
    await page.getByLabel('Latitude').fill('47°02′24″N');
    await page.getByLabel('Longitude').fill('122 54 E');
    await page.getByLabel('Latitude').click();
    // America/Los_Angeles keeps UTC−8 as standard time (IANA tz database): 8 h × 15° per hour = 120° W.
    const check = page.getByTestId('site-check');
    await check.getByText('The longitude may have the wrong sign').waitFor();
    expect(await check.textContent()).toContain('did you mean −122.9?');
    expect(await page.getByLabel('Longitude').inputValue()).toBe('122.9');
    await browser.screenshot('wizard-location-warning');

    await page.getByLabel('Longitude').fill('122 54 W');
    await page.getByText('122.9° W: saved as −122.9').waitFor();
    await page.getByLabel('Latitude').click();
    await expect.poll(() => page.getByLabel('Longitude').inputValue()).toBe('-122.9');
    expect(await page.getByLabel('Latitude').inputValue()).toBe('47.04');
    await check.waitFor({ state: 'detached' });
    await next(page, 'Location').click();
  });

  it('keeps the building and people fields, with the plausible range beside the floor area', async () => {
    const { page } = browser;
    await page.getByLabel('Jurisdiction', { exact: true }).fill('Alder Bay Building Department');
    await choose(page, 'Code edition', /International Energy Conservation Code 2021/);
    await choose(page, 'Compliance method', 'Space-by-space method');
    await next(page, 'Jurisdiction, edition, method and units').click();

    await page.getByLabel('Building occupancy or use').fill('Fire station (business with apparatus bays)');
    await choose(page, 'Scope of work', 'New building');
    await page.getByLabel('Gross floor area (ft²)').fill('99999999999');
    await next(page, 'Building').click();
    // The service's range for floor areas (compliance/bounds.ts).
    await page.getByText('Out of range. Enter a number greater than 0 and at most 5,000,000.').waitFor();
    await page.getByLabel('Gross floor area (ft²)').fill('9600');
    await next(page, 'Building').click();

    await page.getByRole('radio', { name: /Zone 2/ }).check();
    await next(page, 'Exterior lighting zone').click();

    // Invented people and licence numbers.
    const designer = page.getByRole('group', { name: 'Designer of record' });
    await designer.getByLabel('Name').fill('Ines Halvorsen');
    await designer.getByLabel('Firm').fill('Halvorsen Lighting Design');
    await designer.getByLabel('Licence number').fill('PE-48213');
    const contractor = page.getByRole('group', { name: 'Electrical contractor' });
    await contractor.getByLabel('Name').fill('Noor Abernathy');
    await contractor.getByLabel('Firm').fill('Abernathy Electric');
    await contractor.getByLabel('Licence number').fill('EC-7731');
    await contractor.getByLabel('Contact').fill('noor@abernathy.example');
    await next(page, 'Designer of record and contractor').click();

    await page.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}\/spaces/);
    projectUrl = page.url().replace(/\/spaces$/, '');
  });

  it('shows every set-up field again on the Set-up page, as stored', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/setup`);
    await expect.poll(() => page.getByLabel('Project name', { exact: true }).inputValue()).toBe('Alder Bay Fire Station 2');
    expect(await page.getByLabel('Permit or application number').inputValue()).toBe('BP-2026-0417');
    expect(await page.getByLabel('Owner').inputValue()).toBe('Town of Alder Bay');
    expect(await page.getByLabel('Time zone', { exact: true }).inputValue()).toBe('Los Angeles (America) — Pacific Time, UTC−8');
    expect(await page.getByLabel('Latitude').inputValue()).toBe('47.04');
    expect(await page.getByLabel('Longitude').inputValue()).toBe('-122.9');
    expect(await page.getByLabel('Gross floor area (ft²)').inputValue()).toBe('9600');
    expect(await page.getByRole('combobox', { name: 'Scope of work' }).textContent()).toContain('New building');
    expect(await page.getByRole('group', { name: 'Designer of record' }).getByLabel('Licence number').inputValue()).toBe('PE-48213');
    expect(await page.getByRole('group', { name: 'Electrical contractor' }).getByLabel('Contact').inputValue()).toBe(
      'noor@abernathy.example',
    );

    const stored = await page.evaluate(async (url) => (await fetch(url)).json(), projectUrl.replace('/projects/', '/api/projects/'));
    expect(stored).toMatchObject({
      latitude: '47.04',
      longitude: '-122.9',
      timeZone: 'America/Los_Angeles',
      scope: 'new-building',
      grossFloorArea: '9600',
      designerFirm: 'Halvorsen Lighting Design',
    });

    await page.getByLabel('Owner').fill('Alder Bay Fire District');
    await page.getByRole('button', { name: 'Save set-up' }).click();
    await page.getByRole('progressbar', { name: 'Saving the set-up' }).waitFor({ state: 'detached' });
    await expect.poll(() => page.getByRole('button', { name: 'Save set-up' }).isDisabled()).toBe(true);
    await page.reload();
    await expect.poll(() => page.getByLabel('Owner').inputValue()).toBe('Alder Bay Fire District');
    await browser.screenshot('setup-permit-fields');
  });
});

describe('copying a project', { timeout: 60_000 }, () => {
  it('copies from the workspace under the name the engineer gives, and opens the copy', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Copy project' }).click();
    const dialog = page.getByRole('dialog');
    const name = dialog.getByLabel('Name of the copy');
    await expect.poll(() => name.inputValue()).toBe('Alder Bay Fire Station 2 (copy)');
    await name.fill('');
    await dialog.getByRole('button', { name: 'Copy and open' }).click();
    await dialog.getByText('Give the copy a name.').waitFor();
    await name.fill('Alder Bay Fire Station 3');
    await browser.screenshot('copy-dialog');
    await dialog.getByRole('button', { name: 'Copy and open' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('heading', { name: 'Alder Bay Fire Station 3' }).waitFor();
    expect(page.url()).not.toContain(projectUrl);
    await page.getByRole('link', { name: 'Set-up' }).click();
    await expect.poll(() => page.getByLabel('Permit or application number').inputValue()).toBe('BP-2026-0417');
  });

  it('copies the demo from the projects list with its spaces, as a draft of the person copying', async () => {
    const { page } = browser;
    await signIn(page, 'reviewer@alderbay.example');
    await page.getByRole('table', { name: 'Your projects' }).waitFor();
    await page.getByRole('button', { name: 'Copy Alder Bay Library & Makerspace' }).click();
    const dialog = page.getByRole('dialog');
    await expect.poll(() => dialog.getByLabel('Name of the copy').inputValue()).toBe('Alder Bay Library & Makerspace (copy)');
    await dialog.getByRole('button', { name: 'Copy and open' }).click();
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}\/spaces/);
    await page.getByRole('heading', { name: 'Alder Bay Library & Makerspace (copy)' }).waitFor();
    // The seeded demo's 29 spaces; the reviewer of the original is the engineer of the copy.
    await page.getByText('29 spaces').waitFor();
    await page.getByRole('button', { name: 'Add space' }).waitFor();
    await page.getByRole('link', { name: 'Spaces' }).waitFor();
    expect(await page.locator('.project-heading').textContent()).toContain('Draft');
  });
});
