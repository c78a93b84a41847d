/// <reference lib="dom" />
import type { Locator, Page } from 'playwright-core';
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
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-fields-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function api<Body>(page: Page, method: 'get' | 'post', url: string, data?: unknown): Promise<Body> {
  const session = (await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string };
  const response = await page.request[method](`${served.baseUrl}${url}`, {
    headers: { 'X-CSRF-Token': session.csrfToken },
    ...(data === undefined ? {} : { data }),
  });
  expect(response.status(), `${method} ${url}: ${await response.text()}`).toBeLessThan(300);
  return (await response.json()) as Body;
}

/** Waits until a message beside a field has finished appearing: Material fades errors in. */
async function shownError(scope: Locator, text: string): Promise<Locator> {
  const error = scope.locator('mat-error', { hasText: text });
  await error.waitFor();
  await expect
    .poll(() => error.evaluate((node) => getComputedStyle(node.closest('.mat-mdc-form-field-error-wrapper') ?? node).opacity))
    .toBe('1');
  return error;
}

const card = (page: Page, strategy: string) => page.locator('al-control-line-card', { has: page.locator(`[data-strategy="${strategy}"]`) });
const statusWords = (line: Locator) => line.locator('.status .words').innerText();
const verdict = (page: Page) => page.getByTestId('workspace-verdict');

describe('the design fields the service holds, entered through the pages', { timeout: 120_000 }, () => {
  it('records how far a corridor’s partial-OFF control reduces the lighting, and the requirement follows', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();
    const projects = await api<{ id: string; name: string }[]>(page, 'get', '/api/projects');
    const demo = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!;
    const projectId = (await api<{ id: string }>(page, 'post', `/api/projects/${demo.id}/copy`, { name: 'Alder Bay, control fields' })).id;
    projectUrl = `${served.baseUrl}/projects/${projectId}`;
    const spaces = await api<{ id: string; name: string }[]>(page, 'get', `/api/projects/${projectId}/spaces`);
    const corridor = spaces.find((space) => space.name === '111 Corridor')!;

    await page.goto(`${projectUrl}/controls?space=${corridor.id}`);
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    const partialOff = card(page, 'automatic-partial-off');
    await expect.poll(() => statusWords(partialOff)).toBe('Met');
    expect(await partialOff.locator('.recorded').innerText()).toContain('reduces by 50 %');

    await partialOff.getByRole('button', { name: 'Change what is provided' }).click();
    const reduction = partialOff.getByLabel('Reduces the lighting by (%)');
    expect(await reduction.inputValue()).toBe('50');
    // The service's range for a share of the lighting power (compliance/bounds.ts ranges.percent): 0 to 100.
    await reduction.fill('120');
    await partialOff.getByRole('button', { name: 'Save' }).click();
    await shownError(partialOff, 'Out of range. Enter a number from 0 to 100.');

    // IECC 2021 C405.2.1.4 as the reference data holds it ([S-ed], secondary summaries): a corridor's sensors reduce the lighting by at least 50 % when unoccupied.
    await reduction.fill('30');
    await partialOff.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => statusWords(partialOff)).toBe('Not met');
    expect(await partialOff.locator('.reason').innerText()).toContain('reduces the lighting by 30 %, less than the 50 % required');
    await expect.poll(() => verdict(page).innerText()).toContain('Does not comply');
    await browser.screenshot('control-fields-reduction');

    await partialOff.getByRole('button', { name: 'Change what is provided' }).click();
    await partialOff.getByLabel('Reduces the lighting by (%)').fill('50');
    await partialOff.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => statusWords(partialOff)).toBe('Met');
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
  });

  it('claims continuous operation against the time switch only, in words', async () => {
    const { page } = browser;
    const spaces = await api<{ id: string; name: string }[]>(page, 'get', `/api${new URL(projectUrl).pathname}/spaces`);
    const mechanical = spaces.find((space) => space.name === '214 Mechanical room')!;
    await page.goto(`${projectUrl}/controls?space=${mechanical.id}`);
    const timeSwitch = card(page, 'time-switch');
    await expect.poll(() => statusWords(timeSwitch)).toBe('Met');

    await timeSwitch.getByRole('button', { name: 'Change what is provided' }).click();
    await timeSwitch.getByRole('radio', { name: 'Exception claimed' }).check();
    await timeSwitch.getByRole('combobox', { name: 'Exception' }).click();
    await expect
      .poll(() => page.getByRole('option').allInnerTexts())
      .toEqual([
        'Security or emergency area that must stay lit continuously',
        'Interior exit stairway, exit ramp or exit passageway',
        'Emergency egress lighting that is normally off',
        'Lighting intended to operate continuously',
        'Another exception (say which)',
      ]);
    await page.getByRole('option', { name: 'Lighting intended to operate continuously' }).click();
    await timeSwitch.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => statusWords(timeSwitch)).toBe('Exception claimed');
    expect(await timeSwitch.locator('.recorded').innerText()).toContain('Exception claimed: Lighting intended to operate continuously');
    expect(await timeSwitch.locator('.reason').innerText()).toContain('lighting intended for continuous operation');
    await browser.screenshot('control-fields-continuous');
  });

  it('chooses a jurisdiction amendment in the set-up, names it on the Results page, and drops it with a change of edition', async () => {
    const { page } = browser;
    await page.goto(`${projectUrl}/results`);
    const basis = page.getByTestId('results-amendments');
    await expect.poll(() => basis.innerText()).toContain('Model code only: no jurisdiction amendment is applied.');

    await page.goto(`${projectUrl}/setup`);
    const amendments = page.getByRole('combobox', { name: 'Jurisdiction amendments' });
    await expect.poll(() => amendments.innerText()).toContain('Model code only');
    await amendments.click();
    // reference/iecc-2021/amendments.json: Washington's amendments to IECC 2021 (WAC 51-11C-405024).
    await page.getByRole('option', { name: /Washington State Energy Code 2021 .* · Washington State/ }).click();
    await page.keyboard.press('Escape');
    await expect.poll(() => amendments.innerText()).toContain('Washington State Energy Code 2021');
    const save = page.getByRole('button', { name: 'Save set-up' });
    await save.click();
    await expect.poll(() => save.isDisabled()).toBe(true);

    await page.goto(`${projectUrl}/results`);
    await expect
      .poll(() => basis.innerText())
      .toContain('Jurisdiction amendment applied over the model code: Washington State Energy Code 2021');
    await browser.screenshot('control-fields-amendment-results');

    await page.goto(`${projectUrl}/setup`);
    await expect.poll(() => amendments.innerText()).toContain('Washington State Energy Code 2021');
    await page.getByRole('combobox', { name: 'Code edition' }).click();
    await page.getByRole('option', { name: 'ANSI/ASHRAE/IES Standard 90.1-2019' }).click();
    const dropped = page.getByTestId('dropped-amendments');
    await expect
      .poll(() => dropped.innerText())
      .toContain('Dropped with the change of edition, which does not have it: Washington State Energy Code 2021');
    await browser.screenshot('control-fields-amendment-dropped');
    await page.getByRole('button', { name: 'Discard changes' }).click();
    await expect.poll(() => amendments.innerText()).toContain('Washington State Energy Code 2021');
  });

  it('enters like rooms on one space, checks the size its type names per room in m², and the table says so', async () => {
    const { page } = browser;
    // An invented SI project under an edition whose space types carry sizes (90.1-2019 Table 9.6.1, via PNNL building-energy-standards-data).
    const created = await api<{ id: string }>(page, 'post', '/api/projects', {
      name: 'Heron Hall annex',
      edition: 'ashrae-90.1-2019',
      method: 'space-by-space',
      units: 'si',
      lightingZone: 2,
    });
    await page.goto(`${served.baseUrl}/projects/${created.id}/spaces`);
    await page.getByRole('button', { name: 'Add space' }).click();
    const dialog = page.getByRole('dialog');
    await expect.poll(() => dialog.getByLabel('Name', { exact: true }).evaluate((field) => field === document.activeElement)).toBe(true);
    await dialog.getByLabel('Name', { exact: true }).fill('Staff offices');
    await dialog.getByLabel(/Floor area/).fill('60');
    await dialog.getByRole('combobox', { name: 'Space type' }).fill('enclosed');
    // 250 ft² × 0.09290304 m²/ft² (exact) = 23.2 m².
    await page.getByRole('option', { name: /Enclosed and ≤ 23\.2 m²/ }).click();
    await dialog.getByRole('button', { name: 'Add space' }).click();
    const refused = await shownError(dialog, 'is for spaces at most 23.2 m²; this one is 60 m².');
    expect(await refused.innerText()).not.toContain('ft²');
    await browser.screenshot('control-fields-rooms-refused');

    // Three offices of 20 m² each fit the row.
    await dialog.getByLabel('Like rooms', { exact: true }).fill('3');
    await dialog.getByRole('button', { name: 'Add space' }).click();
    await dialog.waitFor({ state: 'detached' });
    const row = page.getByRole('row', { name: /Staff offices/ });
    await expect.poll(() => row.innerText()).toContain('Staff offices × 3 rooms');
    // The project now evaluates: the entry waits only for its luminaires.
    await expect.poll(() => row.innerText()).toContain('No luminaires entered');
    await browser.screenshot('control-fields-rooms');
  });
});
