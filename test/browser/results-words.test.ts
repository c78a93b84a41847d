/// <reference lib="dom" />
import type { Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Served } from '../support/browser.js';
import { closeBrowserSuite, openBrowserSuite } from '../support/browser-suite.js';
import type { TestDatabase } from '../support/database.js';

let database: TestDatabase;
let served: Served;
let browser: Browser;
let demoId = '';

beforeAll(async () => {
  ({ database, served, browser } = await openBrowserSuite());
  browser.page.setDefaultTimeout(10_000);
});

afterEach(async (context) => {
  if (context.task.result?.state === 'fail')
    await browser.screenshot(`failed-words-${context.task.name.slice(0, 24).replace(/\W+/g, '-')}`);
});

afterAll(() => closeBrowserSuite({ browser, served, database }));

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto(`${served.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(inject('demoPassword'));
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-user').waitFor();
}

async function api<Body>(page: Page, method: 'get' | 'post' | 'patch' | 'put', url: string, data?: unknown): Promise<Body> {
  const session = (await (await page.request.get(`${served.baseUrl}/api/auth/me`)).json()) as { csrfToken: string };
  const response = await page.request[method](`${served.baseUrl}${url}`, {
    headers: { 'X-CSRF-Token': session.csrfToken },
    ...(data === undefined ? {} : { data }),
  });
  expect(response.status(), `${method} ${url}: ${await response.text()}`).toBeLessThan(300);
  return (await response.json()) as Body;
}

/** A copy of the demo to change, so each test starts from the seeded design. */
async function demoCopy(page: Page, name: string): Promise<string> {
  return (await api<{ id: string }>(page, 'post', `/api/projects/${demoId}/copy`, { name })).id;
}

async function setup(page: Page, projectId: string, changes: Record<string, unknown>): Promise<void> {
  const { version } = await api<{ version: number }>(page, 'get', `/api/projects/${projectId}`);
  await api(page, 'patch', `/api/projects/${projectId}`, { version, ...changes });
}

const verdict = (page: Page) => page.getByTestId('workspace-verdict');
const text = (page: Page, selector: string) => page.locator(selector).innerText();

describe('results in words', { timeout: 90_000 }, () => {
  it('lists exterior controls as the reason a design does not comply, each application linked to the Exterior page', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@alderbay.example');
    const projects = await api<{ id: string; name: string }[]>(page, 'get', '/api/projects');
    demoId = projects.find((project) => project.name === 'Alder Bay Library & Makerspace')!.id;
    const projectId = await demoCopy(page, 'Alder Bay, exterior controls off');
    // The parking lot's daylight shutoff is no longer recorded: only an exterior control fails.
    const applications = await api<
      {
        id: string;
        key: string;
        version: number;
        description: string;
        quantity: string;
        installedWatts: string;
        controls: { strategy: string }[];
      }[]
    >(page, 'get', `/api/projects/${projectId}/exterior-applications`);
    const parking = applications.find((application) => application.key === 'parking-lots-and-drives')!;
    const { id, version, key, description, quantity, installedWatts, controls } = parking;
    await api(page, 'put', `/api/projects/${projectId}/exterior-applications/${id}`, {
      key,
      description,
      quantity,
      installedWatts,
      version,
      controls: controls.filter((control) => control.strategy !== 'exterior-daylight-off'),
    });

    await page.goto(`${served.baseUrl}/projects/${projectId}/results`);
    await expect.poll(() => verdict(page).innerText()).toContain('Does not comply');
    expect(await verdict(page).innerText()).toContain('Exterior controls');
    const reasons = page.getByTestId('verdict-reasons');
    await reasons.waitFor();
    expect(await text(page, '[data-testid="results-verdict"] .verdict')).toContain('Does not comply: 1 reason');
    expect(await text(page, '[data-testid="results-verdict"]')).not.toContain('0 control requirements');
    const reason = reasons.locator('li[data-kind="exterior-controls"]');
    expect(await reason.innerText()).toContain('Parking lots and drives: Exterior daylight shutoff not met');
    await browser.screenshot('results-exterior-controls');
    await reason.getByRole('link', { name: /Parking lots and drives/ }).click();
    await page.waitForURL(/\/exterior$/);
    await page.getByTestId('tradable-table').waitFor();
  });

  it('holds the verdict back for a space without luminaires, and lets the engineer confirm it unlit', async () => {
    const { page } = browser;
    const projectId = await demoCopy(page, 'Alder Bay, a new closet');
    await api(page, 'post', `/api/projects/${projectId}/spaces`, {
      name: '216 Riser closet',
      level: 'Level 2',
      spaceType: 'storage-room',
      area: '40',
      luminaires: [],
      controls: [],
      windows: [],
      skylights: [],
    });

    await page.goto(`${served.baseUrl}/projects/${projectId}/spaces`);
    await expect.poll(() => verdict(page).innerText()).toContain('Design incomplete');
    // The new space is the last row: scroll the list to it (only the rows in view are drawn).
    await page.locator('cdk-virtual-scroll-viewport').evaluate((viewport) => viewport.scrollTo({ top: viewport.scrollHeight }));
    const row = page.locator('[data-space-id]', { hasText: '216 Riser closet' });
    await expect.poll(() => row.innerText()).toContain('No luminaires entered');
    expect(await row.innerText()).not.toContain('to spare');

    await page.getByRole('link', { name: 'Results' }).click();
    const open = page.getByTestId('open-items');
    await open.waitFor();
    expect(await text(page, '[data-testid="results-verdict"] .verdict')).toContain('Design incomplete');
    expect(await open.innerText()).toContain('216 Riser closet');
    const tableRow = page.locator('tr.mat-mdc-row', { hasText: '216 Riser closet' });
    expect(await tableRow.innerText()).toContain('No luminaires entered');
    expect(await tableRow.innerText()).not.toContain('100.0');
    await browser.screenshot('results-incomplete');
    await open.getByRole('button', { name: 'Confirm 216 Riser closet is unlit' }).click();
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    await expect.poll(() => tableRow.innerText()).toContain('Unlit (confirmed)');
  });

  it('shows each problem that stops the results in words, linked to the space and the field to fix', async () => {
    const { page } = browser;
    const projectId = await demoCopy(page, 'Alder Bay, by building area');
    // The demo's spaces have space types but no building area types yet.
    await setup(page, projectId, { method: 'building-area' });
    await page.goto(`${served.baseUrl}/projects/${projectId}/results`);
    const problems = page.getByTestId('results-problems');
    await problems.waitFor();
    const words = await problems.innerText();
    expect(words).toContain('Building area type: The building area method needs a building area type for every space.');
    expect(words).toContain('101 Entry lobby');
    expect(words).not.toMatch(/spaces\.\d|buildingAreaType|not valid/);
    await browser.screenshot('results-problems');
    await problems.getByRole('link', { name: '101 Entry lobby' }).click();
    await page.waitForURL(/\/spaces(\?|$)/);
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    expect(await dialog.getByLabel('Name').inputValue()).toBe('101 Entry lobby');
  });

  it('cites unverified values in words, with the full note on demand and none of the data’s markers', async () => {
    const { page } = browser;
    await page.goto(`${served.baseUrl}/projects/${demoId}/results`);
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    const unverified = page.locator('ul.unverified');
    const listed = await unverified.innerText();
    // IECC 2021 C405.2.2: the reference data follows Washington's state text (WAC 51-11C-405022).
    expect(listed).toContain('Source: IECC 2021 Section C405.2.2 — Washington state text standing in for the model code');
    expect(listed).toMatch(/not yet checked against the printed code/);
    expect(listed).not.toMatch(/\[(S|S-ed|I|M)\]|FLAG:|source annotation|SOURCES\.md|github:|https?:\/\/|from memory/i);
    const badge = unverified.locator('li', { hasText: 'Time-switch control' }).locator('.badge');
    await badge.hover();
    const tooltip = page.locator('.al-source-note');
    await tooltip.waitFor();
    expect(await tooltip.innerText()).toContain('Time-switch controls in spaces without occupant sensors');
    await browser.screenshot('results-source-note');

    await page.goto(`${served.baseUrl}/projects/${demoId}/controls`);
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    await expect.poll(() => page.getByTestId('unverified-count').innerText()).toMatch(/\d+ values? on this page/);
  });

  it('fits the by-space table at 1280 px, with margin and status in view', async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.goto(`${served.baseUrl}/projects/${demoId}/results`);
    await expect.poll(() => verdict(page).innerText()).toContain('Complies');
    const scroller = page.locator('al-space-results-table .scroller');
    await scroller.locator('tr.mat-mdc-row').first().waitFor();
    const frame = (await scroller.boundingBox())!;
    for (const header of ['Margin (W)', 'Margin (%)', 'Status']) {
      const box = (await scroller.locator('th', { hasText: header }).first().boundingBox())!;
      expect(box.x + box.width, header).toBeLessThanOrEqual(frame.x + frame.width + 1);
    }
    await browser.screenshot('results-by-space-1280');
  });

  it('speaks SI on every page of an SI project: no feet anywhere the product writes', async () => {
    const { page } = browser;
    const projectId = await demoCopy(page, 'Alder Bay, in metres');
    await setup(page, projectId, { units: 'si' });
    // What the engineer typed stays as typed (the demo's descriptions name "8 ft" runs); only the product's words must be SI.
    const types = await api<{ description: string }[]>(page, 'get', `/api/projects/${projectId}/luminaire-types`);
    const exterior = await api<{ description: string }[]>(page, 'get', `/api/projects/${projectId}/exterior-applications`);
    const typed = [...types, ...exterior].map((entry) => entry.description).filter(Boolean);
    const feet = /\d\s*(ft|feet|foot)\b|ft²|ft2|W\/ft|\bper (linear )?f(oo|ee)t\b|\blinear ft\b|\bfeet\b/;
    for (const area of ['setup', 'spaces', 'luminaires', 'controls', 'daylight', 'exterior', 'results', 'history']) {
      await page.goto(`${served.baseUrl}/projects/${projectId}/${area}`);
      await expect.poll(() => verdict(page).innerText()).toContain('Complies');
      if (area === 'history') await page.locator('.entry').first().waitFor();
      if (area === 'controls') await page.locator('al-control-line-card').first().waitFor();
      if (area === 'exterior') await page.getByTestId('tradable-table').waitFor();
      const shown = await page.locator('.area').evaluate((area) => {
        const copy = area.cloneNode(true) as HTMLElement;
        // The choice between IP and SI names the IP units it offers.
        copy.querySelectorAll('.units').forEach((choice) => choice.remove());
        return copy.innerText || copy.textContent || '';
      });
      const left = typed.reduce((words, description) => words.split(description).join(''), shown);
      const found = left.split('\n').filter((line) => feet.test(line));
      expect(found, area).toEqual([]);
      if (area === 'exterior') await browser.screenshot('si-exterior');
    }
    // The control card's zone size limit reads in m² (5,000 ft² = 464.5 m², 1 ft² = 0.09290304 m² exactly). A lobby is not
    // on the IECC 2021 C405.2.1 occupant-sensor list, so it needs time-switch control (C405.2.2).
    const spaces = await api<{ id: string; name: string }[]>(page, 'get', `/api/projects/${projectId}/spaces`);
    const lobby = spaces.find((space) => space.name === '101 Entry lobby')!;
    await page.goto(`${served.baseUrl}/projects/${projectId}/controls?space=${lobby.id}`);
    const card = page.locator('al-control-line-card', { has: page.locator('[data-strategy="time-switch"]') });
    await card.getByRole('button', { name: /what is provided/ }).click();
    await expect.poll(() => card.innerText()).toContain('At most 464.5 m² per device');
    expect(await card.innerText()).not.toContain('ft²');
    await browser.screenshot('si-control-card');
  });
});
