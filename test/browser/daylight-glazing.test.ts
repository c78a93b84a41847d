/// <reference lib="dom" />
import type { Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite, signInToDemo } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-glazing-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
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

const reasons = (page: Page) => page.locator('ul.reasons').innerText();
const windowRow = (page: Page, number: number) => page.getByRole('group', { name: `Window ${number}`, exact: true });

async function choose(row: Locator, label: string, option: string): Promise<void> {
  await row.getByLabel(label).click();
  await row.page().getByRole('option', { name: option, exact: true }).click();
}

/** Saves the openings and waits for the recomputed results, not for a timer. */
async function save(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Save openings' }).click();
  await expect.poll(() => page.getByRole('button', { name: 'Save openings' }).isDisabled()).toBe(true);
  await expect.poll(() => page.getByText('Updating results…').count()).toBe(0);
}

describe('the glazing of a window, entered on the Daylight page', { timeout: 120_000 }, () => {
  it('a low transmittance takes the window’s sidelit zone away, a blank that decides is to verify, a blocked window makes no zone', async () => {
    const { page } = browser;
    const demoUrl = await signInToDemo({ browser, served }, 'engineer@alderbay.example', inject('demoPassword'));
    const demoId = demoUrl.split('/').pop()!;
    const projectId = (await api<{ id: string }>(page, 'post', `/api/projects/${demoId}/copy`, { name: 'Alder Bay, glazing' })).id;
    const spaces = await api<{ id: string; name: string }[]>(page, 'get', `/api/projects/${projectId}/spaces`);
    // The staff workroom: 6 × 26 W = 156 W in the primary sidelit zone, two south windows of visible transmittance 0.62 (the demo seed).
    const workroom = spaces.find((space) => space.name === '206 Staff workroom')!;
    await page.goto(`${served.baseUrl}/projects/${projectId}/daylight?space=${workroom.id}`);
    await expect.poll(() => reasons(page)).toContain('Sidelighting: primary sidelit general lighting 156 W');
    expect(await reasons(page)).not.toContain('to verify');
    expect(await windowRow(page, 1).getByLabel('Visible transmittance').inputValue()).toBe('0.62');

    // The service's bound (compliance/bounds.ts ranges.visibleTransmittance): 0 to 1.
    await windowRow(page, 1).getByLabel('Visible transmittance').fill('1.5');
    await page.getByRole('button', { name: 'Save openings' }).click();
    await windowRow(page, 1).locator('mat-error', { hasText: 'Enter a number from 0 to 1.' }).waitFor();

    // IECC 2021 C405.2.4.2 item 5 (from memory): below 0.20 a window makes no sidelit zone. Window 2 left blank decides it.
    await windowRow(page, 1).getByLabel('Visible transmittance').fill('0.1');
    await windowRow(page, 2).getByLabel('Visible transmittance').fill('');
    await save(page);
    await expect
      .poll(() => reasons(page))
      .toContain('window 1 (south wall) has a visible transmittance of 0.1, below 0.2, so it makes no sidelit zone');
    expect(await reasons(page)).toContain('Sidelighting, to verify: the visible transmittance of window 2 (south wall) is not recorded');

    await windowRow(page, 2).getByLabel('Visible transmittance').fill('0.1');
    await save(page);
    await expect.poll(() => reasons(page)).toContain('window 2 (south wall) has a visible transmittance of 0.1, below 0.2');
    expect(await reasons(page)).not.toContain('to verify');
    expect(await page.locator('.zone-card[data-kind="primary-sidelit"] .required').innerText()).toContain(
      'Sidelighting control not required',
    );

    // A blocked window (C405.2.4.2 item 4, from memory) makes no sidelit zone either.
    await windowRow(page, 1).getByLabel('Visible transmittance').fill('0.62');
    await windowRow(page, 2).getByLabel('Visible transmittance').fill('0.62');
    await choose(windowRow(page, 1), 'Blocked by a nearby building', 'Yes');
    await save(page);
    await expect.poll(() => reasons(page)).toContain('window 1 (south wall) is blocked by an adjacent structure');
    expect(await page.locator('.zone-card[data-kind="primary-sidelit"] .required').innerText()).toContain('Sidelighting control required');
    await browser.screenshot('daylight-glazing');
    const stored = await api<{ id: string; windows: { visibleTransmittance?: string; daylightBlocked?: boolean }[] }[]>(
      page,
      'get',
      `/api/projects/${projectId}/spaces`,
    );
    expect(
      stored.find((space) => space.id === workroom.id)!.windows.map((window) => [window.visibleTransmittance, window.daylightBlocked]),
    ).toEqual([
      ['0.62', true],
      ['0.62', false],
    ]);
  });
});
