/// <reference lib="dom" />
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let projectId = '';

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail') await browser.screenshot(`failed-many-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function api<Body>(page: Page, method: 'get' | 'post' | 'patch', url: string, data?: unknown): Promise<Body> {
  const session = (await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string };
  const response = await page.request[method](`${served.baseUrl}${url}`, {
    headers: { 'X-CSRF-Token': session.csrfToken },
    ...(data === undefined ? {} : { data }),
  });
  expect(response.status(), `${method} ${url}: ${await response.text()}`).toBeLessThan(300);
  return (await response.json()) as Body;
}

async function choose(page: Page, label: string, option: string | RegExp): Promise<void> {
  await page.getByTestId('bulk-controls').getByRole('combobox', { name: label }).click();
  await page.getByRole('option', { name: option }).click();
}

const panel = (page: Page) => page.getByTestId('bulk-controls');
const verdict = (page: Page) => page.getByTestId('workspace-verdict');

describe('one control on many spaces', { timeout: 90_000 }, () => {
  it('records the same provided control on the spaces of one level in one step', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('engineer@alderbay.example');
    await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-user').waitFor();
    const projects = await api<{ id: string; name: string }[]>(page, 'get', '/api/projects');
    const demo = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!;
    projectId = (await api<{ id: string }>(page, 'post', `/api/projects/${demo.id}/copy`, { name: 'Alder Bay, sensors everywhere' })).id;

    await page.goto(`${served.baseUrl}/projects/${projectId}/controls`);
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    await panel(page).getByText('Record one control on many spaces').click();
    await choose(page, 'Space type', 'Office — Enclosed');
    await choose(page, 'Level', 'Level 2');
    await expect
      .poll(() => panel(page).locator('.choices li').allInnerTexts())
      .toEqual([
        expect.stringContaining('203 Office'),
        expect.stringContaining('204 Office'),
        expect.stringContaining('205 Office, branch manager'),
      ]);
    await panel(page)
      .getByRole('checkbox', { name: /Select all shown/ })
      .check();
    await expect.poll(() => panel(page).locator('.select-row').innerText()).toContain('3 spaces chosen');

    await choose(page, 'Control', /^Occupant sensor/);
    await panel(page).getByLabel('Device').fill('Dual-technology ceiling sensor');
    await panel(page).getByLabel('Time-out (min)').fill('15');
    await choose(page, 'Turns on', 'Manual on');
    await browser.screenshot('controls-many-chosen');
    await panel(page).getByRole('button', { name: 'Record on 3 spaces' }).click();
    await expect
      .poll(() => panel(page).getByTestId('bulk-done').innerText())
      .toContain('“Occupant sensor” recorded as provided on 3 spaces.');

    // The store and the results follow: each office's card shows what was recorded, the verdict is recomputed.
    await page
      .getByRole('navigation', { name: 'Spaces' })
      .getByRole('button', { name: /205 Office, branch manager/ })
      .click();
    const card = page.locator('al-control-line-card', { has: page.locator('[data-strategy="occupant-sensor"]') });
    await expect.poll(() => card.innerText()).toContain('Provided: Dual-technology ceiling sensor; time-out 15 min; manual on');
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    const spaces = await api<{ name: string; version: number; controls: { strategy: string; device?: string }[] }[]>(
      page,
      'get',
      `/api/projects/${projectId}/spaces`,
    );
    const offices = spaces.filter(
      (space) => space.name.startsWith('203 Office') || space.name.startsWith('204 Office') || space.name.startsWith('205 Office'),
    );
    expect(offices.map((space) => space.controls.find((control) => control.strategy === 'occupant-sensor')?.device)).toEqual(
      Array(3).fill('Dual-technology ceiling sensor'),
    );
  });

  it('names a space someone changed meanwhile, records nothing, and records on Reload and a second try', async () => {
    const { page } = browser;
    // The workspace follows others' writes as they commit, so a stale write needs a page that has
    // not heard of one: here it has lost its change stream, and the service must still refuse.
    await page.route('**/api/projects/*/events', (route) => route.abort());
    await page.goto(`${served.baseUrl}/projects/${projectId}/controls`);
    await panel(page).getByText('Record one control on many spaces').click();
    await choose(page, 'Space type', 'Any type');
    await choose(page, 'Level', 'Any level');
    await panel(page).getByLabel('Find spaces').fill('stair');
    await panel(page)
      .getByRole('checkbox', { name: /Select all shown/ })
      .check();
    await expect.poll(() => panel(page).locator('.select-row').innerText()).toContain('2 spaces chosen');
    await choose(page, 'Control', /^Time-switch control/);
    await panel(page).getByRole('radio', { name: 'Exception claimed' }).check();
    await choose(page, 'Exception', /Interior exit stairway/);

    // Someone else saves Stair B after this page read it.
    const spaces = await api<{ id: string; name: string; version: number }[]>(page, 'get', `/api/projects/${projectId}/spaces`);
    const stairB = spaces.find((space) => space.name === '213 Stair B')!;
    await api(page, 'patch', `/api/projects/${projectId}/spaces/${stairB.id}`, { version: stairB.version, ceilingHeight: '12' });

    await panel(page).getByRole('button', { name: 'Record on 2 spaces' }).click();
    const stale = panel(page).getByTestId('bulk-stale');
    await expect.poll(() => stale.innerText()).toContain('213 Stair B');
    expect(await stale.innerText()).toContain('Nothing was recorded');
    await browser.screenshot('controls-many-stale');
    const unchanged = await api<{ name: string; controls: { strategy: string; exceptionReason?: string }[] }[]>(
      page,
      'get',
      `/api/projects/${projectId}/spaces`,
    );
    expect(
      unchanged.find((space) => space.name === '112 Stair A')!.controls.find((control) => control.strategy === 'time-switch'),
    ).toBeUndefined();

    await stale.getByRole('button', { name: 'Reload' }).click();
    await stale.waitFor({ state: 'detached' });
    await panel(page).getByRole('button', { name: 'Record on 2 spaces' }).click();
    await expect
      .poll(() => panel(page).getByTestId('bulk-done').innerText())
      .toContain('An exception to “Time-switch control” recorded on 2 spaces.');
    const after = await api<{ name: string; controls: { strategy: string; exceptionReason?: string }[] }[]>(
      page,
      'get',
      `/api/projects/${projectId}/spaces`,
    );
    for (const name of ['112 Stair A', '213 Stair B']) {
      expect(
        after.find((space) => space.name === name)!.controls.find((control) => control.strategy === 'time-switch')?.exceptionReason,
        name,
      ).toBe('exit-stairway-ramp-passageway');
    }
    await page.unroute('**/api/projects/*/events');
  });
});
