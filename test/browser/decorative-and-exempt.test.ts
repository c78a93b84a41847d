/// <reference lib="dom" />
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite, signInToDemo } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';
import { seriousViolations } from '../support/axe.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let hallUrl = '';
let depotUrl = '';

/** Writes through the API as the signed-in engineer: the set-up the pages under test stand on. */
async function post(page: Page, url: string, data: unknown): Promise<{ id: string }> {
  const csrf = ((await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string }).csrfToken;
  const response = await page.request.post(`${served.baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data });
  expect(response.status(), url).toBe(201);
  return (await response.json()) as { id: string };
}

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  const { page } = browser;
  page.setDefaultTimeout(10_000);
  await signInToDemo({ browser, served }, 'engineer@alderbay.example', inject('demoPassword'));

  // An invented meeting hall under 90.1-2022: a 400 ft² room with ten 30 W general luminaires and two 25 W decorative pendants (invented wattages).
  const hall = await post(page, '/api/projects', {
    name: 'Quayside Hall',
    edition: 'ashrae-90.1-2022',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  await post(page, `/api/projects/${hall.id}/luminaire-types`, {
    tag: 'G',
    description: 'LED downlight',
    inputWatts: '30',
    use: 'general',
  });
  await post(page, `/api/projects/${hall.id}/luminaire-types`, {
    tag: 'P',
    description: 'Glass pendant',
    inputWatts: '25',
    use: 'decorative',
  });
  await post(page, `/api/projects/${hall.id}/spaces`, {
    name: 'Meeting room',
    spaceType: 'conference-meeting-multipurpose-rooms',
    area: '400',
    luminaires: [
      { tag: 'G', count: '10' },
      { tag: 'P', count: '2' },
    ],
  });
  hallUrl = `${served.baseUrl}/projects/${hall.id}`;

  // An invented depot under IECC 2021, zone 2, with one space confirmed unlit: only its exterior is looked at.
  const depot = await post(page, '/api/projects', {
    name: 'Quayside Depot',
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    lightingZone: 2,
  });
  await post(page, `/api/projects/${depot.id}/spaces`, { name: 'Store', spaceType: 'lobby-otherwise', area: '400', unlit: true });
  depotUrl = `${served.baseUrl}/projects/${depot.id}`;
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-decorative-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

describe('decorative allowance and exempt exterior lighting, through the pages', { timeout: 90_000 }, () => {
  it('claims the decorative allowance on a meeting room, and only its decorative lighting uses it', async () => {
    const { page } = browser;
    await page.goto(`${hallUrl}/allowances`);
    await page.getByTestId('decorative-lead').waitFor();
    await page.getByRole('navigation', { name: 'Spaces' }).getByText('No claim · 400 ft²').waitFor();
    const form = page.getByRole('form', { name: 'Add a claim' });
    await form.getByRole('combobox', { name: 'Allowance' }).click();
    // 90.1-2022 §9.5.2.2(a), 0.75 W/ft²: from memory (reference/ashrae-90.1-2022/additional-allowances.json). Retail display is not offered off a sales floor.
    await page.getByRole('option', { name: 'Decorative lighting · 0.75 W/ft²' }).click();
    expect(await page.getByRole('option', { name: /Retail display/ }).count()).toBe(0);
    await form.getByText('The floor area of the space, at most 400 ft²').waitFor();
    await form.getByLabel('Area claimed (ft²)').fill('500');
    await form.getByRole('button', { name: 'Claim' }).click();
    await form.getByText('At most 400 ft², the space’s floor area.').waitFor();
    await form.getByLabel('Area claimed (ft²)').fill('400');
    await form.getByRole('button', { name: 'Claim' }).click();

    const row = page.locator('tr[data-claim="decorative"]');
    await row.waitFor();
    expect(await row.getByTestId('claim-source').getByText('verify', { exact: true }).count()).toBe(1);
    // 0.75 × 400 = 300 W claimed; the two pendants, 2 × 25 = 50 W, use 50 W of it and the rest is lost.
    await expect.poll(() => page.getByTestId('used').textContent()).toContain('50');
    await page
      .getByText(
        '50 W of the 300 W claimed is used: the decorative lighting here is 50 W, and the allowance covers decorative lighting only.',
      )
      .waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    await page.goto(`${hallUrl}/results`);
    const claims = page.getByTestId('additional-allowances');
    await claims.getByText('Meeting room: Decorative lighting, 50 W used of 300 W claimed').waitFor();
    await claims.getByText(/cannot be traded to other lighting \(ASHRAE 90\.1-2022 §9\.5\.2\.2\(a\)\)/).waitFor();
    await page.getByText('Additional allowance: Decorative lighting').waitFor();
    await browser.screenshot('results-decorative');
  });

  it('records exempt exterior lighting with its reason, leaves it out of the installed total, and says it is to verify', async () => {
    const { page } = browser;
    await page.goto(`${depotUrl}/exterior`);
    await page.getByRole('button', { name: 'Add an exterior application' }).click();
    const form = page.getByRole('form', { name: 'Add an exterior application' });
    // The form opens in a long page: bring it into view first, so the list of applications opens beside it.
    const application = form.getByRole('combobox', { name: 'Application' });
    await application.scrollIntoViewIfNeeded();
    await application.click();
    await page.getByRole('option', { name: 'Parking lots and drives · tradable' }).click();
    await form.getByLabel('Quantity (ft²)').fill('20000');
    await form.getByLabel('Installed (W)').fill('1500');
    await form.getByText('Part of this lighting is exempt from the exterior allowance').click();
    await form.getByLabel('Exempt (W)').fill('600');
    await form.getByRole('button', { name: 'Add application' }).click();
    await form.getByText('Choose the reason it is exempt.').waitFor();
    await form.getByTestId('exemption-verify').getByText('was not found in a public source').waitFor();
    await form.getByRole('combobox', { name: 'Reason it is exempt' }).click();
    // IECC 2021 C405.5.1 exceptions: from memory (contract/editions.ts).
    await page.getByRole('option', { name: 'Lighting of athletic playing areas · section C405.5.1 exception' }).click();
    await form.getByLabel('Note').fill('Court lights on their own switch');
    expect(await seriousViolations(page)).toEqual([]);
    await form.getByRole('button', { name: 'Add application' }).click();

    const line = page.locator('tr[data-key="parking-lots-and-drives"]');
    await line
      .getByTestId('exempt-line')
      .getByText('Exempt, not counted: 600 W, Lighting of athletic playing areas (section C405.5.1 exception), to verify')
      .waitFor();
    // 1,500 W installed less the 600 W exempt: 900 W counted against the allowance.
    await expect.poll(() => line.locator('td').nth(3).textContent()).toContain('900');
    await page.getByText('Exempt (not counted)').waitFor();

    await page.goto(`${depotUrl}/results`);
    const exempt = page.getByTestId('exempt-exterior');
    await exempt.getByText('Parking lots and drives: 600 W exempt').waitFor();
    await exempt.getByText('Lighting of athletic playing areas, section C405.5.1 exception: Court lights on their own switch').waitFor();
    await page.getByText('Exterior exemption: Lighting of athletic playing areas').waitFor();
    expect(await seriousViolations(page)).toEqual([]);
  });
});
